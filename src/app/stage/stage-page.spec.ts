import { MatInputHarness } from '@angular/material/input/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Instrument } from '@shared/api/instruments';
import { presetForInstrument } from '@shared/api/preset-for-instrument';
import type { Setlist, StagePosition } from '@shared/api/setlists';
import { parsePresetDocument } from '@shared/preset/preset-document';
import { from } from 'rxjs';
import type { Member } from '../auth/session';
import { tuningMessages } from '../hardware/tuning-messages';
import { plug, standInAccess, standInInput, standInOutput } from '../testing/midi-stand-in';
import { stageControlsKey } from './stage-controls';
import { PageTest } from '../testing/page-test';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { STAGE_EVENT_SOURCE, type StageStream } from './stage-link';
import type { StageBackup, StageQuestion } from './stage-confirm-dialog';
import { twelveToneDump } from '../testing/tuning-dumps';
import { StagePage } from './stage-page';

const member: Member = {
  id: 'u1',
  login: 'ada',
  name: 'Ada',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
} as Member;

const pythagorean = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Fen Fifths',
  scale: {
    kind: 'list',
    degrees: ['9/8', '81/64', '4/3', '3/2', '27/16', '243/128'],
    period: '2/1',
  },
  mapping: { rootKey: 60 },
};
const nineteen = {
  format: 'keyloom.preset',
  version: 1,
  name: 'Nineteen',
  scale: { kind: 'equal', divisions: 19, period: '2/1' },
  mapping: { rootKey: 60 },
};

function setlist(access: Setlist['access'], position = 0): Setlist {
  const entry = (presetId: string, presetName: string, trigger: number | null) => ({
    presetId,
    presetName,
    revision: null,
    trigger,
    latestRevision: 1,
  });
  return {
    id: 's1',
    bandId: 'b1',
    name: 'Friday set',
    entries: [
      entry('p1', 'Fen Fifths', 3),
      entry('p2', 'Nineteen', 7),
      entry('p3', 'Closing drone', null),
    ],
    position,
    createdAt: '2026-12-01T20:00:00.000Z',
    updatedAt: '2026-12-01T20:00:00.000Z',
    access,
  };
}

function instrument(id: string, settings: Partial<Instrument>): Instrument {
  return {
    id,
    name: id,
    receives: 'mts-bulk',
    deviceId: 127,
    program: 0,
    bank: 0,
    bendRange: 2,
    memberChannels: [2, 16],
    port: null,
    createdAt: '2026-12-01T20:00:00.000Z',
    updatedAt: '2026-12-01T20:00:00.000Z',
    ...settings,
  };
}

/** A stand-in EventSource the spec drives: opens, fails and tells positions on request. */
class FakeStream implements StageStream {
  readyState = 0;
  onopen: ((event: Event) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  closed = false;
  private listeners: ((event: MessageEvent<string>) => void)[] = [];
  constructor(readonly url: string) {}
  addEventListener(_type: 'position', listener: (event: MessageEvent<string>) => void): void {
    this.listeners.push(listener);
  }
  close(): void {
    this.closed = true;
    this.readyState = 2;
  }
  open(): void {
    this.readyState = 1;
    this.onopen?.(new Event('open'));
  }
  fail(readyState: 0 | 2): void {
    this.readyState = readyState;
    this.onerror?.(new Event('error'));
  }
  tell(position: StagePosition): void {
    const event = new MessageEvent('position', { data: JSON.stringify(position) });
    for (const listener of this.listeners) listener(event);
  }
}

describe('StagePage', () => {
  let test: PageTest;
  let streams: FakeStream[];
  let questions: StageQuestion[];
  /** What the player does in the dialog before answering it; by default nothing. */
  let inDialog: (question: StageQuestion) => Promise<unknown>;

  beforeEach(() => {
    streams = [];
    questions = [];
    inDialog = async () => undefined;
    const dialog = {
      open: (_: unknown, config: { data: StageQuestion }) => {
        questions.push(config.data);
        return { afterClosed: () => from(inDialog(config.data).then(() => true)) };
      },
    };
    test = new PageTest(
      [{ path: 'stage/:setlistId', component: StagePage }],
      [
        {
          provide: STAGE_EVENT_SOURCE,
          useValue: (url: string) => {
            const stream = new FakeStream(url);
            streams.push(stream);
            return stream;
          },
        },
        { provide: MatDialog, useValue: dialog },
      ],
    );
  });

  afterEach(() => test.verify());

  /** Opens the stage of setlist s1 and answers the setlist, the instruments and the document. */
  async function openStage(answer: Setlist, instruments: Instrument[] = []): Promise<void> {
    await test.open('/stage/s1', member);
    test.http.expectOne('/api/setlists/s1').flush(answer);
    test.http.expectOne('/api/instruments').flush({ items: instruments });
    await test.settle();
    const entry = answer.entries[answer.position];
    const path = `/api/presets/${entry.presetId}/revisions/1`;
    const document = entry.presetId === 'p1' ? pythagorean : nineteen;
    test.http.expectOne(path).flush({ presetId: entry.presetId, revision: 1, document });
    await test.settle();
  }

  const buttonNamed = (name: string) =>
    Array.from(test.page().querySelectorAll('button')).find((button) =>
      button.textContent?.includes(name),
    );

  /** Presses Connect MIDI and waits for the page to have opened it. */
  async function connectMidi(): Promise<void> {
    buttonNamed('Connect MIDI')!.click();
    await waitFor(
      'MIDI to open',
      () => !buttonNamed('Connect MIDI'),
      () => test.settle(),
    );
  }

  const facts = () =>
    Array.from(test.page().querySelectorAll('.facts dd')).map((dd) => dd.textContent?.trim());

  it('shows the current tuning with its facts, the next one and its place', async () => {
    await openStage(setlist('read'));
    expect(test.text('.current')).toBe('Fen Fifths');
    expect(test.text('.place')).toBe('1 of 3');
    expect(test.text('.next')).toBe('Nineteen');
    // Seven degrees in a 2/1 period; key 60 at its equal-tempered pitch for A = 440 Hz (common
    // practice: 440 × 2^(-9/12) = 261.63 Hz).
    expect(facts()).toEqual(['7', '1200.0 ¢ (2/1)', '261.63 Hz on key 60']);
  });

  it('links to the tuner at the revision on stage', async () => {
    await openStage(setlist('read'));
    const tuner = test.page().querySelector<HTMLAnchorElement>('.now a.tuner')!;
    expect(tuner.textContent).toContain('Tune with a microphone');
    const address = new URL(tuner.href);
    expect(address.pathname + address.search).toBe('/tuner?preset=p1&revision=1');
  });

  it('gives viewers no move controls, and the keys do nothing for them', async () => {
    await openStage(setlist('read'));
    expect(test.page().querySelector('.moves')).toBeNull();
    expect(buttonNamed('Previous')).toBeUndefined();
    document.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight' }));
    await test.settle();
    test.http.expectNone('/api/setlists/s1/position');
    expect(test.text('.place')).toBe('1 of 3');
  });

  it('moves for editors with the arrow keys and the page keys foot pedals send', async () => {
    await openStage(setlist('edit'));
    expect(buttonNamed('Previous')?.disabled).toBeTrue();
    document.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight' }));
    await test.settle();
    const move = test.http.expectOne('/api/setlists/s1/position');
    expect(move.request.method).toBe('POST');
    expect(move.request.body).toEqual({ position: 1 });
    move.flush(setlist('edit', 1));
    await test.settle();
    test.http.expectOne('/api/presets/p2/revisions/1').flush({ document: nineteen });
    await test.settle();
    expect(test.text('.current')).toBe('Nineteen');
    expect(test.text('.place')).toBe('2 of 3');
    expect(facts()[0]).toBe('19');

    document.dispatchEvent(new KeyboardEvent('keydown', { key: 'PageUp' }));
    await test.settle();
    const back = test.http.expectOne('/api/setlists/s1/position');
    expect(back.request.body).toEqual({ position: 0 });
    back.flush(setlist('edit', 0));
    await test.settle();
    test.http.expectOne('/api/presets/p1/revisions/1').flush({ document: pythagorean });
    await test.settle();
    expect(test.text('.current')).toBe('Fen Fifths');
  });

  it('says how the live stream stands, in words', async () => {
    await openStage(setlist('read'));
    expect(test.text('.link')).toBe('');
    (test.page().querySelector('.follow button') as HTMLButtonElement).click();
    await test.settle();
    expect(streams.map((stream) => stream.url)).toEqual(['/api/setlists/s1/live']);
    const [stream] = streams;
    expect(test.text('.link')).toBe('Catching up…');
    stream.open();
    await test.settle();
    expect(test.text('.link')).toBe('In step');
    expect(test.page().querySelector('.link')!.classList).toContain('in-step');
    stream.fail(0);
    await test.settle();
    expect(test.text('.link')).toBe('Catching up…');
    stream.fail(2);
    await test.settle();
    expect(test.text('.link')).toBe('Cut off');
    expect(buttonNamed('Try again')).toBeDefined();

    (test.page().querySelector('.follow button') as HTMLButtonElement).click();
    await test.settle();
    expect(stream.closed).toBeTrue();
    expect(test.text('.link')).toBe('');
  });

  it(
    'follows an event to the next tuning and sends it to the right port in each instrument’s form',
    async () => {
      const synth = standInOutput('out-1', 'Stage synth');
      const other = standInOutput('out-2', 'Other synth');
      spyOn(navigator, 'requestMIDIAccess').and.returnValue(
        Promise.resolve(standInAccess({ outputs: [synth, other] })),
      );
      const bulk = instrument('Lead', {
        receives: 'mts-bulk',
        deviceId: 16,
        program: 5,
        port: 'Stage synth',
      });
      const mpe = instrument('Pad', { receives: 'mpe', port: 'Other synth' });
      await openStage(setlist('read'), [bulk, mpe]);
      expect(test.text('.instruments')).toContain('cannot be sent over MIDI');

      await connectMidi();
      (test.page().querySelector('.follow button') as HTMLButtonElement).click();
      await test.settle();
      const [stream] = streams;
      stream.open();
      stream.tell({ position: 1, presetId: 'p2', revision: 1, document: nineteen });
      await test.settle();

      expect(test.text('.current')).toBe('Nineteen');
      expect(test.text('.place')).toBe('2 of 3');
      expect(facts()[0]).toBe('19');
      await waitFor(
        'the bulk dump',
        () => synth.sent.length > 0,
        () => test.settle(),
      );
      expect(questions.length).toBe(1);
      expect(questions[0].overwrites).toEqual([
        { name: 'Lead', port: 'Stage synth', replaces: 'tuning program 5', canBackUp: false },
      ]);
      // MIDI Tuning specification, bulk tuning dump: F0 7E <device> 08 01 <program> name[16] ...
      const [dump] = synth.sent;
      expect(dump.slice(0, 6)).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x01, 5]);
      expect(dump[dump.length - 1]).toBe(0xf7);
      const parsed = parsePresetDocument(nineteen);
      if (!parsed.ok) throw new Error('the example preset does not read');
      const preset = presetForInstrument(parsed.value, bulk);
      const expected = tuningMessages(preset, 'mts-bulk', { deviceId: 16, program: 5, bank: 0 });
      if (!expected.ok) throw new Error('the bulk dump does not build');
      expect(synth.sent).toEqual(expected.value.map((message) => Array.from(message)));
      expect(other.sent).toEqual([]);
      expect(test.text('.instruments')).toContain('Sent "Nineteen" to "Stage synth"');

      // A later move goes out without asking again.
      stream.tell({ position: 0, presetId: 'p1', revision: 1, document: pythagorean });
      await waitFor(
        'the second dump',
        () => synth.sent.length === 2,
        () => test.settle(),
      );
      await test.settle();
      expect(questions.length).toBe(1);
      expect(test.text('.current')).toBe('Fen Fifths');
      expect(other.sent).toEqual([]);
    },
    patientSpecMs,
  );

  it(
    "says in red when an instrument's port is gone, and sends again when it returns",
    async () => {
      const synth = standInOutput('out-1', 'Stage synth');
      const access = standInAccess({ outputs: [synth] });
      spyOn(navigator, 'requestMIDIAccess').and.returnValue(Promise.resolve(access));
      const bank = instrument('Keys', {
        receives: 'mts-bulk-bank',
        deviceId: 3,
        program: 9,
        bank: 2,
        port: 'Stage synth',
      });
      await openStage(setlist('read'), [bank]);
      await connectMidi();
      (test.page().querySelector('.follow button') as HTMLButtonElement).click();
      await test.settle();
      plug(access, synth, 'disconnected');
      streams[0].tell({ position: 1, presetId: 'p2', revision: 1, document: nineteen });
      const missed = () => test.page().querySelector('.instruments .waiting');
      await waitFor('the port to be missed', missed, () => test.settle());
      expect(test.text('.instruments .waiting')).toContain('"Stage synth" is not connected');
      expect(questions[0].overwrites).toEqual([
        {
          name: 'Keys',
          port: 'Stage synth',
          replaces: 'tuning program 9 in bank 2',
          canBackUp: false,
        },
      ]);
      expect(synth.sent).toEqual([]);

      plug(access, synth, 'connected');
      await waitFor(
        'the resend',
        () => synth.sent.length > 0,
        () => test.settle(),
      );
      // MIDI Tuning specification, key-based dump with bank: F0 7E <device> 08 04 <bank> <program>.
      expect(synth.sent[0].slice(0, 7)).toEqual([0xf0, 0x7e, 3, 0x08, 0x04, 2, 9]);
      const sent = () => test.page().querySelector('.instruments .sent');
      await waitFor('the sent word', sent, () => test.settle());
    },
    patientSpecMs,
  );

  it(
    "moves for an editor on a program change that is an entry's trigger, and on the footswitch",
    async () => {
      const pedal = standInInput('in-1', 'Foot controller');
      spyOn(navigator, 'requestMIDIAccess').and.returnValue(
        Promise.resolve(standInAccess({ inputs: [pedal] })),
      );
      await openStage(setlist('edit'));
      await connectMidi();
      const select = await test.loader.getHarness(
        MatSelectHarness.with({ selector: '.pedal mat-select' }),
      );
      await select.clickOptions({ text: 'Foot controller' });
      await test.settle();
      // MIDI 1.0 Detailed Specification: program change Cn pp; entry 2 has trigger 7.
      pedal.receive([0xc0, 7]);
      await test.settle();
      const picked = test.http.expectOne('/api/setlists/s1/position');
      expect(picked.request.body).toEqual({ position: 1 });
      picked.flush(setlist('edit', 1));
      await test.settle();
      test.http.expectOne('/api/presets/p2/revisions/1').flush({ document: nineteen });
      // Controller 64 at 127 (pressed): Next.
      pedal.receive([0xb0, 64, 127]);
      await test.settle();
      const next = test.http.expectOne('/api/setlists/s1/position');
      expect(next.request.body).toEqual({ position: 2 });
      next.flush(setlist('edit', 2));
      await test.settle();
      test.http.expectOne('/api/presets/p3/revisions/1').flush({ document: pythagorean });
      await test.settle();
      expect(test.text('.place')).toBe('3 of 3');
    },
    patientSpecMs,
  );

  describe('with a foot controller', () => {
    beforeEach(() => localStorage.removeItem(stageControlsKey));
    afterEach(() => localStorage.removeItem(stageControlsKey));

    /** Opens the stage for an editor with a foot controller and a key bed connected. */
    async function openWithPedal() {
      const pedal = standInInput('in-1', 'Foot controller');
      const keys = standInInput('in-2', 'Key bed');
      spyOn(navigator, 'requestMIDIAccess').and.returnValue(
        Promise.resolve(standInAccess({ inputs: [keys, pedal] })),
      );
      await openStage(setlist('edit'));
      await connectMidi();
      const select = await test.loader.getHarness(
        MatSelectHarness.with({ selector: '.pedal mat-select' }),
      );
      const controller = await test.loader.getHarness(
        MatInputHarness.with({ selector: '.controller input' }),
      );
      return { pedal, select, controller };
    }

    it(
      'keeps the input and footswitch a player chose in this browser',
      async () => {
        const { select, controller } = await openWithPedal();
        await select.clickOptions({ text: 'Foot controller' });
        await controller.setValue('67');
        await test.settle();
        expect(JSON.parse(localStorage.getItem(stageControlsKey)!)).toEqual({
          inputName: 'Foot controller',
          footswitch: 67,
        });
      },
      patientSpecMs,
    );

    it(
      'listens again to the input kept from an earlier visit, with its footswitch, once MIDI is connected',
      async () => {
        localStorage.setItem(
          stageControlsKey,
          JSON.stringify({ inputName: 'Foot controller', footswitch: 67 }),
        );
        const { pedal, select, controller } = await openWithPedal();
        expect(await select.getValueText()).toBe('Foot controller');
        expect(await controller.getValue()).toBe('67');
        // MIDI 1.0 Detailed Specification: control change Bn cc vv; controller 67 at 127 is the kept pedal, pressed.
        pedal.receive([0xb0, 64, 127]);
        await test.settle();
        test.http.expectNone('/api/setlists/s1/position');
        pedal.receive([0xb0, 67, 127]);
        await test.settle();
        const next = test.http.expectOne('/api/setlists/s1/position');
        expect(next.request.body).toEqual({ position: 1 });
        next.flush(setlist('edit', 1));
        await test.settle();
        test.http.expectOne('/api/presets/p2/revisions/1').flush({ document: nineteen });
      },
      patientSpecMs,
    );
  });

  it(
    'backs up, when asked, what each instrument that can answer holds, and sends only after that',
    async () => {
      const synth = standInOutput('out-1', 'Stage synth');
      const synthInput = standInInput('in-1', 'Stage synth');
      const sendToSynth = synth.send.bind(synth);
      spyOn(synth, 'send').and.callFake((bytes: Uint8Array | number[]) => {
        sendToSynth(bytes);
        // MIDI Tuning specification: a dump request F0 7E dev 08 00 tt F7 is answered by the dump of program tt.
        if (bytes[3] === 0x08 && bytes[4] === 0x00) {
          setTimeout(() => synthInput.receive(twelveToneDump(bytes[5])), 5);
        }
      });
      const octaves = standInOutput('out-2', 'Other synth');
      spyOn(navigator, 'requestMIDIAccess').and.returnValue(
        Promise.resolve(standInAccess({ inputs: [synthInput], outputs: [synth, octaves] })),
      );
      const lead = instrument('Lead', {
        receives: 'mts-bulk',
        deviceId: 16,
        program: 5,
        port: 'Stage synth',
      });
      const organ = instrument('Organ', { receives: 'mts-octave-1', port: 'Other synth' });
      let outcomes: StageBackup[] = [];
      inDialog = async (question) => {
        outcomes = await question.backUp();
      };
      await openStage(setlist('read'), [lead, organ]);
      await connectMidi();
      (test.page().querySelector('.follow button') as HTMLButtonElement).click();
      await test.settle();
      streams[0].open();
      streams[0].tell({ position: 1, presetId: 'p2', revision: 1, document: nineteen });

      const save = await waitFor(
        'the backup to be saved',
        () => test.http.match('/api/presets')[0],
        () => test.settle(),
      );
      expect(questions[0].overwrites.map(({ name, canBackUp }) => [name, canBackUp])).toEqual([
        ['Lead', true],
        ['Organ', false],
      ]);
      // Nothing is sent but the dump request (MIDI Tuning specification: F0 7E dev 08 00 tt F7) until the
      // backup is done and the player has answered.
      expect(synth.sent).toEqual([[0xf0, 0x7e, 0x10, 0x08, 0x00, 0x05, 0xf7]]);
      expect(octaves.sent).toEqual([]);
      expect((save.request.body as { note: string }).note).toContain(
        'Backup of tuning program 5 on Stage synth',
      );
      save.flush({ id: 'p-backup', revision: 1 });

      await waitFor(
        'the bulk dump',
        () => synth.sent.length > 1,
        () => test.settle(),
      );
      expect(outcomes.map(({ name, backedUp }) => [name, backedUp])).toEqual([
        ['Lead', true],
        ['Organ', false],
      ]);
      expect(outcomes[0].message).toContain('in your library');
      expect(outcomes[1].message).toContain('cannot be asked for the tuning it holds');
      // MIDI Tuning specification, bulk tuning dump: F0 7E <device> 08 01 <program> ...
      expect(synth.sent[1].slice(0, 6)).toEqual([0xf0, 0x7e, 0x10, 0x08, 0x01, 5]);
      // Nineteen notes to the octave do not fit a scale/octave tuning of twelve: said once, not retried.
      await waitFor(
        "the organ's fault",
        () => test.text('.instruments').includes('Could not build the tuning'),
        () => test.settle(),
      );
      expect(octaves.sent).toEqual([]);
    },
    patientSpecMs,
  );
});
