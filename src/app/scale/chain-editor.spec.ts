import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { GeneratedForm } from './generated-form';

describe('ChainEditor', () => {
  async function render() {
    TestBed.configureTestingModule({ imports: [GeneratedForm], providers: [DesignState] });
    const fixture = TestBed.createComponent(GeneratedForm);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const click = async (text: string) => {
      const button = Array.from(element.querySelectorAll<HTMLButtonElement>('button')).find(
        (b) => b.textContent?.trim() === text,
      );
      if (!button) throw new Error(`no button "${text}"`);
      button.click();
      await fixture.whenStable();
    };
    const rows = () =>
      Array.from(element.querySelectorAll('app-chain-editor tbody tr')).map((row) => [
        row.querySelector('th')?.textContent?.trim(),
        row.querySelector('input')?.value,
        ...Array.from(row.querySelectorAll('td.number')).map((cell) => cell.textContent?.trim()),
      ]);
    return { fixture, element, click, rows, state: TestBed.inject(DesignState) };
  }

  it("builds Werckmeister's third in two clicks, with its published cents", async () => {
    const { click, rows, state, element } = await render();
    await click('Temper link by link');
    await click('Werckmeister III');
    const cents = state.shown()!.table.degrees.map((degree) => Number(degree.cents.toFixed(3)));
    // Barbour, "Tuning and Temperament" (1951), Werckmeister III from C (from memory; it follows from four fifths
    // narrowed by a quarter of the Pythagorean comma).
    expect(cents).toEqual([
      0, 90.225, 192.18, 294.135, 390.225, 498.045, 588.27, 696.09, 792.18, 888.27, 996.09, 1092.18,
    ]);
    expect(rows()[0]).toEqual(['E♭ → B♭', '', '701.955¢', 'pure']);
    expect(rows()[3]).toEqual(['C → G', '1/4', '696.090¢', '−5.865¢']);
    expect(rows()[8]).toEqual(['B → F♯', '1/4', '696.090¢', '−5.865¢']);
    expect(element.querySelector('.closing')?.textContent).toContain(
      'The circle closes: the step G♯–E♭ is the generator as written.',
    );
    expect(element.querySelector('svg.circle')?.getAttribute('aria-label')).toContain(
      '4 links narrowed, 0 widened',
    );
  });

  it("builds Vallotti's in two clicks, with its published cents", async () => {
    const { click, state } = await render();
    await click('Temper link by link');
    await click('Vallotti');
    const cents = state.shown()!.table.degrees.map((degree) => Number(degree.cents.toFixed(3)));
    // Barbour (1951), Vallotti from C (from memory; six fifths F-C-G-D-A-E-B narrowed by a sixth of the comma).
    expect(cents).toEqual([
      0, 94.135, 196.09, 298.045, 392.18, 501.955, 592.18, 698.045, 796.09, 894.135, 1000, 1090.225,
    ]);
  });

  it('tempers one link as typed, widens it with a negative fraction, and keeps links in place as the chain grows', async () => {
    const { click, fixture, element, state } = await render();
    await click('Temper link by link');
    // Five fifths up and one down from C: six links, all pure to start with.
    expect(state.draft().scale).toEqual(
      jasmine.objectContaining({ temper: [null, null, null, null, null, null] }),
    );
    const fourth = element.querySelectorAll<HTMLInputElement>('app-chain-editor tbody input')[3];
    fourth.value = '-1/2';
    fourth.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(state.draft().scale).toEqual(
      jasmine.objectContaining({
        temper: [null, null, null, { comma: '531441/524288', fraction: '-1/2' }, null, null],
      }),
    );
    expect(state.shown()!.table.analysis.stack!.chain[3].deviationCents).toBeCloseTo(
      23.4600103846 / 2,
      9,
    );
    state.setScaleField('down', 2);
    expect(state.draft().scale).toEqual(
      jasmine.objectContaining({
        temper: [null, null, null, null, { comma: '531441/524288', fraction: '-1/2' }, null, null],
      }),
    );
  });

  it('names a bad fraction at its link', async () => {
    const { click, fixture, element } = await render();
    await click('Temper link by link');
    const first = element.querySelector<HTMLInputElement>('app-chain-editor tbody input')!;
    first.value = 'x';
    first.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(element.querySelector('app-chain-editor tbody mat-error')?.textContent).toContain(
      '"x" is not a fraction',
    );
  });
});
