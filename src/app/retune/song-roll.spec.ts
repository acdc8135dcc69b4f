import { TestBed } from '@angular/core/testing';
import { tuningOfPreset } from '@shared/export/preset-tuning';
import { retuneSong } from '@shared/midi/song-retune';
import { parsePresetDocument } from '@shared/preset/preset-document';
import { Midi } from '@tonejs/midi';
import { retunedRoll, writtenRoll, type SongRollNotes } from './roll-notes';
import { SongRoll } from './song-roll';

/**
 * A song written with @tonejs/midi's writer (120 a minute): a melody C4 D4 E4 F4 G4 on channel 1, a
 * long C♯4 on channel 2 and two drum notes on channel 10 (General MIDI's drums).
 */
function song(): Uint8Array {
  const midi = new Midi();
  const melody = midi.addTrack();
  melody.name = 'Melody';
  melody.channel = 0;
  [60, 62, 64, 65, 67].forEach((key, index) =>
    melody.addNote({ midi: key, time: index * 0.5, duration: 0.5 }),
  );
  const pad = midi.addTrack();
  pad.name = 'Pad';
  pad.channel = 1;
  pad.addNote({ midi: 61, time: 0, duration: 2 });
  const kit = midi.addTrack();
  kit.name = 'Kit';
  kit.channel = 9;
  kit.addNote({ midi: 36, time: 0, duration: 0.25 });
  kit.addNote({ midi: 37, time: 1, duration: 0.25 });
  return midi.toArray();
}

/** Seven pure fifths from C4 (5 up, 1 down) on the white keys; the black keys are left unmapped. */
const fenFifths = parsePresetDocument({
  format: 'keyloom.preset',
  version: 1,
  name: 'Fen Fifths',
  scale: { kind: 'generated', generator: '3/2', period: '2/1', up: 5, down: 1 },
  mapping: {
    rootKey: 60,
    keysPerPeriod: 12,
    layout: [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6],
  },
});

function tuning() {
  if (!fenFifths.ok) throw new Error(fenFifths.errors[0].message);
  const built = tuningOfPreset(fenFifths.value);
  if (!built.ok) throw new Error(built.errors[0].message);
  return built.value;
}

function rollOf(reading: ReturnType<typeof writtenRoll>): SongRollNotes {
  if (!reading.ok) throw new Error(reading.message);
  return reading.roll;
}

describe('SongRoll', () => {
  async function render(roll: SongRollNotes, unmappedKeys: number[] | null = null) {
    const fixture = TestBed.createComponent(SongRoll);
    fixture.componentRef.setInput('roll', roll);
    fixture.componentRef.setInput('unmappedKeys', unmappedKeys);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const text = (selector: string) =>
      element.querySelector(selector)?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
    return { fixture, element, text };
  }

  it('draws every note of the song as written, a colour per track, drums faint', async () => {
    const { element, text } = await render(rollOf(writtenRoll(song())));
    expect(element.querySelectorAll('rect.note').length).toBe(8);
    expect(element.querySelectorAll('rect.note.drum').length).toBe(2);
    expect(element.querySelectorAll('rect.note[data-colour="0"]').length).toBe(5);
    expect(element.querySelectorAll('rect.note[data-colour="1"]').length).toBe(1);
    const plot = element.querySelector('svg.plot')!;
    expect(plot.getAttribute('role')).toBe('img');
    expect(plot.getAttribute('aria-label')).toBe(
      'Piano roll of the song: 6 notes in 2 tracks, keys 60–67 (C4–G4); ' +
        '2 drum notes on channel 10, drawn faint',
    );
    const legend = Array.from(element.querySelectorAll('.legend .track-entry')).map((entry) => [
      entry.querySelector('.track-name')!.textContent!.trim(),
      entry.querySelector('.channel')!.textContent!.trim(),
    ]);
    expect(legend).toEqual([
      ['Melody', 'channel 1'],
      ['Pad', 'channel 2'],
      ['Kit', 'drums, channel 10'],
    ]);
    // No key table yet: nothing is marked.
    expect(element.querySelector('rect.note.unmapped')).toBeNull();
    expect(text('.unmapped-entry')).toBe('');
  });

  it('marks and counts the notes on keys the tuning leaves unmapped, drums aside', async () => {
    const unmapped = tuning()
      .keys.filter((entry) => entry.hz === null)
      .map((entry) => entry.key);
    // The layout leaves the black keys unmapped: C♯4 (61) among them, and C♯2 (37), a drum here.
    expect(unmapped).toContain(61);
    expect(unmapped).toContain(37);
    const { element, text } = await render(rollOf(writtenRoll(song())), unmapped);
    const marked = element.querySelectorAll<SVGRectElement>('rect.note.unmapped');
    expect(marked.length).toBe(1);
    expect(marked[0].style.fill).toMatch(/^url\("?#song-roll-\d+-hatch"?\)$/);
    expect(marked[0].querySelector('title')!.textContent).toContain('C#4 (key 61), Pad');
    expect(marked[0].querySelector('title')!.textContent).toContain('on an unmapped key');
    expect(text('.unmapped-count')).toBe('1');
    expect(element.querySelector('svg.plot')!.getAttribute('aria-label')).toContain(
      'keys 60–67 (C4–G4), 1 on keys the tuning leaves unmapped; 2 drum notes',
    );
  });

  it('colours each retuned note by its cents from 12-tone equal temperament', async () => {
    const retuned = retuneSong(song(), tuning(), 'mts', 0);
    if (!retuned.ok) throw new Error(retuned.errors[0].message);
    const { element, text } = await render(rollOf(retunedRoll(retuned.value.bytes)));
    // The drums are not sounded; the six other notes are drawn.
    expect(element.querySelectorAll('rect.note').length).toBe(6);
    const titles = Array.from(element.querySelectorAll('rect.note title')).map(
      (title) => title.textContent!,
    );
    // From memory: pure fifths from C give D = 9/8 (203.910 cents), E = 81/64 (407.820 cents), F =
    // 4/3 (498.045 cents), G = 3/2 (701.955 cents); against 200, 400, 500 and 700 that is +3.9,
    // +7.8, −2.0 and +2.0 cents.
    expect(titles.find((title) => title.startsWith('D4'))).toContain(
      '+3.9¢ from 12-tone equal temperament',
    );
    expect(titles.find((title) => title.startsWith('E4'))).toContain('+7.8¢');
    expect(titles.find((title) => title.startsWith('F4'))).toContain('−2.0¢');
    expect(titles.find((title) => title.startsWith('G4'))).toContain('+2.0¢');
    // C♯4 is unmapped and keeps its equal-tempered pitch; C4 is the root.
    expect(titles.find((title) => title.startsWith('C#4'))).toContain('±0.0¢');
    // The shades begin at 1, 3, 6, 12 and 25 cents either way: E4 is in the third sharp one, F4 in
    // the first flat.
    expect(element.querySelector('rect.note[data-shade="3"] title')!.textContent).toMatch(/^E4/);
    expect(element.querySelector('rect.note[data-shade="-1"] title')!.textContent).toMatch(/^F4/);
    expect(element.querySelectorAll('rect.note[data-shade="0"]').length).toBe(2);
    expect(text('.cents-range')).toContain('from −2.0¢ to +7.8¢');
    expect(text('.cents-range')).toContain('2 drum notes (channel 10) are left out');
    const scale = Array.from(element.querySelectorAll('.scale-label')).map((label) =>
      label.textContent!.trim(),
    );
    expect(scale).toEqual(['−25', '−12', '−6', '−3', '−1', '0', '+1', '+3', '+6', '+12', '+25']);
    expect(
      element.querySelector('.scale-step[title="+6 to +12¢"] .swatch')!.getAttribute('data-shade'),
    ).toBe('3');
    expect(element.querySelector('.scale')!.getAttribute('aria-labelledby')).toBe(
      element.querySelector('.scale-title')!.id,
    );
    expect(element.querySelector('svg.plot')!.getAttribute('aria-label')).toBe(
      'Piano roll of the retuned song: 6 notes, keys 60–67 (C4–G4); ' +
        'from −2.0¢ to +7.8¢ from 12-tone equal temperament',
    );
  });

  it('says so when a song has no notes', async () => {
    const empty = new Midi();
    empty.addTrack();
    const { element, text } = await render(rollOf(writtenRoll(empty.toArray())));
    expect(element.querySelector('svg')).toBeNull();
    expect(text('.empty')).toBe('The song has no notes to draw.');
  });

  it('answers a file that is not a song with the fault, not a throw', () => {
    const reading = writtenRoll(new Uint8Array([0x50, 0x4b, 3, 4]));
    expect(reading.ok).toBeFalse();
    expect(reading.ok ? '' : reading.message).toContain('cannot be read as a Standard MIDI File');
  });
});
