// What changed between two revisions of a preset, in a musician's terms: degrees added, removed or moved, and
// the mapping and output settings that differ.
import type { ResolvedPreset } from '../preset/preset-document';
import { ratioToString } from '../tuning/interval';
import type { IntervalSize } from '../tuning/interval-size';
import { buildScale } from '../tuning/scale';

export interface DegreeJson {
  ratio: string | null;
  cents: number;
}

export interface SettingChange {
  field: string;
  from: unknown;
  to: unknown;
}

export interface RevisionChanges {
  degreesAdded: DegreeJson[];
  degreesRemoved: DegreeJson[];
  degreesMoved: { from: DegreeJson; to: DegreeJson; byCents: number }[];
  settings: SettingChange[];
  /** The whole summary as sentences, for lists and e-mails. */
  lines: string[];
}

/** Degrees this close (in cents) count as the same degree. */
const sameDegreeCents = 1e-6;

function degreesOf(preset: ResolvedPreset): DegreeJson[] {
  const built = buildScale(preset.scale);
  if (!built.ok) return [];
  return built.value.degrees.map((d: IntervalSize) => ({
    ratio: d.ratio ? ratioToString(d.ratio) : null,
    cents: d.cents,
  }));
}

const show = (d: DegreeJson) =>
  d.ratio ? `${d.ratio} (${d.cents.toFixed(2)}c)` : `${d.cents.toFixed(2)}c`;
const showValue = (v: unknown) => (v === undefined || v === null ? 'none' : JSON.stringify(v));

function settingChanges(before: ResolvedPreset, after: ResolvedPreset): SettingChange[] {
  const pairs: [string, unknown, unknown][] = [
    ['name', before.name, after.name],
    ['notes', before.notes, after.notes],
    ['scale.kind', before.scale.kind, after.scale.kind],
    ...(['rootKey', 'rootHz', 'anchor', 'concertA', 'keysPerPeriod', 'layout'] as const).map(
      (f): [string, unknown, unknown] => [`mapping.${f}`, before.mapping[f], after.mapping[f]],
    ),
    ...(
      [
        'deviceId',
        'program',
        'bank',
        'tuningName',
        'bendRange',
        'memberChannels',
        'samples',
      ] as const
    ).map((f): [string, unknown, unknown] => [`output.${f}`, before.output[f], after.output[f]]),
  ];
  return pairs
    .filter(([, from, to]) => JSON.stringify(from) !== JSON.stringify(to))
    .map(([field, from, to]) => ({ field, from, to }));
}

/**
 * Degrees present in both (same size) are unchanged; the rest are paired in order of size as moved, and what is
 * left over on either side was added or removed.
 */
export function summarizeChanges(before: ResolvedPreset, after: ResolvedPreset): RevisionChanges {
  const old = degreesOf(before);
  const fresh = degreesOf(after);
  const unmatchedOld = old.filter(
    (d) => !fresh.some((e) => Math.abs(e.cents - d.cents) < sameDegreeCents),
  );
  const unmatchedNew = fresh.filter(
    (d) => !old.some((e) => Math.abs(e.cents - d.cents) < sameDegreeCents),
  );
  const paired = Math.min(unmatchedOld.length, unmatchedNew.length);
  const degreesMoved = unmatchedOld
    .slice(0, paired)
    .map((from, i) => ({ from, to: unmatchedNew[i], byCents: unmatchedNew[i].cents - from.cents }));
  const degreesRemoved = unmatchedOld.slice(paired);
  const degreesAdded = unmatchedNew.slice(paired);
  const settings = settingChanges(before, after);
  const lines = [
    ...degreesMoved.map(
      (m) =>
        `Degree ${show(m.from)} moved to ${show(m.to)} (${m.byCents > 0 ? '+' : ''}${m.byCents.toFixed(2)}c).`,
    ),
    ...degreesAdded.map((d) => `Degree ${show(d)} added.`),
    ...degreesRemoved.map((d) => `Degree ${show(d)} removed.`),
    ...settings.map((s) => `${s.field} changed from ${showValue(s.from)} to ${showValue(s.to)}.`),
  ];
  return {
    degreesAdded,
    degreesRemoved,
    degreesMoved,
    settings,
    lines: lines.length ? lines : ['No changes.'],
  };
}
