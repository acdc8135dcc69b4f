import { Router } from 'express';
import { tuningOfPreset } from '../../shared/export/preset-tuning';
import type { RetuneAnswer, SongReport, SongReportCounts } from '../../shared/api/songs';
import { defaultLeadInMs, leadInFault } from '../../shared/midi/lead-in';
import type { RetuneMode } from '../../shared/midi/retune-report';
import { parsePresetDocument, type ResolvedPreset } from '../../shared/preset/preset-document';
import type { Database } from '../db/client';
import { exportFileName } from '../../shared/export/export-file-name';
import { documentOrThrow } from '../http/documents';
import { HttpError } from '../http/errors';
import { recordUpload, requireFile, singleUpload } from '../http/uploads';
import { ValidationError, valueOrThrow } from '../http/validation';
import { readRevision } from '../library/revisions';
import { authorizeInstrument, authorizePreset } from '../policy/policy';
import { presetForInstrument } from '../../shared/api/preset-for-instrument';
import type { InstrumentSettings } from '../../shared/api/instruments';
import { settingsOf } from './instruments';
import { retuneOffThread } from '../work/worker-pool';

/** What a file that is not MIDI looks like, so the refusal can say so. */
function whatItIs(bytes: Buffer): string {
  const start = bytes.subarray(0, 4).toString('latin1');
  if (start.startsWith('PK')) return 'a zip archive';
  if (start === '%PDF') return 'a PDF document';
  if (bytes[0] === 0xf0) return 'system exclusive data (.syx): import it instead';
  if (start === 'RIFF') return 'a RIFF file (perhaps audio)';
  return `a file that starts with ${[...bytes.subarray(0, 4)].map((b) => b.toString(16).padStart(2, '0')).join(' ')}`;
}

/** A song and a preset in, the song retuned out: with MTS messages at its start, or one note per MPE channel. */
export function retuneRouter(db: Database): Router {
  const router = Router();

  async function presetFor(
    fields: Record<string, unknown>,
    user: Express.User | undefined,
  ): Promise<ResolvedPreset> {
    if (typeof fields['presetId'] === 'string' && fields['presetId'] !== '') {
      const { preset } = await authorizePreset(db, user, fields['presetId'], 'read');
      const latest = await readRevision(db, preset.id, preset.latestRevision);
      return documentOrThrow(latest.document, 'preset');
    }
    if (typeof fields['preset'] !== 'string' || fields['preset'] === '') {
      throw new HttpError(
        400,
        'invalid',
        'preset: is required: send the preset document as JSON, or presetId.',
        'preset',
      );
    }
    let json: unknown;
    try {
      json = JSON.parse(fields['preset']);
    } catch (error) {
      throw new HttpError(
        400,
        'bad_json',
        `preset: is not valid JSON (${(error as Error).message}).`,
        'preset',
      );
    }
    const parsed = parsePresetDocument(json);
    if (!parsed.ok)
      throw new ValidationError(
        parsed.errors.map((e) => ({ path: `preset.${e.path}`, message: `preset.${e.message}` })),
      );
    return parsed.value;
  }

  /** The caller's own instrument named by the `instrument` field (404 when it is not theirs), or null. */
  async function instrumentFor(
    fields: Record<string, unknown>,
    user: Express.User | undefined,
  ): Promise<InstrumentSettings | null> {
    const id = fields['instrument'];
    if (id === undefined || id === '') return null;
    return settingsOf(await authorizeInstrument(db, user, typeof id === 'string' ? id : ''));
  }

  router.post('/api/retune', ...singleUpload('file'), async (req, res) => {
    const file = requireFile(req.file);
    const fields = (req.body ?? {}) as Record<string, unknown>;
    const instrument = await instrumentFor(fields, req.user);
    // Unless the player says otherwise, an MPE instrument takes the song as MPE, any other as MTS.
    const modeText = fields['mode'];
    const mode =
      modeText === undefined || modeText === ''
        ? instrument?.receives === 'mpe'
          ? 'mpe'
          : 'mts'
        : modeText;
    if (mode !== 'mts' && mode !== 'mpe') {
      throw new HttpError(
        400,
        'invalid',
        `mode: must be mts or mpe (got ${JSON.stringify(mode)}).`,
        'mode',
      );
    }
    const leadInText = fields['leadInMs'];
    const leadInMs =
      leadInText === undefined || leadInText === '' ? defaultLeadInMs : Number(leadInText);
    const leadInFaultText =
      typeof leadInText === 'object' ? 'must be one number of milliseconds' : leadInFault(leadInMs);
    if (leadInFaultText) {
      throw new HttpError(400, 'invalid', `leadInMs: ${leadInFaultText}.`, 'leadInMs');
    }
    if (file.buffer.subarray(0, 4).toString('latin1') !== 'MThd') {
      throw new HttpError(
        400,
        'not_midi',
        `file: is not a Standard MIDI File; it looks like ${whatItIs(file.buffer)}.`,
        'file',
      );
    }
    const own = await presetFor(fields, req.user);
    // The instrument's settings stand in for the preset's output block; the preset is not changed.
    const preset = instrument ? presetForInstrument(own, instrument) : own;
    const tuning = valueOrThrow(tuningOfPreset(preset));
    const retuned = await retuneOffThread({
      song: new Uint8Array(file.buffer),
      keys: tuning.keys,
      output: preset.output,
      keysPerPeriod: preset.mapping.keysPerPeriod,
      mode: mode as RetuneMode,
      leadInMs,
    });
    if (!retuned.ok) throw new ValidationError(retuned.errors);
    const sha256 = await recordUpload(db, req.user?.id, 'retune', file);
    const report: SongReport = { ...retuned.value.report, uploadSha256: sha256 };
    const song = file.originalname.replace(/\.midi?$/i, '');
    const fileName = `${exportFileName(song, '')}-${exportFileName(preset.name, '')}-${mode}.mid`;
    const { song: bytes } = retuned.value;
    // The header carries counts only, a few hundred bytes whatever the song: proxies refuse long headers.
    const counts: SongReportCounts = {
      mode: report.mode,
      notesRetuned: report.notesRetuned,
      channelsUsed: report.channelsUsed,
      notesStolenCount: report.notesStolenCount,
      notesUnmappedCount: report.notesUnmappedCount,
      warningsCount: report.warnings.length,
      leadIn: report.leadIn,
      uploadSha256: sha256,
    };
    res.setHeader('Keyloom-Report', encodeURIComponent(JSON.stringify(counts)));
    res.setHeader('Access-Control-Expose-Headers', 'Keyloom-Report, Keyloom-Warnings');
    // The app asks for JSON: the whole report, and the song as base64 beside it.
    if (req.accepts(['audio/midi', 'application/json']) === 'application/json') {
      const song = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString('base64');
      res.json({ fileName, report, song } satisfies RetuneAnswer);
      return;
    }
    res.type('audio/midi');
    res.setHeader('Content-Disposition', `attachment; filename="${fileName}"`);
    res.send(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
  });

  return router;
}
