import type { PresetAccess } from '@shared/api/roles';
import { Injectable, computed, linkedSignal, signal } from '@angular/core';
import { type ResolvedPreset, parsePresetAndScale } from '@shared/preset/preset-document';
import type { FieldError } from '@shared/result';
import type { PreviewTable } from '@shared/tuning/preview';
import { keptTable } from './kept-table';
import { nearestKeyLayout } from '../keys/nearest-key-layout';
import {
  type DraftDocument,
  type DraftMapping,
  type DraftOutput,
  type DraftScale,
  type DraftTemper,
  type ScaleKind,
  type Typed,
  newDraft,
  startingScale,
  typedFrom,
} from './draft-document';

/** Where a loaded design came from: a saved preset, and what the signed-in member may do with it. */
interface SavedOrigin {
  id: string;
  revision: number;
  bandId: string | null;
  access: PresetAccess;
}

/** A design that built: the checked document and everything the designer shows about it. */
interface ShownDesign {
  preset: ResolvedPreset;
  table: PreviewTable;
}

type ScaleField =
  'generator' | 'period' | 'up' | 'down' | 'divisions' | 'degrees' | 'from' | 'to' | 'sub';
type MappingField = 'rootKey' | 'rootHz' | 'concertA';

/** How the design's pitch is set: the root from concert A, the root's pitch typed, or one key tuned to a pitch. */
export type PitchSource = 'concert' | 'root' | 'anchor';
type OutputField = 'deviceId' | 'program' | 'bank' | 'tuningName' | 'bendRange';

/** The document paths that have a field of their own; faults elsewhere are listed above the analysis. */
const fieldPaths = [
  'name',
  'scale.generator',
  'scale.period',
  'scale.up',
  'scale.down',
  'scale.temper.comma',
  'scale.temper.fraction',
  'scale.temper',
  'scale.divisions',
  'scale.degrees',
  'scale.from',
  'scale.to',
  'scale.sub',
  'mapping.rootKey',
  'mapping.rootHz',
  'mapping.concertA',
  'mapping.keysPerPeriod',
  'mapping.layout',
  'mapping.anchor',
  'output.deviceId',
  'output.program',
  'output.bank',
  'output.tuningName',
  'output.bendRange',
  'output.memberChannels',
  'output.samples',
];

/** Whether a fault at `path` belongs to the field at `field` (`scale.degrees[3]` belongs to `scale.degrees`). */
function isUnder(path: string, field: string): boolean {
  return path === field || path.startsWith(`${field}.`) || path.startsWith(`${field}[`);
}

/** JSON with keys in a fixed order, so that a field removed and written again still compares equal. */
function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, inner: unknown) =>
    inner && typeof inner === 'object' && !Array.isArray(inner)
      ? Object.fromEntries(Object.entries(inner).sort(([a], [b]) => a.localeCompare(b)))
      : inner,
  );
}

/**
 * After `up` or `down` changed, the chain's links keep their places between the same notes: links that no longer
 * exist go, new ones start pure. Nothing changes unless the chain is tempered link by link.
 */
function withChainLength(before: DraftScale, after: DraftScale): DraftScale {
  if (before.kind !== 'generated' || after.kind !== 'generated' || !Array.isArray(after.temper))
    return after;
  const count = (value: Typed | undefined) =>
    typeof value === 'number' && Number.isInteger(value) && value >= 0 ? value : null;
  const [downBefore, upAfter, downAfter] = [
    count(before.down ?? 0),
    count(after.up),
    count(after.down ?? 0),
  ];
  if (downBefore === null || upAfter === null || downAfter === null) return after;
  const links = after.temper;
  const temper = Array.from(
    { length: upAfter + downAfter },
    (_, index) => links[index - downAfter + downBefore] ?? null,
  );
  return { ...after, temper };
}

/** Sets a field, or removes it when the value is undefined. */
function withField<T extends object>(target: T, field: string, value: unknown): T {
  const next = { ...target } as Record<string, unknown>;
  if (value === undefined) delete next[field];
  else next[field] = value;
  return next as T;
}

/**
 * The design being edited and everything computed from it, recomputed in the browser on every
 * change: the checked document, the preview table, the faults by field. One per designer page.
 */
@Injectable()
export class DesignState {
  private readonly draftDocument = signal<DraftDocument>(newDraft());
  private readonly savedJson = signal<string | null>(null);
  private readonly shelvedScales = new Map<ScaleKind, DraftScale>();
  /** The layout that key-count changes cut from and grow back to, so that 12 → 1 → 19 loses nothing. */
  private widestLayout: (number | null)[] | null = null;

  readonly draft = this.draftDocument.asReadonly();
  readonly origin = signal<SavedOrigin | null>(null);
  /** The checked document, and the scale built on the way, which the preview table takes rather than building again. */
  private readonly parsed = computed(() => parsePresetAndScale(this.draft()));
  /**
   * The last design that built: while a field is being retyped, the pictures keep showing it. Parts of the table an
   * edit left as they were stay the same objects (kept-table.ts), so the pictures of those parts are not redrawn.
   */
  readonly shown = linkedSignal<ReturnType<typeof parsePresetAndScale>, ShownDesign | null>({
    source: this.parsed,
    computation: (parsed, previous) => {
      if (!parsed.ok) return previous?.value ?? null;
      const { preset, scale } = parsed.value;
      return { preset, table: keptTable(previous?.value ?? null, preset, scale) };
    },
  }).asReadonly();
  readonly stale = computed(() => !this.parsed().ok);
  readonly faults = computed<FieldError[]>(() => {
    const parsed = this.parsed();
    return parsed.ok ? [] : parsed.errors;
  });
  private readonly warnings = computed(() =>
    this.parsed().ok ? (this.shown()?.table.warnings ?? []) : [],
  );
  /** Faults no field shows, and what the built scale warns about (degrees that coincide). */
  readonly generalNotices = computed(() => [
    ...this.faults().filter((fault) => !fieldPaths.some((field) => isUnder(fault.path, field))),
    ...this.warnings().filter((warning) => !isUnder(warning.path, 'mapping')),
  ]);
  /** What the built design warns about its keys: those whose pitch MTS cannot express. */
  readonly keyNotices = computed(() =>
    this.warnings().filter((warning) => isUnder(warning.path, 'mapping')),
  );
  readonly readOnly = computed(() => this.origin()?.access === 'read');
  /** True when the draft differs from the saved revision, and always for a design never saved. */
  readonly dirty = computed(() => this.savedJson() !== canonicalJson(this.draft()));
  readonly scaleSize = computed(() => this.shown()?.table.analysis.size ?? 0);
  readonly layout = computed(() => this.draft().mapping.layout ?? null);
  readonly keysPerPeriod = computed(() => this.layout()?.length ?? this.scaleSize());
  readonly pitchSource = computed<PitchSource>(() => {
    const { anchor, rootHz } = this.draft().mapping;
    return anchor ? 'anchor' : rootHz !== undefined ? 'root' : 'concert';
  });
  /** True while the next key pressed on the strip becomes the anchor key. */
  readonly pickingAnchorKey = signal(false);
  /**
   * True while a new design lays a scale of fewer than 12 degrees in an octave on its nearest keys as it is edited
   * (seven degrees on the white keys, not on seven keys in a row). Laying out keys by hand, or opening a saved
   * design, turns it off.
   */
  readonly nearestKeysByDefault = signal(true);

  constructor() {
    this.followNearestKeys();
  }

  /** The fault at a field (else the first inside it), without the path that the field already names. */
  faultAt(field: string): string | null {
    const faults = this.faults();
    const fault =
      faults.find((candidate) => candidate.path === field) ??
      faults.find((candidate) => isUnder(candidate.path, field));
    if (!fault) return null;
    const prefix = `${fault.path}: `;
    return fault.message.startsWith(prefix) ? fault.message.slice(prefix.length) : fault.message;
  }

  /** Opens a document: from a saved preset (with its origin) or from an address (origin null). */
  open(draft: DraftDocument, origin: SavedOrigin | null): void {
    this.draftDocument.set(draft);
    this.origin.set(origin);
    this.savedJson.set(origin ? canonicalJson(draft) : null);
    this.shelvedScales.clear();
    this.widestLayout = null;
    this.nearestKeysByDefault.set(false);
  }

  /** Brings back edits that the address kept on top of the preset just opened. */
  restoreEdits(draft: DraftDocument): void {
    this.change(() => draft);
  }

  /** The draft became revision `revision` of the saved preset. */
  markSaved(revision: number): void {
    const origin = this.origin();
    if (origin) this.origin.set({ ...origin, revision });
    this.savedJson.set(canonicalJson(this.draft()));
  }

  rename(name: string): void {
    this.change((draft) => ({ ...draft, name }));
  }

  /** Changes the kind of scale; the fields of the kind left behind come back when it is chosen again. */
  chooseKind(kind: ScaleKind): void {
    this.change((draft) => {
      if (draft.scale.kind === kind) return draft;
      this.shelvedScales.set(draft.scale.kind, draft.scale);
      return { ...draft, scale: this.shelvedScales.get(kind) ?? startingScale(kind) };
    });
    this.followNearestKeys();
  }

  setScaleField(field: ScaleField, value: Typed | string[] | boolean | undefined): void {
    this.change((draft) => {
      const scale = withField(draft.scale, field, value);
      return {
        ...draft,
        scale: field === 'up' || field === 'down' ? withChainLength(draft.scale, scale) : scale,
      };
    });
    this.followNearestKeys();
  }

  /**
   * Tempers a generated scale: every generator by one fraction of a comma, the chain link by link (a list from its
   * lowest note up, null for a pure link), or not at all (undefined).
   */
  setTemper(temper: DraftTemper | (DraftTemper | null)[] | undefined): void {
    this.change((draft) => ({ ...draft, scale: withField(draft.scale, 'temper', temper) }));
    this.followNearestKeys();
  }

  setMappingField(field: MappingField, value: Typed | undefined): void {
    this.change((draft) => ({
      ...draft,
      mapping: withField<DraftMapping>(draft.mapping, field, value),
    }));
  }

  /**
   * Chooses how the pitch is set. Tuning one key starts from A4 at concert A; typing the root's pitch starts
   * from the pitch the root has now, so that nothing moves until the musician changes it.
   */
  setPitchSource(source: PitchSource, rootHzNow: number | null): void {
    this.pickingAnchorKey.set(false);
    this.change((draft) => {
      const { anchor: _, rootHz: __, ...mapping } = draft.mapping;
      if (source === 'anchor')
        return {
          ...draft,
          mapping: { ...mapping, anchor: { key: 69, hz: mapping.concertA ?? 440 } },
        };
      if (source === 'root')
        return { ...draft, mapping: { ...mapping, rootHz: rootHzNow ?? 261.6256 } };
      return { ...draft, mapping };
    });
  }

  /** Sets the anchor key or its pitch (the other part stays as it is). */
  setAnchor(part: Partial<Record<'key' | 'hz', Typed | undefined>>): void {
    this.change((draft) => {
      const { rootHz: _, ...mapping } = draft.mapping;
      let anchor = { ...(draft.mapping.anchor ?? {}) };
      for (const [field, value] of Object.entries(part)) anchor = withField(anchor, field, value);
      return { ...draft, mapping: { ...mapping, anchor } };
    });
  }

  /** The key pressed on the strip while picking becomes the anchor key; picking then stops. */
  pickAnchorKey(key: number): void {
    if (!this.pickingAnchorKey()) return;
    this.pickingAnchorKey.set(false);
    this.setAnchor({ key });
  }

  setOutputField(field: OutputField, value: Typed | undefined): void {
    this.change((draft) => ({
      ...draft,
      output: withField<DraftOutput>(draft.output, field, value),
    }));
  }

  /** The samples of the SFZ map, as typed: `36 piano-c2.wav, 60 piano-c4.wav` (none: one sample of middle C). */
  setSamples(text: string): void {
    const samples = text
      .split(/[,\n]/)
      .map((entry) => entry.trim())
      .filter((entry) => entry !== '')
      .map((entry) => {
        const [key, ...file] = entry.split(/\s+/);
        return { key: typedFrom(key) ?? key, file: file.join(' ') };
      });
    this.change((draft) => ({
      ...draft,
      output: withField<DraftOutput>(draft.output, 'samples', samples.length ? samples : undefined),
    }));
  }

  setMemberChannel(end: 0 | 1, value: Typed | undefined): void {
    this.change((draft) => {
      const channels: [Typed | undefined, Typed | undefined] = [
        ...(draft.output.memberChannels ?? [2, 16]),
      ];
      channels[end] = value;
      return { ...draft, output: { ...draft.output, memberChannels: channels } };
    });
  }

  /**
   * Sets how many keys one period spans. A whole number from 1 to 128 cuts or grows the layout
   * (new keys unmapped); anything else stays in the field for the schema to judge.
   */
  setKeysPerPeriod(text: string): void {
    const typed = typedFrom(text) ?? text;
    if (typeof typed !== 'number' || !Number.isInteger(typed) || typed < 1 || typed > 128) {
      this.change((draft) => ({ ...draft, mapping: { ...draft.mapping, keysPerPeriod: typed } }));
      return;
    }
    this.nearestKeysByDefault.set(false);
    const base = this.widestLayout ?? this.layout() ?? this.consecutiveLayout();
    const layout = Array.from({ length: typed }, (_, index) => base[index] ?? null);
    if (layout.length > base.length) this.widestLayout = layout;
    this.writeLayout(layout);
  }

  /** Makes the key at `index` of each block play `degree`, or nothing (null). */
  assignKey(index: number, degree: number | null): void {
    this.nearestKeysByDefault.set(false);
    const layout = [...(this.layout() ?? this.consecutiveLayout())];
    layout[index] = degree;
    this.widestLayout = layout;
    this.writeLayout(layout);
  }

  /** Drops the layout: consecutive keys play consecutive degrees. */
  useConsecutiveKeys(): void {
    this.nearestKeysByDefault.set(false);
    this.widestLayout = null;
    this.writeLayout(null);
  }

  /** Puts each degree on the key of its nearest equal-tempered note; false when two would share a key. */
  placeOnNearestKeys(): boolean {
    const table = this.shown()?.table;
    if (!table) return false;
    const layout = nearestKeyLayout(
      table.degrees.map((degree) => degree.cents),
      table.analysis.period.cents,
    );
    if (!layout) return false;
    this.widestLayout = layout;
    this.writeLayout(layout);
    return true;
  }

  /**
   * While `nearestKeysByDefault` holds: a scale of fewer than 12 degrees with an octave period goes on its nearest
   * keys (when no two share one); any other scale on consecutive keys. A scale that does not build yet is left as
   * it is until it does.
   */
  private followNearestKeys(): void {
    if (!this.nearestKeysByDefault() || this.readOnly()) return;
    const { keysPerPeriod, layout: written, ...mapping } = this.draft().mapping;
    // Without a layout the draft is what the pictures are about to read: its reading serves here too.
    const parsed =
      keysPerPeriod === undefined && written === undefined
        ? this.parsed()
        : parsePresetAndScale({ ...this.draft(), mapping });
    if (!parsed.ok) return;
    const { degrees, period } = parsed.value.scale;
    const octave = Math.abs(period.cents - 1200) < 1e-6;
    const layout =
      octave && degrees.length < 12
        ? nearestKeyLayout(
            degrees.map((d) => d.cents),
            period.cents,
          )
        : null;
    if (layout || written !== undefined || keysPerPeriod !== undefined) this.writeLayout(layout);
  }

  private consecutiveLayout(): (number | null)[] {
    return Array.from({ length: this.scaleSize() }, (_, degree) => degree);
  }

  private writeLayout(layout: (number | null)[] | null): void {
    this.change((draft) => {
      const { keysPerPeriod: _, layout: __, ...mapping } = draft.mapping;
      return { ...draft, mapping: layout ? { ...mapping, layout } : mapping };
    });
  }

  /** Every edit goes through here, so that a reader's designer stays as it was loaded. */
  private change(edit: (draft: DraftDocument) => DraftDocument): void {
    if (this.readOnly()) return;
    this.draftDocument.update(edit);
  }
}
