/** A file a preset can be downloaded as (ids are the contract of DESIGN.md's export table). */
interface ExportFormat {
  id: string;
  label: string;
  /** What the file is for, in one line. */
  about: string;
  /** Scale/octave tuning carries 12 notes per octave and is refused for other layouts. */
  twelvePerOctaveOnly?: boolean;
}

export const exportFormats: readonly ExportFormat[] = [
  { id: 'mts-bulk', label: 'MTS bulk dump (.syx)', about: 'All 128 keys in one message, for synths that take MTS.' },
  { id: 'mts-bulk-bank', label: 'MTS bulk dump with bank (.syx)', about: 'The same, into a chosen tuning bank.' },
  { id: 'mts-notes', label: 'MTS single-note changes (.syx)', about: 'Real-time changes for every mapped key.' },
  {
    id: 'mts-octave-1', label: 'MTS scale/octave, 1 byte (.syx)', about: 'Twelve offsets that repeat every octave.',
    twelvePerOctaveOnly: true,
  },
  {
    id: 'mts-octave-2', label: 'MTS scale/octave, 2 bytes (.syx)', about: 'The same with finer steps.',
    twelvePerOctaveOnly: true,
  },
  { id: 'smf', label: 'MIDI file with the tuning (.mid)', about: 'Tuning messages at the start, then a phrase that walks the scale.' },
  { id: 'mpe-smf', label: 'MPE MIDI file (.mid)', about: 'One note per channel with pitch bends, for synths without MTS.' },
  { id: 'bend-csv', label: 'Pitch-bend table (.csv)', about: 'Per key: channel, note to play, bend value and what is left over.' },
  { id: 'bend-json', label: 'Pitch-bend table (.json)', about: 'The same table for scripts.' },
  { id: 'sfz', label: 'SFZ sampler map (.sfz)', about: 'A region per mapped key with its pitch centre and fine tune.' },
  { id: 'tuner-sheet', label: 'Tuner sheet (.pdf)', about: 'Printable cents offsets per note, for acoustic instruments.' },
  { id: 'preset', label: 'Preset document (.json)', about: 'The preset itself, to import into Keyloom again.' },
];
