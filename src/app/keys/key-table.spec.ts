import { TestBed } from '@angular/core/testing';
import { fifthsPreset, resolvedPreset } from '@shared/preset/presets.testing';
import { previewTable } from '@shared/tuning/preview';
import { KeyTable } from './key-table';

describe('KeyTable', () => {
  async function render(mapping: object) {
    const preset = resolvedPreset({ ...fifthsPreset('T'), mapping });
    const fixture = TestBed.createComponent(KeyTable);
    fixture.componentRef.setInput('keys', previewTable(preset).keys);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const details = element.querySelector('details')!;
    details.open = true;
    details.dispatchEvent(new Event('toggle'));
    await fixture.whenStable();
    const rows = Array.from(element.querySelectorAll('tbody tr')).map((row) =>
      Array.from(row.querySelectorAll('th, td')).map((cell) => cell.textContent!.trim()),
    );
    return { element, rows };
  }

  it('lists all 128 keys with note, degree, Hz, cents from 12-TET and whether each is mapped', async () => {
    const { rows } = await render({
      rootKey: 60,
      layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
    });
    expect(rows.length).toBe(128);
    // arithmetic (MIDI convention): pure G above equal-tempered C4 is 392.4383 Hz, 1.955 cents
    // above equal-tempered G4.
    expect(rows[67]).toEqual(['67', 'G4', '4', '392.438', '+1.96¢', 'yes']);
    expect(rows[61]).toEqual(['61', 'C#4', '–', '–', '–', 'no']);
  });

  it('offers to print the table', async () => {
    const { element } = await render({ rootKey: 60 });
    expect(element.querySelector('button.print')?.textContent).toContain('Print the key table');
  });
});
