import { HttpEventType } from '@angular/common/http';
import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { MatRadioButtonHarness } from '@angular/material/radio/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { tuningOfPreset } from '@shared/export/preset-tuning';
import { retuneSong } from '@shared/midi/song-retune';
import { parsePresetDocument } from '@shared/preset/preset-document';
import { fifthsPreset } from '@shared/preset/presets.testing';
import { Midi } from '@tonejs/midi';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { Member } from '../auth/session';
import { encodeDesign } from '../design/design-address';
import { draftFrom } from '../design/draft-document';
import { PresetRow } from '../library/library-api';
import { SongReportHeader } from './retune-api';
import { RetunePage } from './retune-page';
import { PageTest } from '../testing/page-test';
import { browserInstrumentsKey } from '../instruments/my-instruments';
import { latticeBoard, ondes } from '../testing/example-instruments';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const fenFifths: PresetRow = {
  id: 'p-fen',
  name: 'Fen Fifths',
  bandId: 'b-fen',
  bandName: 'Copper Fen',
  ownerId: 'u-mira',
  ownerLogin: 'mira-vale',
  revision: 3,
  updatedAt: '2026-11-20T09:30:00Z',
  deletedAt: null,
  access: 'own',
};
const reedOrgan: PresetRow = {
  id: 'p-reed',
  name: 'Reed Organ Meantone',
  bandId: null,
  bandName: null,
  ownerId: 'u-mira',
  ownerLogin: 'mira-vale',
  revision: 1,
  updatedAt: '2026-11-18T15:00:00Z',
  deletedAt: null,
  access: 'own',
};
const fenFifthsDocument = fifthsPreset('Fen Fifths');
/** Fen Fifths on the white keys only: the black keys are left unmapped. */
const whiteKeysDocument = {
  ...fenFifthsDocument,
  mapping: {
    rootKey: 60,
    keysPerPeriod: 12,
    layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
  },
};
/** A report in the shape server/routes/retune.ts answers in its JSON body. */
const mpeReport: SongReportHeader = {
  mode: 'mpe',
  notesRetuned: 412,
  channelsUsed: [2, 3, 4, 5],
  notesStolen: [
    { track: 2, channel: 1, key: 61, startTick: 960, stolenAtTick: 1200, memberChannel: 3 },
  ],
  notesStolenCount: 1,
  notesUnmappedCount: 2,
  notesUnmapped: [
    { track: 2, tick: 96, key: 61 },
    { track: 2, tick: 288, key: 63 },
  ],
  warnings: [
    {
      path: 'file.tracks[1]',
      message: 'file: track 2 bends its notes already; those bends were replaced.',
    },
  ],
  uploadSha256: 'ab'.repeat(32),
  leadIn: { ms: 100, ticks: 96 },
};
/** The first bytes of a Standard MIDI File: the MThd header chunk. */
const midiBytes = new Uint8Array([0x4d, 0x54, 0x68, 0x64, 0, 0, 0, 6, 0, 1, 0, 2, 0x01, 0xe0]);

describe('RetunePage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest([{ path: 'retune', component: RetunePage }]);
    http = pages.http;
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();
  const text = (selector: string) => pages.text(selector);

  const settle = () => pages.settle();

  /** Waits for work the page does outside Angular's knowledge (reading a Blob) to show. */
  async function until(what: string, shown: () => unknown) {
    await waitFor(what, shown, settle);
  }

  async function open(url: string, member: Member | null) {
    await pages.open(url, member);
  }

  async function openSignedIn() {
    await open('/retune', mira);
    const list = http.expectOne((request) => request.url === '/api/presets');
    expect(list.request.params.get('pageSize')).toBe('100');
    list.flush({ items: [fenFifths, reedOrgan], total: 2, page: 1, pageSize: 100 });
    await settle();
  }

  async function choose(file: File, drop = 0) {
    const input = page().querySelectorAll<HTMLInputElement>('app-file-drop input[type=file]')[drop];
    const transfer = new DataTransfer();
    transfer.items.add(file);
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    await settle();
  }

  function pressRetune() {
    page().querySelector<HTMLButtonElement>('button.retune')!.click();
  }

  async function retuneRequest(): Promise<TestRequest> {
    pressRetune();
    await settle();
    return http.expectOne('/api/retune');
  }

  function song(): File {
    return new File([midiBytes], 'fen-song.mid', { type: 'audio/midi' });
  }

  /** Answers the page's fetch of the chosen saved preset (GET /api/presets/:id), for the roll. */
  async function answerPreset(row: PresetRow, document: unknown) {
    await settle();
    http.expectOne(`/api/presets/${row.id}`).flush({ ...row, note: null, document, access: 'own' });
    await settle();
  }

  async function answerWithSong(request: TestRequest, fileName: string, report: SongReportHeader) {
    // The JSON answer server/routes/retune.ts gives a client that asks for it: the song as base64 and the report.
    request.flush({ fileName, report, song: btoa(String.fromCharCode(...midiBytes)) });
    await settle();
  }

  it('posts the song with the chosen saved preset and mode, shows the progress, the report and the download', async () => {
    await openSignedIn();
    await choose(song());
    expect(text('.chosen')).toContain('fen-song.mid');
    expect(text('.chosen')).toContain('14 bytes');

    const select = await pages.loader.getHarness(
      MatSelectHarness.with({ selector: '.preset-field mat-select' }),
    );
    await select.open();
    await select.clickOptions({ text: /Fen Fifths/ });
    await answerPreset(fenFifths, fenFifthsDocument);
    await (
      await pages.loader.getHarness(
        MatRadioButtonHarness.with({ label: 'One note per channel (MPE)' }),
      )
    ).check();
    await settle();

    const request = await retuneRequest();
    const form = request.request.body as FormData;
    expect(request.request.method).toBe('POST');
    expect(request.request.reportProgress).toBeTrue();
    expect(form.get('mode')).toBe('mpe');
    expect(form.get('presetId')).toBe('p-fen');
    expect(form.get('preset')).toBeNull();
    expect(form.get('leadInMs')).toBe('100');
    expect((form.get('file') as File).name).toBe('fen-song.mid');

    request.event({ type: HttpEventType.UploadProgress, loaded: 30, total: 100 });
    await settle();
    expect(text('.status')).toBe('Sending the song: 30%');
    const bar = page().querySelector('mat-progress-bar[aria-label="Sending the song"]')!;
    expect(bar.getAttribute('aria-valuenow')).toBe('30');
    expect(page().querySelector('button.retune')!.getAttribute('aria-disabled')).toBe('true');
    expect(text('.announcement')).toBe('Sending the song.');

    request.event({ type: HttpEventType.UploadProgress, loaded: 100, total: 100 });
    await settle();
    expect(text('.status')).toBe('Retuning…');

    await answerWithSong(request, 'fen-song-fen-fifths-mpe.mid', mpeReport);
    expect(text('.result h2')).toBe('Retuned with one note per channel (MPE)');
    expect(text('.announcement')).toBe('Retuned. The download is ready below.');
    expect(text('.notes-retuned')).toBe('412');
    expect(text('.channels-used')).toBe('2–5');
    expect(text('.notes-stolen')).toBe('1');
    expect(text('.notes-unmapped')).toBe('2');
    const stolen = Array.from(page().querySelectorAll('table.stolen tbody td')).map((cell) =>
      cell.textContent!.trim(),
    );
    expect(stolen).toEqual(['2', '1', '61 (C#4)', '960', '1200', '3']);
    expect(text('.warnings')).toContain('track 2 bends its notes already');
    expect(text('.lead-in-ms')).toBe('100 ms');
    expect(text('.lead-in-note')).toContain('The song starts 100 ms (96 ticks) later than written');
    expect(page().querySelector('app-song-preview button.play')?.textContent).toContain(
      'Hear it first',
    );

    const download = page().querySelector<HTMLAnchorElement>('a.download')!;
    expect(download.getAttribute('download')).toBe('fen-song-fen-fifths-mpe.mid');
    expect(download.textContent).toContain('Download fen-song-fen-fifths-mpe.mid');
    expect(download.href).toMatch(/^blob:/);
    const downloaded = new Uint8Array(await (await fetch(download.href)).arrayBuffer());
    expect(Array.from(downloaded)).toEqual(Array.from(midiBytes));
  });

  it(
    'draws the song, marks its notes on unmapped keys, then the retuned offsets',
    async () => {
      // A song written with @tonejs/midi's writer: C4, D4, E4 and C♯4 on channel 1.
      const midi = new Midi();
      const track = midi.addTrack();
      track.name = 'Tune';
      [60, 62, 64, 61].forEach((key, index) =>
        track.addNote({ midi: key, time: index * 0.5, duration: 0.5 }),
      );
      const bytes = new Uint8Array(midi.toArray());
      await openSignedIn();
      await choose(new File([bytes], 'fen-tune.mid', { type: 'audio/midi' }));
      const roll = await waitFor(
        'the roll of the chosen song',
        () => page().querySelector('app-song-roll.written-roll svg.plot[role=img]'),
        settle,
      );
      expect(roll.getAttribute('aria-label')).toBe(
        'Piano roll of the song: 4 notes in 1 track, keys 60–64 (C4–E4)',
      );
      expect(page().querySelectorAll('.written-roll rect.note').length).toBe(4);
      expect(text('.roll-hint')).toContain('Once a tuning is chosen');

      const select = await pages.loader.getHarness(MatSelectHarness);
      await select.open();
      await select.clickOptions({ text: /Fen Fifths/ });
      await answerPreset(fenFifths, whiteKeysDocument);
      expect(text('.written-roll .unmapped-count')).toBe('1');
      expect(page().querySelectorAll('.written-roll rect.note.unmapped').length).toBe(1);
      expect(roll.getAttribute('aria-label')).toContain(
        '4 notes in 1 track, keys 60–64 (C4–E4), 1 on keys the tuning',
      );
      expect(page().querySelector('.roll-hint')).toBeNull();

      const parsed = parsePresetDocument(whiteKeysDocument);
      const tuning = parsed.ok ? tuningOfPreset(parsed.value) : null;
      if (!tuning?.ok) throw new Error('the preset does not build');
      const retuned = retuneSong(bytes, tuning.value, 'mts', 0);
      if (!retuned.ok) throw new Error(retuned.errors[0].message);
      const request = await retuneRequest();
      request.flush({
        fileName: 'fen-tune-fen-fifths-mts.mid',
        report: { ...mpeReport, mode: 'mts', notesStolen: [], notesStolenCount: 0 },
        song: btoa(String.fromCharCode(...retuned.value.bytes)),
      });
      await until('the roll of the retuned song', () =>
        page().querySelector('app-song-roll.retuned-roll svg.plot'),
      );
      // From memory: pure fifths from C give D = 9/8 (203.910 cents) and E = 81/64 (407.820 cents),
      // +3.9 and +7.8 cents from 12-tone equal temperament; C4 is the root and C♯4, unmapped,
      // keeps its equal-tempered pitch.
      expect(text('.retuned-roll .cents-range')).toContain('from ±0.0¢ to +7.8¢');
      expect(page().querySelectorAll('.retuned-roll rect.note').length).toBe(4);
    },
    patientSpecMs,
  );

  it('retunes the same song again in the other mode without choosing it again', async () => {
    await openSignedIn();
    await choose(song());
    const select = await pages.loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: /Reed Organ/ });
    await answerPreset(reedOrgan, { ...fenFifthsDocument, name: 'Reed Organ Meantone' });
    const first = await retuneRequest();
    expect((first.request.body as FormData).get('mode')).toBe('mts');
    await answerWithSong(first, 'fen-song-reed-organ-meantone-mts.mid', {
      ...mpeReport,
      mode: 'mts',
      notesStolen: [],
      notesStolenCount: 0,
    });
    expect(text('.result h2')).toBe('Retuned with tuning messages (MTS)');
    expect(page().querySelector('table.stolen')).toBeNull();

    const again = Array.from(page().querySelectorAll<HTMLButtonElement>('button.again')).find(
      (button) => button.textContent!.includes('Retune again as one note per channel (MPE)'),
    )!;
    again.click();
    await settle();
    const second = http.expectOne('/api/retune');
    const form = second.request.body as FormData;
    expect(form.get('mode')).toBe('mpe');
    expect(form.get('presetId')).toBe('p-reed');
    expect((form.get('file') as File).name).toBe('fen-song.mid');
    await answerWithSong(second, 'fen-song-reed-organ-meantone-mpe.mid', mpeReport);
    expect(page().querySelector('a.download')!.getAttribute('download')).toBe(
      'fen-song-reed-organ-meantone-mpe.mid',
    );
  });

  function instrumentSelect(): Promise<MatSelectHarness> {
    return pages.loader.getHarness(MatSelectHarness.with({ selector: '.instrument-select' }));
  }

  it("retunes for a member's instrument by its id, in the mode it takes unless the player changes it", async () => {
    await openSignedIn();
    await choose(song());
    const presets = await pages.loader.getHarness(
      MatSelectHarness.with({ selector: '.preset-field mat-select' }),
    );
    await presets.open();
    await presets.clickOptions({ text: /Fen Fifths/ });
    await answerPreset(fenFifths, fenFifthsDocument);

    const select = await instrumentSelect();
    await select.open();
    http
      .expectOne({ method: 'GET', url: '/api/instruments' })
      .flush({ items: [ondes, latticeBoard] });
    await settle();
    await select.clickOptions({ text: 'Lattice board' });
    await settle();
    expect(text('.instrument-summary')).toContain('channels 2-9');
    const mpe = await pages.loader.getHarness(
      MatRadioButtonHarness.with({ label: 'One note per channel (MPE)' }),
    );
    expect(await mpe.isChecked()).toBeTrue();

    const first = await retuneRequest();
    let form = first.request.body as FormData;
    expect(form.get('instrument')).toBe('i-board');
    expect(form.get('mode')).toBe('mpe');
    expect(form.get('presetId')).toBe('p-fen');
    await answerWithSong(first, 'fen-song-fen-fifths-mpe.mid', mpeReport);

    await (
      await pages.loader.getHarness(MatRadioButtonHarness.with({ label: 'Tuning messages (MTS)' }))
    ).check();
    await settle();
    const second = await retuneRequest();
    form = second.request.body as FormData;
    expect(form.get('mode')).toBe('mts');
    expect(form.get('instrument')).toBe('i-board');
    await answerWithSong(second, 'fen-song-fen-fifths-mts.mid', { ...mpeReport, mode: 'mts' });

    await select.open();
    await select.clickOptions({ text: /None/ });
    await settle();
    const third = await retuneRequest();
    expect((third.request.body as FormData).get('instrument')).toBeNull();
    await answerWithSong(third, 'fen-song-fen-fifths-mts.mid', { ...mpeReport, mode: 'mts' });
  });

  it("lays a guest's instrument, kept in this browser, over the design's output settings", async () => {
    // A guest's instruments are kept without the server's times.
    const kept = [ondes, latticeBoard].map(({ createdAt, updatedAt, ...instrument }) => instrument);
    localStorage.setItem(browserInstrumentsKey, JSON.stringify(kept));
    try {
      const d = encodeDesign(draftFrom(fenFifthsDocument));
      await open(`/retune?d=${d}`, null);
      await choose(song());
      const select = await instrumentSelect();
      await select.open();
      await select.clickOptions({ text: 'Ondes' });
      await settle();
      const request = await retuneRequest();
      const form = request.request.body as FormData;
      expect(form.get('instrument')).toBeNull();
      expect(form.get('mode')).toBe('mts');
      const sent = JSON.parse(form.get('preset') as string) as { name: string; output: object };
      expect(sent.name).toBe('Fen Fifths');
      expect(sent.output).toEqual(
        jasmine.objectContaining({ deviceId: 16, program: 5, memberChannels: [2, 16] }),
      );
      await answerWithSong(request, 'fen-song-fen-fifths-mts.mid', { ...mpeReport, mode: 'mts' });
    } finally {
      localStorage.removeItem(browserInstrumentsKey);
    }
  });

  it('sends the lead-in as typed, refuses one out of range before sending, and says when there is none', async () => {
    await openSignedIn();
    await choose(song());
    const select = await pages.loader.getHarness(MatSelectHarness);
    await select.open();
    await select.clickOptions({ text: /Fen Fifths/ });
    await answerPreset(fenFifths, fenFifthsDocument);
    const leadIn = page().querySelector<HTMLInputElement>('.lead-in input')!;
    leadIn.value = '9000';
    leadIn.dispatchEvent(new Event('input'));
    await settle();
    expect(text('.lead-in-fault')).toBe('Lead-in must be from 0 to 5000 ms (got 9000).');
    pressRetune();
    await settle();
    http.expectNone('/api/retune');
    expect(text('.missing')).toBe('Lead-in must be from 0 to 5000 ms (got 9000).');

    leadIn.value = '0';
    leadIn.dispatchEvent(new Event('input'));
    await settle();
    expect(page().querySelector('.lead-in-fault')).toBeNull();
    const request = await retuneRequest();
    expect((request.request.body as FormData).get('leadInMs')).toBe('0');
    await answerWithSong(request, 'fen-song-fen-fifths-mts.mid', {
      ...mpeReport,
      mode: 'mts',
      leadIn: { ms: 0, ticks: 0 },
    });
    expect(text('.lead-in-note')).toContain('No lead-in: the first note starts with the tuning');
  });

  it('refuses a 6 MB song without sending it', async () => {
    await openSignedIn();
    await choose(
      new File([new Uint8Array(6 * 1024 * 1024)], 'copper-fen-live.mid', { type: 'audio/midi' }),
    );
    expect(text('.song-fault')).toContain(
      '“copper-fen-live.mid” is 6.0 MB, larger than the limit of 5 MB, so it was not sent.',
    );
    expect(page().querySelector('.chosen')).toBeNull();
    pressRetune();
    await settle();
    expect(text('.missing')).toBe('Choose a song first.');
    http.expectNone('/api/retune');
  });

  it(
    "sends the design from the designer's address as the preset document when signed out",
    async () => {
      const d = encodeDesign(draftFrom(fenFifthsDocument));
      await open(`/retune?d=${d}`, null);
      http.expectNone((request) => request.url === '/api/presets');
      expect(text('.tuning-name')).toBe('Fen Fifths');
      expect(page().querySelector('a.sign-in-link')!.textContent).toContain(
        'Sign in for your saved presets',
      );
      const back = new URL(page().querySelector<HTMLAnchorElement>('a.back')!.href);
      expect(back.pathname).toBe('/design');
      expect(back.searchParams.get('d')).toBe(d);

      await choose(song());
      await until("the song's fault", () => page().querySelector('.roll-fault'));
      expect(text('.roll-fault')).toContain('This song cannot be drawn here');
      const request = await retuneRequest();
      const form = request.request.body as FormData;
      expect(form.get('mode')).toBe('mts');
      expect(form.get('presetId')).toBeNull();
      expect(JSON.parse(form.get('preset') as string)).toEqual(
        jasmine.objectContaining({ name: 'Fen Fifths', scale: fenFifthsDocument.scale }),
      );
      request.flush(null, { status: 500, statusText: 'Server Error' });
      await until('the refusal', () => page().querySelector('.refusal'));
    },
    patientSpecMs,
  );

  it(
    "shows the server's refusal in its own words",
    async () => {
      await openSignedIn();
      await choose(new File([new Uint8Array([0x50, 0x4b, 3, 4])], 'fen-song.mid'));
      const select = await pages.loader.getHarness(MatSelectHarness);
      await select.open();
      await select.clickOptions({ text: /Fen Fifths/ });
      await answerPreset(fenFifths, fenFifthsDocument);
      const request = await retuneRequest();
      // The refusal of server/routes/retune.ts for a file that starts with "PK".
      const refusal = {
        error: {
          code: 'not_midi',
          message: 'file: is not a Standard MIDI File; it looks like a zip archive.',
          field: 'file',
        },
      };
      request.flush(refusal, { status: 400, statusText: 'Bad Request' });
      await until("the refusal's message", () => page().querySelector('.refusal-message'));
      expect(text('.refusal h2')).toBe('The song was not retuned');
      expect(text('.refusal-message')).toBe(
        'file: is not a Standard MIDI File; it looks like a zip archive.',
      );
      expect(page().querySelector('a.download')).toBeNull();
      expect(page().querySelector('button.retune')!.getAttribute('aria-disabled')).not.toBe('true');
    },
    patientSpecMs,
  );

  it(
    'reads a chosen preset file in the browser and names its faults before anything is sent',
    async () => {
      await open('/retune', null);
      expect(
        await (
          await pages.loader.getHarness(
            MatRadioButtonHarness.with({ label: 'A preset file (.json)' }),
          )
        ).isChecked(),
      ).toBeTrue();
      await choose(song());
      const broken = {
        ...fenFifthsDocument,
        scale: { kind: 'generated', generator: '1.5', up: 5 },
      };
      await choose(
        new File([JSON.stringify(broken)], 'fen-fifths.json', { type: 'application/json' }),
        1,
      );
      await until("the preset file's faults", () => page().querySelector('.preset-faults'));
      expect(text('.preset-faults')).toContain('scale.generator');
      pressRetune();
      await settle();
      expect(text('.missing')).toContain('The preset file has faults');
      http.expectNone('/api/retune');

      await choose(
        new File([JSON.stringify(fenFifthsDocument)], 'fen-fifths.json', {
          type: 'application/json',
        }),
        1,
      );
      await until(
        'the preset file chosen',
        () =>
          page().querySelector('.chosen .file-name') &&
          text('.card:nth-child(2) .chosen').includes('Fen Fifths'),
      );
      const request = await retuneRequest();
      expect(JSON.parse((request.request.body as FormData).get('preset') as string)).toEqual(
        fenFifthsDocument,
      );
      request.flush({
        fileName: 'fen-song-fen-fifths-mts.mid',
        report: { ...mpeReport, mode: 'mts' },
        song: btoa(String.fromCharCode(...midiBytes)),
      });
      await settle();
      expect(page().querySelector('a.download')!.getAttribute('download')).toBe(
        'fen-song-fen-fifths-mts.mid',
      );
    },
    patientSpecMs,
  );
});
