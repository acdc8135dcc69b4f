import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { Instrument } from '@shared/api/instruments';
import { ondes as exampleOndes } from '../testing/example-instruments';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { type Member, Session } from '../auth/session';
import { DesignState } from '../design/design-state';
import { LiveFollow } from '../hardware/live-follow';
import { MidiAccess } from '../hardware/midi-access';
import { SendPanel } from '../hardware/send-panel';
import { TuningBackup } from '../hardware/tuning-backup';
import { tuningMessages } from '../hardware/tuning-messages';
import { TuningSender } from '../hardware/tuning-sender';
import { standInAccess, standInOutput } from '../testing/midi-stand-in';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const ondes: Instrument = { ...exampleOndes, port: 'Ondes MIDI 1' };
const octaves: Instrument = {
  ...ondes,
  id: 'i-oct',
  name: 'Octaves',
  receives: 'mts-octave-1',
  deviceId: 127,
  port: 'Board MIDI',
};
const lattice: Instrument = {
  ...ondes,
  id: 'i-lat',
  name: 'Lattice',
  receives: 'mpe',
  port: 'Board MIDI',
};
const unplugged: Instrument = { ...ondes, id: 'i-off', name: 'Unplugged', port: 'Gone MIDI' };

describe('InstrumentSend in the send panel', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SendPanel>;
  let received: Record<string, number[][]>;

  beforeEach(async () => {
    const outputs = [
      standInOutput('out-ondes', 'Ondes MIDI 1'),
      standInOutput('out-board', 'Board MIDI'),
      standInOutput('out-other', 'Other MIDI'),
    ];
    received = Object.fromEntries(outputs.map((output) => [output.id, output.sent]));
    spyOn(navigator, 'requestMIDIAccess').and.returnValue(
      Promise.resolve(standInAccess({ outputs })),
    );
    TestBed.configureTestingModule({
      imports: [SendPanel],
      providers: [
        DesignState,
        MidiAccess,
        TuningSender,
        TuningBackup,
        LiveFollow,
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(Session).member.set(mira);
    expect(await TestBed.inject(MidiAccess).open()).toBeTrue();
    TestBed.inject(TuningSender).outputId.set('out-other');
    fixture = TestBed.createComponent(SendPanel);
    await fixture.whenStable();
    http
      .expectOne({ method: 'GET', url: '/api/instruments' })
      .flush({ items: [ondes, octaves, lattice, unplugged] });
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const button = (within: ParentNode, label: string) =>
    Array.from(within.querySelectorAll<HTMLButtonElement>('button')).find((b) =>
      b.textContent!.includes(label),
    )!;
  const settle = () => fixture.whenStable();

  it('aims the send at a chosen instrument: its form, device, program and port, the design unchanged', async () => {
    const state = TestBed.inject(DesignState);
    const output = structuredClone(state.draft().output);
    element()
      .querySelector<HTMLElement>('app-instrument-send mat-select .mat-mdc-select-trigger')!
      .click();
    await settle();
    const options = Array.from(document.querySelectorAll<HTMLElement>('mat-option'));
    expect(options.map((o) => o.textContent!.trim())).toEqual([
      "The design's output settings",
      'Ondes',
      'Octaves',
      'Lattice (takes MPE: one note per channel with bends: download it)',
      'Unplugged',
    ]);
    options[1].click();
    await settle();
    const sender = TestBed.inject(TuningSender);
    expect(sender.form()).toBe('mts-bulk');
    expect(sender.outputId()).toBe('out-ondes');
    // MTS bulk dump (MIDI Tuning specification): F0 7E dev 08 01 tt ..., here device 16, program 5.
    const hex = element().querySelector('pre.hex')!.textContent!.split(' ').slice(0, 6);
    expect(hex).toEqual(['F0', '7E', '10', '08', '01', '05']);
    expect(element().querySelector('.target')!.textContent).toContain(
      'To device 16, tuning program 5.',
    );
    expect(element().querySelector('.target')!.textContent).toContain(
      "From your instrument's settings",
    );
    expect(state.draft().output).toEqual(output);
  });

  it(
    'sends to every connected instrument in its own form after one confirmation listing each',
    async () => {
      button(element(), 'Send to all my connected instruments').click();
      await settle();
      const dialog = document.querySelector('mat-dialog-container')!;
      expect(dialog.querySelector('h2')!.textContent).toContain(
        'Replace the tuning on 2 instruments?',
      );
      const sends = Array.from(dialog.querySelectorAll('.sends li')).map((li) =>
        li.textContent!.replace(/\s+/g, ' ').trim(),
      );
      // Sizes from the MIDI Tuning specification: bulk dump 408 bytes, scale/octave 1-byte 21 bytes.
      expect(sends).toEqual([
        'Ondes on Ondes MIDI 1: replaces tuning program 5 (408 bytes)',
        'Octaves on Board MIDI: replaces the scale/octave tuning of all 16 channels (21 bytes)',
      ]);
      const skipped = Array.from(dialog.querySelectorAll('.skipped li')).map((li) =>
        li.textContent!.replace(/\s+/g, ' ').trim(),
      );
      expect(skipped).toEqual([
        'Lattice takes MPE: one note per channel with bends, which is a file rather than a MIDI message: download it instead.',
        'Unplugged is not connected: no MIDI output is called Gone MIDI.',
      ]);
      expect(received['out-ondes'].length + received['out-board'].length).toBe(0);

      button(dialog, 'Send and replace').click();
      const outcomes = await waitFor(
        'both sends to finish',
        () => {
          const lines = element().querySelectorAll('.outcomes li');
          return lines.length === 2 ? Array.from(lines, (li) => li.textContent!.trim()) : null;
        },
        settle,
      );
      expect(outcomes).toEqual([
        'Ondes: sent 1 message (408 bytes) to Ondes MIDI 1.',
        'Octaves: sent 1 message (21 bytes) to Board MIDI.',
      ]);
      const preset = TestBed.inject(DesignState).shown()!.preset;
      const expected = (form: 'mts-bulk' | 'mts-octave-1', deviceId: number) => {
        const built = tuningMessages(preset, form, { deviceId, program: 5, bank: 0 });
        return built.ok ? built.value.map((message) => [...message]) : [];
      };
      expect(received['out-ondes']).toEqual(expected('mts-bulk', 16));
      expect(received['out-board']).toEqual(expected('mts-octave-1', 127));
      // Scale/octave 1-byte (MIDI Tuning specification): F0 7F dev 08 08 ff gg hh in its real-time form, the bitmap 03 7F 7F
      // naming all 16 channels.
      expect(received['out-board'][0].slice(0, 8)).toEqual([
        0xf0, 0x7f, 0x7f, 0x08, 0x08, 0x03, 0x7f, 0x7f,
      ]);
      expect(received['out-other']).toEqual([]);
    },
    patientSpecMs,
  );

  it('sends nothing when the confirmation is cancelled', async () => {
    button(element(), 'Send to all my connected instruments').click();
    await settle();
    button(document.querySelector('mat-dialog-container')!, 'Cancel').click();
    await waitFor(
      'the dialog to close',
      () => !document.querySelector('mat-dialog-container'),
      settle,
    );
    expect(element().querySelector('.outcomes')).toBeNull();
    expect(Object.values(received).flat()).toEqual([]);
  });
});
