import { parsePresetDocument } from '@shared/preset/preset-document';
import { uploadFault } from './upload-limit';

/** A preset file read in the browser: the document and its name, or what is wrong with it, field by field. */
export type PresetFile =
  { ok: true; document: unknown; name: string } | { ok: false; faults: string[] };

/** Reads a preset .json the musician chose and checks it with the same code the server runs. */
export async function readPresetFile(file: File): Promise<PresetFile> {
  const fault = uploadFault(file);
  if (fault) return { ok: false, faults: [fault] };
  let document: unknown;
  try {
    document = JSON.parse(await file.text());
  } catch (error) {
    return {
      ok: false,
      faults: [
        `“${file.name}” is not a preset file: it is not valid JSON (${(error as Error).message}).`,
      ],
    };
  }
  const parsed = parsePresetDocument(document);
  if (!parsed.ok) return { ok: false, faults: parsed.errors.map((error) => error.message) };
  return { ok: true, document, name: parsed.value.name };
}
