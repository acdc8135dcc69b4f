import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { standInAccess, standInInput, standInOutput } from '../testing/midi-stand-in';
import { twelveToneDump } from '../testing/tuning-dumps';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { Session } from '../auth/session';
import { DesignState } from '../design/design-state';
import { MidiAccess } from './midi-access';
import { OverwriteDialog, type OverwriteQuestion } from './overwrite-dialog';
import { TuningBackup } from './tuning-backup';
import { TuningSender } from './tuning-sender';

interface FakeInstrument {
  requests: number[][];
  answer: 'dump' | 'nothing';
}

/** A Web MIDI stand-in: one instrument with an output and an input of the same name, answering dump requests. */
function connect(instrument: FakeInstrument): void {
  const input = standInInput();
  const output = standInOutput();
  spyOn(output, 'send').and.callFake((bytes: Uint8Array | number[]) => {
    instrument.requests.push([...bytes]);
    if (instrument.answer === 'dump' && bytes[4] === 0x00) {
      setTimeout(() => input.receive(twelveToneDump(bytes[5])), 5);
    }
  });
  const access = standInAccess({ inputs: [input], outputs: [output] });
  spyOn(navigator, 'requestMIDIAccess').and.returnValue(Promise.resolve(access));
}

async function setUp(instrument: FakeInstrument, member: boolean) {
  connect(instrument);
  TestBed.configureTestingModule({
    providers: [
      DesignState,
      MidiAccess,
      TuningSender,
      TuningBackup,
      provideHttpClient(),
      provideHttpClientTesting(),
    ],
  });
  TestBed.inject(Session).member.set(
    member
      ? {
          id: 'u-ines',
          login: 'ines-coil',
          name: 'Ines Coil',
          email: null,
          avatarUrl: null,
          siteRole: 'member',
        }
      : null,
  );
  expect(await TestBed.inject(MidiAccess).open()).toBeTrue();
  TestBed.inject(TuningSender).outputId.set('out-1');
  return TestBed.inject(TuningBackup);
}

describe('TuningBackup', () => {
  it('builds its stand-in dump to the published check value', () => {
    const dump = twelveToneDump();
    expect(dump.length).toBe(408);
    expect(dump[406]).toBe(0x63);
  });

  it(
    'asks with the dump request for the program about to be overwritten and keeps the answer as a preset',
    async () => {
      const instrument: FakeInstrument = { requests: [], answer: 'dump' };
      const backup = await setUp(instrument, true);
      TestBed.inject(DesignState).setOutputField('program', 5);
      expect(backup.inputName()).toBe('Test synth');
      const asked = backup.backUp();
      const http = TestBed.inject(HttpTestingController);
      const save = await waitFor('the backup to be saved', () => http.match('/api/presets')[0]);
      // MIDI Tuning specification: dump request `F0 7E dev 08 00 tt F7`, device 7F (every device)
      // unless set, tt the program.
      expect(instrument.requests).toEqual([[0xf0, 0x7e, 0x7f, 0x08, 0x00, 0x05, 0xf7]]);
      const body = save.request.body as {
        document: { name: string; scale: { kind: string; degrees?: string[] } };
        note: string;
      };
      expect(body.document.name).toMatch(
        /^12-TET, backed up from Test synth program 5 \(\d{4}-\d\d-\d\d\)$/,
      );
      // The twelve keys of an octave, 100 cents apart, as read back from the dump.
      expect(body.document.scale.degrees?.map((degree) => parseFloat(degree))).toEqual([
        100, 200, 300, 400, 500, 600, 700, 800, 900, 1000, 1100,
      ]);
      expect(body.note).toContain('Backup of tuning program 5 on Test synth');
      save.flush({ id: 'p-backup', revision: 1 });
      const outcome = await asked;
      expect(outcome.kind).toBe('kept');
      expect(outcome.message).toContain('in your library');
    },
    patientSpecMs,
  );

  it(
    "downloads a guest's backup as the .syx it came as",
    async () => {
      const instrument: FakeInstrument = { requests: [], answer: 'dump' };
      const backup = await setUp(instrument, false);
      const links: HTMLAnchorElement[] = [];
      spyOn(HTMLAnchorElement.prototype, 'click').and.callFake(function (this: HTMLAnchorElement) {
        links.push(this);
      });
      const outcome = await backup.backUp();
      expect(outcome).toEqual({
        kind: 'downloaded',
        fileName: 'backup-test-synth-program-0.syx',
        message: 'Backed up as backup-test-synth-program-0.syx (downloaded).',
      });
      expect(links[0].download).toBe('backup-test-synth-program-0.syx');
      TestBed.inject(HttpTestingController).expectNone('/api/presets');
    },
    patientSpecMs,
  );

  it('says plainly when the instrument does not answer, and keeps nothing', async () => {
    const instrument: FakeInstrument = { requests: [], answer: 'nothing' };
    const backup = await setUp(instrument, true);
    const outcome = await backup.backUp(30);
    expect(outcome.kind).toBe('silent');
    expect(outcome.message).toBe(
      'Test synth did not answer the dump request for tuning program 0 within 0.03 s. Many instruments do not answer one. Nothing was backed up.',
    );
    expect(instrument.requests.length).toBe(1);
    TestBed.inject(HttpTestingController).expectNone('/api/presets');
  });
});

describe('OverwriteDialog', () => {
  function open(question: OverwriteQuestion) {
    TestBed.configureTestingModule({
      imports: [OverwriteDialog],
      providers: [
        provideRouter([]),
        { provide: MAT_DIALOG_DATA, useValue: question },
        { provide: MatDialogRef, useValue: { close: () => undefined } },
      ],
    });
    const fixture = TestBed.createComponent(OverwriteDialog);
    fixture.detectChanges();
    return { fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('offers the backup, and after no answer asks to send without one', async () => {
    const silent = {
      kind: 'silent' as const,
      message: 'Test synth did not answer the dump request. Nothing was backed up.',
    };
    const { fixture, element } = open({
      portName: 'Test synth',
      program: 5,
      bank: null,
      backUp: async () => silent,
      noBackup: null,
    });
    expect(element.querySelector('button.send')!.textContent!.trim()).toBe('Send and replace');
    element.querySelector<HTMLButtonElement>('button.back-up')!.click();
    await waitFor(
      'the answer',
      () => (fixture.detectChanges(), element.querySelector('.no-answer')),
    );
    expect(element.querySelector('.no-answer')!.textContent).toContain('Nothing was backed up.');
    expect(element.querySelector('button.send')!.textContent!.trim()).toBe('Send without a backup');
  });

  it('says how to make a backup possible when no input from the instrument is chosen', () => {
    const { element } = open({
      portName: 'Test synth',
      program: 5,
      bank: null,
      backUp: null,
      noBackup: 'Connect the input.',
    });
    expect(element.querySelector('button.back-up')).toBeNull();
    expect(element.textContent).toContain('Connect the input.');
  });
});
