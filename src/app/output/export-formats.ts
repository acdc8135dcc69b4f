/** A file the server makes from a preset (the ids are a contract). */
export interface ExportFormat {
  id: string;
  label: string;
  extension: string;
  /** One line on what the file is for. */
  use: string;
}

export const exportFormats: readonly ExportFormat[] = [
  {
    id: 'mts-bulk',
    label: 'MTS bulk dump',
    extension: 'syx',
    use: 'All 128 keys in one message, for synths that take a tuning dump.',
  },
  {
    id: 'mts-bulk-bank',
    label: 'MTS bulk dump with bank',
    extension: 'syx',
    use: 'The same dump addressed to a tuning bank and program.',
  },
  {
    id: 'mts-notes',
    label: 'MTS single-note changes',
    extension: 'syx',
    use: 'Real-time changes for every mapped key; they apply while you play.',
  },
  {
    id: 'mts-octave-1',
    label: 'MTS scale/octave, 1-byte',
    extension: 'syx',
    use: 'Twelve offsets repeated in every octave, in whole cents; 12-key layouts only.',
  },
  {
    id: 'mts-octave-2',
    label: 'MTS scale/octave, 2-byte',
    extension: 'syx',
    use: 'Twelve finer offsets repeated in every octave; 12-key layouts only.',
  },
  {
    id: 'smf',
    label: 'MIDI file with the tuning',
    extension: 'mid',
    use: 'The tuning at the start, then a short phrase that walks the scale.',
  },
  {
    id: 'mpe-smf',
    label: 'MPE MIDI file',
    extension: 'mid',
    use: 'The same phrase as one note per channel with pitch bends, for synths without MTS.',
  },
  {
    id: 'bend-csv',
    label: 'Pitch-bend table (CSV)',
    extension: 'csv',
    use: 'Per key: channel, note to play, 14-bit bend and the error left, for spreadsheets.',
  },
  {
    id: 'bend-json',
    label: 'Pitch-bend table (JSON)',
    extension: 'json',
    use: 'The same table for scripts and plug-ins.',
  },
  {
    id: 'key-csv',
    label: 'Key table (CSV)',
    extension: 'csv',
    use: 'All 128 keys: note, degree, Hz and cents from 12-tone equal, mapped or not.',
  },
  {
    id: 'sfz',
    label: 'SFZ sampler map',
    extension: 'sfz',
    use: 'A region per mapped key with its pitch centre and fine tune.',
  },
  {
    id: 'tuner-sheet',
    label: 'Tuner sheet',
    extension: 'pdf',
    use: 'A printable page of cent offsets per note, for tuning acoustic instruments.',
  },
  {
    id: 'preset',
    label: 'Preset document',
    extension: 'json',
    use: 'This design as a Keyloom preset file, to import or keep.',
  },
  {
    id: 'bundle',
    label: 'Bundle of everything',
    extension: 'zip',
    use: 'Every file above that applies, with a read-me on what each is for.',
  },
];
