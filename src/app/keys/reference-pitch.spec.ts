import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { ReferencePitch } from './reference-pitch';

describe('ReferencePitch', () => {
  async function render() {
    TestBed.configureTestingModule({ imports: [ReferencePitch], providers: [DesignState] });
    const fixture = TestBed.createComponent(ReferencePitch);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const state = TestBed.inject(DesignState);
    const button = (text: string) =>
      Array.from(element.querySelectorAll('button')).find((b) => b.textContent?.trim() === text)!;
    const summary = () => element.querySelector('.summary')?.textContent?.trim();
    return { fixture, element, state, button, summary };
  }

  function quarterCommaFromEFlat(state: DesignState) {
    state.setScaleField('up', 8);
    state.setScaleField('down', 3);
    state.setTemper({ comma: '81/80', fraction: '1/4' });
  }

  it('tunes the A key to 415 Hz with one click, and the root follows', async () => {
    const { fixture, state, button, summary } = await render();
    quarterCommaFromEFlat(state);
    button('Tune one key').click();
    await fixture.whenStable();
    button('A = 415').click();
    await fixture.whenStable();
    expect(state.draft().mapping.anchor).toEqual({ key: 69, hz: 415 });
    expect(state.draft().mapping.rootHz).toBeUndefined();
    // Quarter-comma meantone with A4 = 415 Hz on key 69 puts C4 at 248.2279 Hz (arithmetic: 415 * 2 / 5^(3/4)).
    expect(summary()).toBe('Key 69 (A4) sounds 415 Hz; root key 60 (C4) sounds 248.2279 Hz.');
    expect(state.shown()!.table.keys[69].hz).toBeCloseTo(415, 9);
    expect(button('A = 415').getAttribute('aria-pressed')).toBe('true');
    expect(button('A = 440').getAttribute('aria-pressed')).toBe('false');
  });

  it('offers A at 415, 430, 432, 440 and 442 Hz, each named by its pitch alone', async () => {
    const { fixture, element, button } = await render();
    button('Tune one key').click();
    await fixture.whenStable();
    const quick = Array.from(
      element.querySelectorAll('[aria-label="Tune the A key to"] button'),
    ).map((b) => b.textContent?.trim());
    expect(quick.slice(0, 5)).toEqual(['A = 415', 'A = 430', 'A = 432', 'A = 440', 'A = 442']);
  });

  it('takes the anchor key from the strip while picking, and then stops picking', async () => {
    const { fixture, state, button } = await render();
    button('Tune one key').click();
    await fixture.whenStable();
    button('Pick the key on the strip').click();
    await fixture.whenStable();
    expect(state.pickingAnchorKey()).toBeTrue();
    expect(button('Press a key on the strip below…')).toBeDefined();
    state.pickAnchorKey(64);
    await fixture.whenStable();
    expect(state.pickingAnchorKey()).toBeFalse();
    expect(state.draft().mapping.anchor).toEqual({ key: 64, hz: 440 });
    state.pickAnchorKey(62);
    expect(state.draft().mapping.anchor?.key).toBe(64);
  });

  it('says which field is wrong when the anchor key plays nothing', async () => {
    const { fixture, element, state, button } = await render();
    button('Tune one key').click();
    state.assignKey(1, null);
    state.setAnchor({ key: 61 });
    await fixture.whenStable();
    const faults = Array.from(element.querySelectorAll('app-design-field')).map(
      (f) => f.textContent ?? '',
    );
    expect(faults.some((text) => text.includes('61 plays no degree in this layout'))).toBeTrue();
  });

  it('goes back to the root from concert A, leaving neither a root pitch nor an anchor', async () => {
    const { fixture, state, button } = await render();
    button('Tune one key').click();
    await fixture.whenStable();
    button('Root from concert A').click();
    await fixture.whenStable();
    expect(state.draft().mapping.anchor).toBeUndefined();
    expect(state.draft().mapping.rootHz).toBeUndefined();
    button("Type the root's pitch").click();
    await fixture.whenStable();
    expect(state.draft().mapping.rootHz).toBe(261.6256);
  });
});
