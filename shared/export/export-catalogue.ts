import type { ResolvedPreset } from '../preset/preset-document';
import { type FieldError, fail, fieldError, type Result, succeed } from '../result';
import { bendTable, bendTableCsv, bendTableJson } from '../midi/bend-table';
import { encodeBankedBulkDump, encodeBulkDump } from '../midi/mts-bulk-dump';
import type { EncodedMessages } from '../midi/mts-message';
import { encodeScaleOctave1, encodeScaleOctave2, octaveOffsets } from '../midi/mts-scale-octave';
import { encodeSingleNoteChanges } from '../midi/mts-single-note';
import { sfzMap } from '../midi/sfz-map';
import { mpePhraseFile, tuningPhraseFile } from '../midi/tuning-phrase';
import { exportFileName } from './export-file-name';
import { keyTableCsv } from './key-table-csv';
import { presetDocumentFile } from './preset-export';
import { type PresetTuning, tuningOfPreset } from './preset-tuning';

/** The export formats rendered from one preset (ids are a contract: clients and links name them). */
export const exportFormats = [
  {
    id: 'mts-bulk',
    extension: 'syx',
    fileSuffix: '',
    contentType: 'application/octet-stream',
    description: 'MTS bulk tuning dump of all 128 keys, for instruments that take tuning dumps',
  },
  {
    id: 'mts-bulk-bank',
    extension: 'syx',
    fileSuffix: '-bank',
    contentType: 'application/octet-stream',
    description: 'MTS key-based tuning dump into the chosen bank and tuning program',
  },
  {
    id: 'mts-notes',
    extension: 'syx',
    fileSuffix: '-notes',
    contentType: 'application/octet-stream',
    description: 'MTS real-time single-note tuning changes for every mapped key',
  },
  {
    id: 'mts-octave-1',
    extension: 'syx',
    fileSuffix: '-octave-1',
    contentType: 'application/octet-stream',
    description: 'MTS scale/octave tuning in whole cents, for 12 keys per octave',
  },
  {
    id: 'mts-octave-2',
    extension: 'syx',
    fileSuffix: '-octave-2',
    contentType: 'application/octet-stream',
    description: 'MTS scale/octave tuning in steps of 0.0122 cents, for 12 keys per octave',
  },
  {
    id: 'smf',
    extension: 'mid',
    fileSuffix: '',
    contentType: 'audio/midi',
    description: 'MIDI file that tunes with MTS, then plays the scale up and down and a chord',
  },
  {
    id: 'mpe-smf',
    extension: 'mid',
    fileSuffix: '-mpe',
    contentType: 'audio/midi',
    description: 'MIDI file of the same phrase, one note per MPE member channel with its bend',
  },
  {
    id: 'bend-csv',
    extension: 'csv',
    fileSuffix: '-bends',
    contentType: 'text/csv; charset=utf-8',
    description: 'Pitch-bend table as CSV: channel, note, 14-bit bend and error per mapped key',
  },
  {
    id: 'bend-json',
    extension: 'json',
    fileSuffix: '-bends',
    contentType: 'application/json; charset=utf-8',
    description: 'Pitch-bend table as JSON: channel, note, 14-bit bend and error per mapped key',
  },
  {
    id: 'key-csv',
    extension: 'csv',
    fileSuffix: '-keys',
    contentType: 'text/csv; charset=utf-8',
    description:
      'Key table as CSV: every one of the 128 keys with its note, degree, Hz and cents from 12-TET',
  },
  {
    id: 'sfz',
    extension: 'sfz',
    fileSuffix: '',
    contentType: 'text/plain; charset=utf-8',
    description: 'SFZ sampler map: one region per mapped key, tuned from one sample of middle C',
  },
  {
    id: 'preset',
    extension: 'json',
    fileSuffix: '',
    contentType: 'application/json; charset=utf-8',
    description: 'The preset document itself, to keep, share or import again',
  },
] as const;

export type ExportFormatId = (typeof exportFormats)[number]['id'];

export interface RenderedExport {
  fileName: string;
  contentType: string;
  bytes: Uint8Array;
  /**
   * What the file could not hold exactly (keys clamped into range, note names left in equal
   * temperament).
   */
  warnings: FieldError[];
}

interface Rendered {
  bytes: Uint8Array;
  warnings: FieldError[];
}

const everyChannel = Array.from({ length: 16 }, (_, index) => index + 1);

function joined({ messages, warnings }: EncodedMessages): Rendered {
  const bytes = new Uint8Array(messages.reduce((length, message) => length + message.length, 0));
  let offset = 0;
  for (const message of messages) {
    bytes.set(message, offset);
    offset += message.length;
  }
  return { bytes, warnings };
}

function text(content: string, warnings: FieldError[] = []): Rendered {
  return { bytes: new TextEncoder().encode(content), warnings };
}

function scaleOctave(tuning: PresetTuning, bytesPerOffset: 1 | 2): Result<Rendered> {
  const offsets = octaveOffsets(tuning.keys, {
    keysPerPeriod: tuning.mapping.keysPerPeriod,
    periodCents: tuning.scale.period.cents,
  });
  if (!offsets.ok) return offsets;
  const target = { deviceId: tuning.output.deviceId, channels: everyChannel, realTime: true };
  const encode = bytesPerOffset === 1 ? encodeScaleOctave1 : encodeScaleOctave2;
  return succeed(joined(encode(offsets.value, target)));
}

function render(
  id: ExportFormatId,
  preset: ResolvedPreset,
  tuning: PresetTuning,
): Result<Rendered> {
  const { keys, output } = tuning;
  const phrase = { keys, mapping: tuning.mapping, output, name: preset.name };
  switch (id) {
    case 'mts-bulk':
      return succeed(joined(encodeBulkDump(keys, output)));
    case 'mts-bulk-bank':
      return succeed(joined(encodeBankedBulkDump(keys, output)));
    case 'mts-notes':
      return succeed(
        joined(encodeSingleNoteChanges(keys, output, { withBank: output.bank !== 0 })),
      );
    case 'mts-octave-1':
      return scaleOctave(tuning, 1);
    case 'mts-octave-2':
      return scaleOctave(tuning, 2);
    case 'smf':
      return succeed(tuningPhraseFile(phrase));
    case 'mpe-smf':
      return succeed(mpePhraseFile(phrase));
    case 'bend-csv': {
      const table = bendTable(keys, output);
      return succeed(text(bendTableCsv(table), table.warnings));
    }
    case 'bend-json': {
      const table = bendTable(keys, output);
      return succeed(text(bendTableJson(table), table.warnings));
    }
    case 'key-csv':
      return succeed(text(keyTableCsv(keys)));
    case 'sfz': {
      const map = sfzMap(keys, { name: preset.name, samples: preset.output.samples });
      return succeed(text(map.text, map.warnings));
    }
    case 'preset':
      return succeed(text(presetDocumentFile(preset)));
  }
}

/**
 * Renders one export of a preset (one that `parsePresetDocument` returned): the file's name made
 * from the preset name, its content type and bytes, and warnings for whatever the format could not
 * hold exactly. An unknown format, or a form the tuning does not fit (scale/octave tuning of a
 * 13-key layout), is refused with the reason.
 */
export function renderExport(preset: ResolvedPreset, format: string): Result<RenderedExport> {
  const entry = exportFormats.find((candidate) => candidate.id === format);
  if (!entry) {
    const known = exportFormats.map((candidate) => candidate.id).join(', ');
    const fault = `${JSON.stringify(format)} is not an export format; the formats are ${known}`;
    return fail([fieldError('format', fault)]);
  }
  const tuning = tuningOfPreset(preset);
  if (!tuning.ok) return tuning;
  const rendered = render(entry.id, preset, tuning.value);
  if (!rendered.ok) return rendered;
  return succeed({
    fileName: exportFileName(preset.name, `${entry.fileSuffix}.${entry.extension}`),
    contentType: entry.contentType,
    bytes: rendered.value.bytes,
    warnings: rendered.value.warnings,
  });
}
