import { TestBed } from '@angular/core/testing';
import { ThemeChoice } from './theme-choice';

describe('ThemeChoice', () => {
  const root = document.documentElement;

  beforeEach(() => {
    localStorage.removeItem('keyloom.theme');
    root.classList.remove('light-theme', 'dark-theme');
  });

  afterEach(() => {
    localStorage.removeItem('keyloom.theme');
    root.classList.remove('light-theme', 'dark-theme');
  });

  it('follows the system until a theme is chosen, setting no class of its own', () => {
    const themes = TestBed.inject(ThemeChoice);
    TestBed.tick();
    expect(themes.theme()).toBe(
      matchMedia('(prefers-color-scheme: dark)').matches ? 'dark' : 'light',
    );
    expect(
      root.classList.contains('light-theme') || root.classList.contains('dark-theme'),
    ).toBeFalse();
  });

  it('switches to the other theme, marks <html> and remembers the choice', () => {
    const themes = TestBed.inject(ThemeChoice);
    const before = themes.theme();
    themes.toggle();
    TestBed.tick();
    const after = before === 'dark' ? 'light' : 'dark';
    expect(themes.theme()).toBe(after);
    expect(root.classList).toContain(`${after}-theme`);
    expect(localStorage.getItem('keyloom.theme')).toBe(after);
  });

  it('starts from a remembered choice', () => {
    localStorage.setItem('keyloom.theme', 'dark');
    const themes = TestBed.inject(ThemeChoice);
    TestBed.tick();
    expect(themes.theme()).toBe('dark');
    expect(root.classList).toContain('dark-theme');
  });
});
