import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { type StageBackup, StageConfirmDialog, type StageQuestion } from './stage-confirm-dialog';
import { waitFor } from '../testing/wait-for';

describe('StageConfirmDialog', () => {
  function open(question: StageQuestion) {
    const closed: unknown[] = [];
    TestBed.configureTestingModule({
      providers: [
        { provide: MAT_DIALOG_DATA, useValue: question },
        { provide: MatDialogRef, useValue: { close: (answer: unknown) => closed.push(answer) } },
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    const fixture = TestBed.createComponent(StageConfirmDialog);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    const button = (name: string) =>
      Array.from(element.querySelectorAll('button')).find(
        (candidate) => candidate.textContent?.trim() === name,
      );
    const settle = async () => {
      await fixture.whenStable();
      fixture.detectChanges();
    };
    return { element, button, settle, closed };
  }

  const lead = { name: 'Lead', port: 'Stage synth', replaces: 'tuning program 5' };
  const organ = { name: 'Organ', port: 'Other synth', replaces: 'the scale/octave tuning' };

  it('offers no backup when no instrument can answer a dump request', () => {
    const { button, element } = open({
      overwrites: [{ ...organ, canBackUp: false }],
      backUp: () => Promise.reject(new Error('not asked')),
    });
    expect(button('Back up first')).toBeUndefined();
    expect(button('Send and replace')).toBeDefined();
    expect(element.textContent).toContain('Back them up first if you need them.');
  });

  it('backs up on request, says what each instrument came to, and sends only when told to', async () => {
    let answer!: (outcomes: StageBackup[]) => void;
    const asked = new Promise<StageBackup[]>((resolve) => (answer = resolve));
    const { button, element, settle, closed } = open({
      overwrites: [
        { ...lead, canBackUp: true },
        { ...organ, canBackUp: false },
      ],
      backUp: () => asked,
    });
    button('Back up first')!.click();
    await settle();
    expect(element.querySelector('mat-progress-bar')).not.toBeNull();
    expect(button('Send and replace')!.disabled).toBeTrue();
    answer([
      { ...lead, backedUp: true, message: 'Backed up as "12-TET, backed up" in your library.' },
      { ...organ, backedUp: false, message: 'Its form cannot be asked for the tuning it holds.' },
    ]);
    await waitFor('the outcomes', () => element.querySelector('.outcome'), settle);
    const outcomes = Array.from(element.querySelectorAll('li .outcome'), (item) => [
      item.textContent!.trim(),
      item.classList.contains('kept'),
    ]);
    expect(outcomes).toEqual([
      ['Backed up as "12-TET, backed up" in your library.', true],
      ['Its form cannot be asked for the tuning it holds.', false],
    ]);
    expect(element.querySelector('.advice')!.textContent).toContain(
      '1 of 2 could not be backed up',
    );
    expect(button('Back up first')).toBeUndefined();
    expect(closed).toEqual([]);
    button('Send and replace')!.click();
    await settle();
    expect(closed).toEqual([true]);
  });
});
