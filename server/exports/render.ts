// One export of a preset as a file: the shared catalogue's formats, and the tuner sheet, which needs Node's PDF
// writer. The bundle is streamed on its own (bundle.ts).
import { exportFormats, renderExport } from '../../shared/export/export-catalogue';
import type { ResolvedPreset } from '../../shared/preset/preset-document';
import type { FieldError } from '../../shared/result';
import { HttpError } from '../http/errors';
import { ValidationError } from '../http/validation';
import { exportFileName } from '../../shared/export/export-file-name';
import { tunerSheetOffThread } from '../work/worker-pool';
import type { SheetRevision } from './tuner-sheet';

export interface ExportedFile {
  fileName: string;
  contentType: string;
  bytes: Buffer;
  warnings: FieldError[];
}

const allFormatIds = [...exportFormats.map((f) => f.id), 'tuner-sheet', 'bundle'];

export async function renderFile(
  preset: ResolvedPreset,
  format: string,
  at: SheetRevision,
): Promise<ExportedFile> {
  if (format === 'tuner-sheet') {
    const bytes = await tunerSheetOffThread({ preset, at });
    return {
      fileName: `${exportFileName(preset.name, '')}-tuner-sheet.pdf`,
      contentType: 'application/pdf',
      bytes,
      warnings: [],
    };
  }
  if (!allFormatIds.includes(format)) {
    throw new HttpError(
      400,
      'unknown_format',
      `format: "${format}" is not an export; choose one of ${allFormatIds.join(', ')}.`,
      'format',
    );
  }
  const file = renderExport(preset, format);
  if (!file.ok) throw new ValidationError(file.errors);
  return { ...file.value, bytes: Buffer.from(file.value.bytes) };
}
