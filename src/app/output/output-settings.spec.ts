import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { OutputSettings } from './output-settings';

describe('OutputSettings', () => {
  async function render() {
    TestBed.configureTestingModule({ imports: [OutputSettings], providers: [DesignState] });
    const fixture = TestBed.createComponent(OutputSettings);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const field = (label: string) =>
      Array.from(element.querySelectorAll('mat-form-field')).find(
        (candidate) => candidate.querySelector('mat-label')?.textContent?.trim() === label,
      )!;
    const type = async (label: string, text: string) => {
      const input = field(label).querySelector('input')!;
      input.value = text;
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
    };
    return { element, field, type, state: TestBed.inject(DesignState) };
  }

  it('labels every output setting', async () => {
    const { element } = await render();
    expect(
      Array.from(element.querySelectorAll('mat-label')).map((label) => label.textContent?.trim()),
    ).toEqual([
      'Device id',
      'Tuning program',
      'Tuning bank',
      'Tuning name',
      'Bend range',
      'First member channel',
      'Last member channel',
      'Samples',
    ]);
  });

  it('takes the samples of the SFZ map as typed, and names a bad file name', async () => {
    const { field, type, state } = await render();
    await type('Samples', '36 piano-c2.wav, 60 piano-c4.wav, ');
    expect(state.draft().output.samples).toEqual([
      { key: 36, file: 'piano-c2.wav' },
      { key: 60, file: 'piano-c4.wav' },
    ]);
    expect(field('Samples').querySelector('input')!.value).toBe(
      '36 piano-c2.wav, 60 piano-c4.wav, ',
    );
    expect(state.shown()!.preset.output.samples).toEqual([
      { key: 36, file: 'piano-c2.wav' },
      { key: 60, file: 'piano-c4.wav' },
    ]);
    await type('Samples', '36 ../secret');
    expect(field('Samples').querySelector('mat-error')?.textContent).toContain(
      'must be a plain file name',
    );
    await type('Samples', '');
    expect(state.draft().output.samples).toBeUndefined();
  });

  it("shows the schema's limits under the field as they are typed", async () => {
    const { field, type } = await render();
    await type('Device id', '200');
    expect(field('Device id').querySelector('mat-error')?.textContent).toContain(
      'must be at most 127 (got 200)',
    );
    await type('Tuning name', 'Fünfte Stimmung ohne Ende');
    expect(field('Tuning name').querySelector('mat-error')?.textContent).toContain('at most 16');
  });

  it('says when the member channels run downwards', async () => {
    const { element, type } = await render();
    await type('First member channel', '9');
    await type('Last member channel', '3');
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('runs from 9 down to 3');
  });

  it('warns which tuning program a dump replaces on the instrument', async () => {
    const { element, type } = await render();
    await type('Tuning program', '5');
    expect(element.querySelector('.caution')?.textContent).toContain(
      'replaces tuning program 5 in bank 0',
    );
  });
});
