import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatMenuItemHarness } from '@angular/material/menu/testing';
import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { LayoutEditor } from './layout-editor';

describe('LayoutEditor', () => {
  /** The editor, with the starting design on consecutive keys (one click) unless it is to stay on its nearest keys. */
  async function render(nearestKeys = false) {
    TestBed.configureTestingModule({ imports: [LayoutEditor], providers: [DesignState] });
    if (!nearestKeys) TestBed.inject(DesignState).useConsecutiveKeys();
    const fixture = TestBed.createComponent(LayoutEditor);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const keys = () => Array.from(element.querySelectorAll<HTMLButtonElement>('button.layout-key'));
    return { fixture, element, keys, state: TestBed.inject(DesignState) };
  }

  it('starts seven degrees on their nearest keys, says so, and keeps one degree per key a click away', async () => {
    const { fixture, element, keys, state } = await render(true);
    expect(keys().length).toBe(12);
    expect(keys().map((key) => key.textContent?.replace(/\s+/g, ''))).toEqual([
      'C40',
      'C#4–',
      'D41',
      'D#4–',
      'E42',
      'F43',
      'F#4–',
      'G44',
      'G#4–',
      'A45',
      'A#4–',
      'B46',
    ]);
    expect(element.querySelector('.notice')?.textContent).toContain(
      'each degree starts on the key of its nearest',
    );
    const oneEach = Array.from(element.querySelectorAll('button')).find(
      (b) => b.textContent?.trim() === 'One degree per key',
    )!;
    oneEach.click();
    await fixture.whenStable();
    expect(state.layout()).toBeNull();
    expect(keys().length).toBe(7);
    expect(element.querySelector('.notice')).toBeNull();
  });

  it('shows one period of keys from the root, each with the degree it plays and an accessible name', async () => {
    const { keys } = await render();
    expect(keys().length).toBe(7);
    expect(keys()[1].getAttribute('aria-label')).toBe(
      'C#4 1: key 2 of the period, plays degree 1; choose its degree',
    );
  });

  it('leaves a key unmapped when that is chosen from its menu', async () => {
    const { fixture, keys, state } = await render();
    keys()[1].click();
    await fixture.whenStable();
    const items =
      await TestbedHarnessEnvironment.documentRootLoader(fixture).getAllHarnesses(
        MatMenuItemHarness,
      );
    expect(await items[0].getText()).toBe('Unmapped (plays nothing)');
    expect(items.length).toBe(8);
    await items[0].click();
    await fixture.whenStable();
    expect(state.layout()).toEqual([0, null, 2, 3, 4, 5, 6]);
    expect(keys()[1].classList).toContain('unmapped');
    expect(keys()[1].textContent).toContain('–');
  });

  it('spreads the keys over twelve per period when the count is typed', async () => {
    const { fixture, element, keys, state } = await render();
    const count = element.querySelector<HTMLInputElement>('app-design-field input')!;
    count.value = '12';
    count.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(keys().length).toBe(12);
    expect(state.layout()?.slice(7)).toEqual([null, null, null, null, null]);
  });

  it('names the key whose degree the scale no longer has', async () => {
    const { fixture, element, state } = await render();
    state.assignKey(0, 0);
    state.setScaleField('up', 2);
    await fixture.whenStable();
    expect(element.querySelector('.fault')?.textContent).toContain(
      'Key 5 (E4): degree 4 does not exist',
    );
  });
});
