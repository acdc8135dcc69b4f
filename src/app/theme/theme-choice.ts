import { DOCUMENT } from '@angular/common';
import { Injectable, computed, effect, inject, signal } from '@angular/core';

type Theme = 'light' | 'dark';

const storageKey = 'keyloom.theme';

function storedTheme(): Theme | null {
  try {
    const stored = localStorage.getItem(storageKey);
    return stored === 'light' || stored === 'dark' ? stored : null;
  } catch {
    return null;
  }
}

/**
 * Light or dark: the system's choice until the member picks one, which is remembered in this
 * browser. Sets `light-theme` or `dark-theme` on <html>, which styles.scss turns into the palette.
 */
@Injectable({ providedIn: 'root' })
export class ThemeChoice {
  private readonly root = inject(DOCUMENT).documentElement;
  private readonly systemQuery = matchMedia('(prefers-color-scheme: dark)');
  private readonly chosen = signal<Theme | null>(storedTheme());
  private readonly system = signal<Theme>(this.systemQuery.matches ? 'dark' : 'light');
  readonly theme = computed(() => this.chosen() ?? this.system());

  constructor() {
    this.systemQuery.addEventListener('change', (change) =>
      this.system.set(change.matches ? 'dark' : 'light'),
    );
    effect(() => {
      const chosen = this.chosen();
      this.root.classList.toggle('light-theme', chosen === 'light');
      this.root.classList.toggle('dark-theme', chosen === 'dark');
    });
  }

  toggle(): void {
    const next: Theme = this.theme() === 'dark' ? 'light' : 'dark';
    this.chosen.set(next);
    try {
      localStorage.setItem(storageKey, next);
    } catch {
      // A browser that keeps nothing still switches for this visit.
    }
  }
}
