import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { AuditionEngine, startingVolumeDb } from '../audition/audition-engine';
import { SongPreview } from './song-preview';

/**
 * A format 0 song written out byte by byte (SMF 1.0): an MTS real-time single-note change that tunes key 60 to the
 * just fifth above equal-tempered C4 (MIDI Tuning specification: 392.4383 Hz is `43 02 40`), then
 * key 60 and key 69 one after
 * the other, and a drum note on channel 10.
 */
const song = new Uint8Array([
  0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 0, 0, 1, 0x01, 0xe0, 0x4d, 0x54, 0x72, 0x6b, 0, 0, 0, 40,
  0x00, 0xf0, 0x0b, 0x7f, 0x7f, 0x08, 0x02, 0x00, 0x01, 0x3c, 0x43, 0x02, 0x40, 0xf7, 0x00, 0x90,
  0x3c, 0x64, 0x00, 0x99, 0x24, 0x64, 0x83, 0x60, 0x80, 0x3c, 0x40, 0x00, 0x90, 0x45, 0x64, 0x83,
  0x60, 0x80, 0x45, 0x40, 0x00, 0xff, 0x2f, 0x00,
]);

describe('SongPreview', () => {
  it(
    'plays each note of the retuned file at the pitch its tuning messages give, quietly at first',
    async () => {
      const started: number[] = [];
      const volumes: number[] = [];
      spyOn(AuditionEngine.prototype, 'start').and.callFake(
        (_id: string, hz: number) => void started.push(hz),
      );
      spyOn(AuditionEngine.prototype, 'setVolumeDb').and.callFake(
        (db: number) => void volumes.push(db),
      );
      TestBed.configureTestingModule({
        providers: [{ provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
      });
      const fixture = TestBed.createComponent(SongPreview);
      fixture.componentRef.setInput('song', new Blob([song], { type: 'audio/midi' }));
      await fixture.whenStable();
      const element = fixture.nativeElement as HTMLElement;
      expect(element.querySelector('.caution')).toBeNull();

      element.querySelector<HTMLButtonElement>('button.play')!.click();
      await waitFor(
        'both notes handed to the synth',
        () => started.length >= 2 || null,
        () => fixture.whenStable(),
      );
      expect(started[0]).toBeCloseTo(392.4383, 3);
      // Key 69 was not retuned: A4 = 440 Hz, 12-tone equal temperament.
      expect(started[1]).toBeCloseTo(440, 6);
      expect(started.length).toBe(2);
      expect(volumes[0]).toBe(startingVolumeDb);
      fixture.detectChanges();
      expect(element.querySelector('.caution')?.textContent).toContain(
        `it starts at ${startingVolumeDb} dB`,
      );
      expect(element.querySelector('.hint')?.textContent).toContain('2 notes');
      expect(element.querySelector('.hint')?.textContent).toContain(
        '1 drum notes (channel 10) are left out',
      );
      expect(element.querySelector('.clock')?.textContent).toContain('/ 0:01');

      element.querySelector<HTMLButtonElement>('button.stop')!.click();
      fixture.detectChanges();
      expect(element.querySelector('button.play')).not.toBeNull();
    },
    patientSpecMs,
  );

  it(
    'says so when the file cannot be played, without a sound',
    async () => {
      TestBed.configureTestingModule({
        providers: [{ provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
      });
      const fixture = TestBed.createComponent(SongPreview);
      fixture.componentRef.setInput('song', new Blob([song.subarray(0, 30)]));
      await fixture.whenStable();
      const element = fixture.nativeElement as HTMLElement;
      element.querySelector<HTMLButtonElement>('button.play')!.click();
      await waitFor(
        'the fault',
        () => element.querySelector('.fault'),
        () => fixture.whenStable(),
      );
      expect(element.querySelector('.fault')!.textContent).toContain(
        'The retuned song cannot be played here: file:',
      );
    },
    patientSpecMs,
  );
});
