import { provideHttpClient } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { of } from 'rxjs';
import { standInAccess, standInOutput } from '../testing/midi-stand-in';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { DesignState } from '../design/design-state';
import { LiveFollow } from './live-follow';
import { MidiAccess } from './midi-access';
import type { OverwriteQuestion } from './overwrite-dialog';
import { SendPanel } from './send-panel';
import { TuningBackup } from './tuning-backup';
import { TuningSender } from './tuning-sender';

describe('SendPanel', () => {
  it(
    'warns about, previews and sends to the same device, program and bank, whichever output setting changes',
    async () => {
      const port = standInOutput();
      const sent = port.sent;
      const access = standInAccess({ outputs: [port] });
      spyOn(navigator, 'requestMIDIAccess').and.returnValue(Promise.resolve(access));
      const questions: OverwriteQuestion[] = [];
      TestBed.configureTestingModule({
        imports: [SendPanel],
        providers: [
          DesignState,
          MidiAccess,
          TuningSender,
          TuningBackup,
          LiveFollow,
          provideHttpClient(),
          {
            provide: MatDialog,
            useValue: {
              open: (_: unknown, config: { data: OverwriteQuestion }) => (
                questions.push(config.data),
                { afterClosed: () => of(true) }
              ),
            },
          },
        ],
      });
      const state = TestBed.inject(DesignState);
      const sender = TestBed.inject(TuningSender);
      expect(await TestBed.inject(MidiAccess).open()).toBeTrue();
      sender.outputId.set('out-1');
      sender.form.set('mts-bulk-bank');
      const fixture = TestBed.createComponent(SendPanel);
      await fixture.whenStable();
      const element = fixture.nativeElement as HTMLElement;
      const sendButton = () =>
        Array.from(element.querySelectorAll('button')).find((b) =>
          b.textContent?.includes('Send tuning'),
        )!;

      // MIDI Tuning specification, key-based dump with bank: F0 7E dev 08 04 bb tt name[16] ... F7.
      for (const [field, value] of [
        ['deviceId', 5],
        ['program', 9],
        ['bank', 3],
      ] as const) {
        state.setOutputField(field, value);
        await fixture.whenStable();
        const hex = element
          .querySelector('pre.hex')!
          .textContent!.split(' ')
          .map((byte) => parseInt(byte, 16));
        sendButton().click();
        const bytes = await waitFor(
          `the dump sent after ${field}`,
          () => sent.shift(),
          () => fixture.whenStable(),
        );
        await waitFor(
          'the send to finish',
          () => sender.done(),
          () => fixture.whenStable(),
        );
        const question = questions.pop()!;
        const { deviceId, program, bank } = state.shown()!.preset.output;
        expect([bytes[2], bytes[5], bytes[6]]).toEqual([deviceId, bank, program]);
        expect(hex).toEqual(bytes);
        expect([question.program, question.bank]).toEqual([program, bank]);
        expect(element.querySelector('.target')!.textContent).toContain(`To device ${deviceId}`);
        expect(element.querySelector('.target')!.textContent).toContain(
          `tuning program ${program}, bank ${bank}`,
        );
      }
    },
    patientSpecMs,
  );
});
