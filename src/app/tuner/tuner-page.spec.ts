import { Injectable, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { SharedPreset } from '@shared/api/shares';
import type { HeardFrame } from '@shared/tuner/pitch-detector';
import type { Member } from '../auth/session';
import { encodeDesign } from '../design/design-address';
import { draftFrom } from '../design/draft-document';
import { PageTest } from '../testing/page-test';
import { type ListeningState, PitchListener } from './pitch-listener';
import { TunerPage } from './tuner-page';

/** Stands in for the microphone service: the spec says what is heard. */
@Injectable()
class StandInListener {
  readonly state = signal<ListeningState>('idle');
  readonly hz = signal<number | null>(null);
  readonly lastFrame = signal<HeardFrame['kind'] | null>(null);
  /** What `start` leads to: listening, or a refusal. */
  startsAs: ListeningState = 'listening';
  starts = 0;

  async start(): Promise<void> {
    this.starts++;
    this.state.set(this.startsAs);
  }

  stop(): void {
    this.state.set('idle');
    this.hz.set(null);
    this.lastFrame.set(null);
  }
}

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};

/** Twelve pure fifths from C (8 up, 3 down), degree 0 on key 60 at its equal-tempered pitch from A = 440 Hz. */
const fenFifths = {
  format: 'keyloom.preset' as const,
  version: 1 as const,
  name: 'Fen Fifths',
  scale: { kind: 'generated' as const, generator: '3/2', period: '2/1', up: 8, down: 3 },
  mapping: { rootKey: 60, concertA: 440 },
  output: {},
};
// Middle C at A = 440 Hz is 440 x 2^(-9/12) = 261.6256 Hz; E4 of the chain is 81/64 above it, 331.1198 Hz
// (arithmetic).
const e4 = (440 * 2 ** (-9 / 12) * 81) / 64;
/** A pitch `cents` above `hz`: a cent is 1/1200 octave (definition). */
const above = (hz: number, cents: number) => hz * 2 ** (cents / 1200);

describe('TunerPage', () => {
  let pages: PageTest;
  let listener: StandInListener;

  beforeEach(() => {
    listener = new StandInListener();
    TestBed.overrideComponent(TunerPage, {
      remove: { providers: [PitchListener] },
      add: { providers: [{ provide: PitchListener, useValue: listener }] },
    });
    pages = new PageTest([{ path: 'tuner', component: TunerPage }]);
  });

  afterEach(() => pages.verify());

  const reading = () => pages.text('output[aria-label="Tuner reading"]');
  /** The value beside a name in the facts under the needle. */
  const fact = (name: string) =>
    [...pages.page().querySelectorAll('.facts div')]
      .find((row) => row.querySelector('dt')?.textContent?.trim() === name)
      ?.querySelector('dd')
      ?.textContent?.trim();
  const design = `/tuner?d=${encodeDesign(draftFrom(fenFifths))}`;

  async function startListening(): Promise<void> {
    await (
      await pages.loader.getHarness(MatButtonHarness.with({ text: /Start listening/ }))
    ).click();
    await pages.settle();
  }

  async function hear(hz: number | null, frame: HeardFrame['kind'] = 'pitch'): Promise<void> {
    listener.hz.set(hz);
    listener.lastFrame.set(frame);
    await pages.settle();
  }

  it('waits: says how to start, and does not ask for the microphone before Start', async () => {
    await pages.open(design, null);
    expect(pages.text('h1')).toBe('Tuner');
    expect(pages.text('.about')).toContain('Tuning to Fen Fifths, the design from the designer.');
    expect(reading()).toBe('Not listening');
    expect(pages.text('.state')).toBe('Press Start, then play one note at a time.');
    expect(listener.starts).toBe(0);
    // Nothing heard before Start reaches the reading.
    await hear(e4);
    expect(reading()).toBe('Not listening');
  });

  it('listens: says "No clear pitch" for quiet or unclear sound, and why', async () => {
    await pages.open(design, null);
    await startListening();
    expect(listener.starts).toBe(1);
    expect(pages.text('.state')).toBe('Listening.');
    expect(reading()).toBe('No clear pitch');
    await hear(null, 'quiet');
    expect(reading()).toBe('No clear pitch');
    expect(pages.text('.meter .hint')).toContain('Too quiet to read');
    await hear(null, 'unclear');
    expect(reading()).toBe('No clear pitch');
    expect(pages.text('.meter .hint')).toContain('noise, chords and knocks have no clear pitch');
    expect(pages.page().querySelector('app-tuner-needle .needle.resting')).not.toBeNull();
  });

  it('reads the nearest key, its degree, the target and the offset', async () => {
    await pages.open(design, null);
    await startListening();
    await hear(above(e4, 5));
    // 1200 log2(f / f_target) = 5 cents for a pitch 2^(5/1200) above the target (definition of the cent).
    expect(reading()).toBe('E4 · degree 4 · +5.0 cents');
    expect(fact('Target')).toBe('331.12 Hz');
    expect(fact('Heard')).toBe('332.08 Hz');
    expect(fact('Concert A')).toBe('440 Hz');
    // The needle turns 5/50 of its 70 degrees to the right.
    const needle = pages.page().querySelector('app-tuner-needle .needle')!;
    expect(needle.getAttribute('transform')).toBe('rotate(7 120 132)');
    expect(needle.classList.contains('tuned')).toBeFalse();
    await hear(above(e4, -1.5));
    expect(reading()).toBe('E4 · degree 4 · −1.5 cents');
    expect(needle.classList.contains('tuned')).toBeTrue();
    expect(pages.text('.visually-hidden[aria-live]')).toBe('E4, degree 4, in tune');
  });

  it('locks to one degree in any octave, and to one key', async () => {
    await pages.open(design, null);
    await startListening();
    await hear(above(e4, 5));
    const compare = await pages.loader.getHarness(
      MatSelectHarness.with({ selector: '.lock-field mat-select' }),
    );
    await compare.open();
    await compare.clickOptions({ text: 'Degree 5 (F)' });
    await pages.settle();
    // F is 4/3 above C, E 81/64: E lies 1200 log2(243/256) = -90.22 cents below F (the Pythagorean limma,
    // standard acoustics texts), so E4 + 5 cents reads -85.2 cents from F4.
    expect(reading()).toBe('F4 · degree 5 · −85.2 cents');
    expect(pages.text('.locked')).toContain('Locked to degree 5 (F), in any octave');
    // An octave up, the nearest key of degree 5 is F5.
    await hear(above(e4 * 2, 5));
    expect(reading()).toBe('F5 · degree 5 · −85.2 cents');

    await (await pages.loader.getHarness(MatButtonHarness.with({ text: /Lock to F5/ }))).click();
    await pages.settle();
    expect(pages.text('.locked')).toContain('Locked to F5 (key 77)');
    // Two octaves down (-2400 cents) is still read against F5.
    await hear(above(e4 / 2, 5));
    expect(reading()).toBe('F5 · degree 5 · −2485.2 cents');

    await (await pages.loader.getHarness(MatButtonHarness.with({ text: 'Unlock' }))).click();
    await pages.settle();
    expect(reading()).toBe('E3 · degree 4 · +5.0 cents');
    expect(pages.page().querySelector('.locked')).toBeNull();
  });

  it('moves every target with a concert A of the session’s own, and refuses one out of range', async () => {
    await pages.open(design, null);
    await startListening();
    await hear(above(e4, 5));
    const concert = await pages.loader.getHarness(
      MatInputHarness.with({ selector: '.concert input' }),
    );
    expect(await concert.getValue()).toBe('440');
    await concert.setValue('442');
    await pages.settle();
    // At A = 442 Hz every target rises 1200 log2(442/440) = 7.85 cents: 5 - 7.85 = -2.85 (arithmetic).
    expect(reading()).toBe('E4 · degree 4 · −2.9 cents');
    expect(fact('Concert A')).toBe('442 Hz');
    expect(fact('Target')).toBe('332.62 Hz');
    expect(pages.page().textContent).toContain('(+7.9 cents now)');
    await concert.setValue('1000');
    await pages.settle();
    expect(pages.text('.fault')).toBe('Concert A must be a pitch from 220 to 880 Hz.');
    expect(reading()).toBe('E4 · degree 4 · −2.9 cents');
    await (
      await pages.loader.getHarness(MatButtonHarness.with({ text: 'Back to 440 Hz' }))
    ).click();
    await pages.settle();
    expect(reading()).toBe('E4 · degree 4 · +5.0 cents');
  });

  it('sounds the locked target through the audition synth, with the volume caution', async () => {
    await pages.open(design, null);
    const sound = await pages.loader.getHarness(
      MatButtonHarness.with({ text: /Sound the target/ }),
    );
    expect(await sound.isDisabled()).toBeTrue();
    const compare = await pages.loader.getHarness(
      MatSelectHarness.with({ selector: '.lock-field mat-select' }),
    );
    await compare.open();
    await compare.clickOptions({ text: /^E4 \(key 64\)/ });
    await pages.settle();
    expect(await sound.isDisabled()).toBeFalse();
    await sound.click();
    await pages.settle();
    expect(pages.text('.tone .sounding')).toBe('331.12 Hz');
    expect(pages.text('.caution')).toContain('Keep the volume low');
    await (
      await pages.loader.getHarness(MatButtonHarness.with({ text: /Stop the target/ }))
    ).click();
    await pages.settle();
    expect(pages.page().querySelector('.tone .sounding')).toBeNull();
  });

  for (const [state, words] of [
    ['refused', 'it was refused. Allow the microphone for this site'],
    ['no-input', 'No microphone was found.'],
    ['busy', 'another program may be using it'],
    ['unsupported', 'needs a secure (https) address'],
  ] as const) {
    it(`says in plain words when the microphone is ${state}`, async () => {
      listener.startsAs = state;
      await pages.open(design, null);
      await startListening();
      const alert = pages.page().querySelector('.state[role="alert"]');
      expect(alert?.textContent).toContain(words);
      expect(reading()).toBe('Not listening');
      expect(
        await (
          await pages.loader.getHarness(MatButtonHarness.with({ text: /Start listening/ }))
        ).isDisabled(),
      ).toBeFalse();
    });
  }

  it('opens a share link without an account', async () => {
    await pages.open('/tuner?share=tok-123', null);
    const shared: SharedPreset = {
      name: 'Fen Fifths',
      revision: 2,
      pinned: false,
      savedAt: '2026-11-20T09:30:00Z',
      document: fenFifths,
    };
    pages.http.expectOne('/api/shared/tok-123').flush(shared);
    await pages.settle();
    expect(pages.text('.about')).toContain('Tuning to Fen Fifths, shared preset, revision 2.');
    expect(pages.page().querySelector('.about a')!.getAttribute('href')).toBe('/s/tok-123');
    await startListening();
    await hear(above(e4, 5));
    expect(reading()).toBe('E4 · degree 4 · +5.0 cents');
  });

  it('says so when a share link opens nothing', async () => {
    await pages.open('/tuner?share=gone', null);
    pages.http
      .expectOne('/api/shared/gone')
      .flush(
        { error: { code: 'not_found', message: 'No such link' } },
        { status: 404, statusText: 'Not Found' },
      );
    await pages.settle();
    expect(pages.text('[role="alert"]')).toContain('There is no such preset or share link');
    expect(pages.page().querySelector('output')).toBeNull();
  });

  it('opens a saved revision for a member', async () => {
    await pages.open('/tuner?preset=p-1&revision=2', mira);
    pages.http.expectOne('/api/presets/p-1/revisions/2').flush({
      presetId: 'p-1',
      revision: 2,
      note: null,
      authorId: null,
      createdAt: '2026-11-20T09:30:00Z',
      document: fenFifths,
    });
    await pages.settle();
    expect(pages.text('.about')).toContain('Tuning to Fen Fifths, saved preset, revision 2.');
    expect(pages.page().querySelector('.about a')!.getAttribute('href')).toBe('/presets/p-1');
  });

  it('asks a guest to sign in for a saved preset', async () => {
    await pages.open('/tuner?preset=p-1', null);
    expect(pages.text('h2')).toBe('Sign in to tune to this preset');
    expect(pages.page().querySelector('app-sign-in-prompt a')).not.toBeNull();
    expect(pages.page().querySelector('output')).toBeNull();
  });

  it('asks for a tuning when none is given', async () => {
    await pages.open('/tuner', null);
    expect(pages.text('h2')).toBe('Choose a tuning first');
    expect(pages.page().querySelector('a[href="/design"]')).not.toBeNull();
  });

  it('names a design address it cannot read', async () => {
    await pages.open('/tuner?d=9.xyz', null);
    expect(pages.text('[role="alert"]')).toContain('written by another version of Keyloom');
  });

  it('names the faults of a tuning it cannot use', async () => {
    const broken = { ...fenFifths, scale: { kind: 'equal', divisions: 0, period: '2/1' } };
    await pages.open(`/tuner?d=${encodeDesign(draftFrom(broken as never))}`, null);
    expect(pages.text('.fault-box h2')).toBe('This tuning cannot be used');
    expect(pages.text('.fault-box li')).toContain('scale.divisions');
  });

  it('states the smoothing in its help', async () => {
    await pages.open(design, null);
    const help = pages.text('.help');
    expect(help).toContain('McLeod pitch method');
    expect(help).toContain('the average of the last 5 readings that agree within 10 cents');
    expect(help).toContain('shows only once 3 of them agree');
    expect(help).toContain('holds for 6 more readings (about 100 ms at 60 frames a second)');
    expect(help).toContain('A sound quieter than 50 dB below full scale');
  });
});
