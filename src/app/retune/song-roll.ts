import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { noteName } from '@shared/tuning/twelve-edo';
import { signedCentsText } from '../scale/cents-text';
import type { RollNote, SongRollNotes } from './roll-notes';

/** More notes than this make a slow page; the first ones are drawn and the rest counted. */
const drawnAtMost = 3000;
/**
 * Time gets at least this much width, up to the widest plot; past the frame's width the roll
 * scrolls.
 */
const leastPixelsPerSecond = 24;
const widestPlot = 12_000;
const axisWidth = 34;
const timeAxisHeight = 18;
const trackColours = 6;
/**
 * Where each shade of colour begins, in cents from 12-tone equal temperament either way: finer near
 * 0, where the tunings most songs are retuned to lie (a pure fifth is 2 cents from the tempered
 * one, a just third 14).
 */
const shadeFrom = [1, 3, 6, 12, 25];
const blackKeys = new Set([1, 3, 6, 8, 10]);
/** Seconds between time marks, the first that leaves room enough between them. */
const timeSteps = [0.1, 0.2, 0.5, 1, 2, 5, 10, 15, 30, 60, 120, 300, 600];

let rollsMade = 0;

interface NoteShape {
  x: string;
  y: number;
  width: string;
  colour: number | null;
  shade: number | null;
  drum: boolean;
  unmapped: boolean;
  title: string;
}

function clock(seconds: number, digits = 0): string {
  const minutes = Math.floor(seconds / 60);
  const rest = seconds - minutes * 60;
  const text = rest.toFixed(digits);
  return `${minutes}:${Number(text) < 10 ? '0' : ''}${text}`;
}

function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}

function percent(value: number): string {
  return `${value.toFixed(3)}%`;
}

function shadeOf(cents: number): number {
  return Math.sign(cents) * shadeFrom.filter((from) => Math.abs(cents) >= from).length;
}

/**
 * A shade's lower bound as its label (`+6`, `−25`, `0`) and the span it covers, for its tooltip.
 */
function shadeStep(shade: number): { shade: number; label: string; span: string } {
  const size = Math.abs(shade);
  const sign = shade < 0 ? '−' : '+';
  if (size === 0) return { shade, label: '0', span: `within ±${shadeFrom[0]}¢` };
  const upper = size < shadeFrom.length ? ` to ${sign}${shadeFrom[size]}¢` : '¢ or more';
  return {
    shade,
    label: `${sign}${shadeFrom[size - 1]}`,
    span: `${sign}${shadeFrom[size - 1]}${upper}`,
  };
}

/**
 * A song as a piano roll: time across, keys up. The song as written gets a colour per track, drums
 * (channel 10) faint, and the notes on keys the tuning leaves unmapped hatched in the error colour;
 * the retuned song gets a colour per note for how far it lies from 12-tone equal temperament. The
 * frame scrolls sideways on its own.
 */
@Component({
  selector: 'app-song-roll',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let song = roll();
    @if (song.notes.length === 0) {
      <p class="empty">
        {{
          song.kind === 'written'
            ? 'The song has no notes to draw.'
            : 'The retuned song has no notes to draw outside channel 10 (drums).'
        }}
      </p>
    } @else {
      <div class="frame">
        <svg class="keys" aria-hidden="true" [attr.width]="axisWidth" [attr.height]="height()">
          @for (label of keyLabels(); track label.key) {
            <text [attr.x]="axisWidth - 4" [attr.y]="label.y">{{ label.name }}</text>
          }
        </svg>
        <div class="scroller" tabindex="0">
          <svg
            class="plot"
            role="img"
            [attr.aria-label]="label()"
            [attr.height]="height()"
            [style.min-width.px]="minWidth()"
          >
            <defs>
              <pattern
                [attr.id]="hatchId"
                patternUnits="userSpaceOnUse"
                width="4"
                height="4"
                patternTransform="rotate(45)"
              >
                <rect class="hatch-ground" width="4" height="4" />
                <line class="hatch-line" x1="1" y1="0" x2="1" y2="4" />
              </pattern>
            </defs>
            <rect class="ground" width="100%" [attr.height]="plotHeight()" />
            @for (y of blackRows(); track y) {
              <rect class="black-row" width="100%" [attr.y]="y" [attr.height]="rowHeight()" />
            }
            @for (tick of timeTicks(); track tick.x) {
              <line
                class="time-line"
                [attr.x1]="tick.x"
                [attr.x2]="tick.x"
                y1="0"
                [attr.y2]="plotHeight()"
              />
              <text
                class="time"
                [class.first]="$first"
                [attr.x]="tick.x"
                [attr.y]="plotHeight() + 13"
              >
                {{ tick.label }}
              </text>
            }
            @for (note of shapes(); track $index) {
              <rect
                class="note"
                [class.drum]="note.drum"
                [class.unmapped]="note.unmapped"
                [attr.data-colour]="note.colour"
                [attr.data-shade]="note.shade"
                [attr.x]="note.x"
                [attr.y]="note.y"
                [attr.width]="note.width"
                [attr.height]="noteHeight()"
                [style.fill]="note.unmapped ? hatchFill : null"
              >
                <title>{{ note.title }}</title>
              </rect>
            }
          </svg>
        </div>
      </div>
      @if (song.notes.length > drawnAtMost) {
        <p class="note-cap">
          The first {{ drawnAtMost }} of {{ song.notes.length }} notes are drawn.
        </p>
      }
      @if (song.kind === 'written') {
        <ul class="legend" aria-label="Legend">
          @for (track of song.tracks; track $index) {
            <li class="track-entry">
              <span
                class="swatch"
                [class.drum]="track.drums"
                [attr.data-colour]="$index % trackColours"
              ></span>
              <span class="track-name">{{ track.name }}</span>
              <span class="channel">{{
                track.drums ? 'drums, channel 10' : 'channel ' + track.channel
              }}</span>
            </li>
          }
          @if (unmappedCount(); as count) {
            <li class="unmapped-entry" [class.none]="count.notes === 0">
              <span class="swatch hatch"></span>
              <span>
                On keys the tuning leaves unmapped (they keep their old pitch):
                <strong class="unmapped-count">{{ count.notes }}</strong>
              </span>
            </li>
          }
        </ul>
      } @else {
        <div class="scale" role="group" [attr.aria-labelledby]="scaleId">
          <span class="scale-title" [id]="scaleId"
            >Cents from 12-tone equal temperament, flat to sharp</span
          >
          <span class="scale-steps">
            @for (step of scaleSteps; track step.shade) {
              <span class="scale-step" [attr.title]="step.span">
                <span class="swatch" [attr.data-shade]="step.shade"></span>
                <span class="scale-label">{{ step.label }}</span>
              </span>
            }
          </span>
        </div>
        @if (centsRange(); as range) {
          <p class="cents-range">
            Each note's distance from 12-tone equal temperament: from
            <strong>{{ range.low }}</strong> to <strong>{{ range.high }}</strong>.
            @if (song.drumNotesLeftOut) {
              {{ song.drumNotesLeftOut }} drum notes (channel 10) are left out.
            }
          </p>
        }
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .frame {
      display: grid;
      grid-template-columns: auto minmax(0, 1fr);
      align-items: start;
    }
    .keys {
      display: block;
      font: var(--mat-sys-label-small);
    }
    .keys text {
      fill: var(--mat-sys-on-surface-variant);
      text-anchor: end;
      font-size: 10px;
    }
    .scroller {
      overflow-x: auto;
      border-radius: var(--mat-sys-corner-extra-small);
    }
    .scroller:focus-visible {
      outline: 2px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .plot {
      display: block;
      width: 100%;
    }
    .ground {
      fill: var(--mat-sys-surface-container-lowest);
    }
    .black-row {
      fill: var(--mat-sys-surface-container-high);
    }
    .time-line {
      stroke: var(--mat-sys-outline-variant);
      stroke-width: 1;
    }
    .time {
      fill: var(--mat-sys-on-surface-variant);
      font-size: 10px;
      text-anchor: middle;
    }
    .time.first {
      text-anchor: start;
    }
    .hatch-ground {
      fill: var(--mat-sys-error-container);
    }
    .hatch-line {
      stroke: var(--mat-sys-error);
      stroke-width: 1.5;
    }

    /* Two hues in the theme: tracks differ by hue and strength; error is for unmapped keys. */
    [data-colour='0'] {
      --colour: var(--mat-sys-primary);
    }
    [data-colour='1'] {
      --colour: var(--mat-sys-tertiary);
    }
    [data-colour='2'] {
      --colour: color-mix(in srgb, var(--mat-sys-primary) 45%, var(--mat-sys-surface));
    }
    [data-colour='3'] {
      --colour: var(--mat-sys-on-surface);
    }
    [data-colour='4'] {
      --colour: color-mix(in srgb, var(--mat-sys-tertiary) 45%, var(--mat-sys-surface));
    }
    [data-colour='5'] {
      --colour: var(--mat-sys-secondary);
    }
    [data-shade] {
      --tone: var(--mat-sys-tertiary);
      --strength: 0%;
      --colour: color-mix(in srgb, var(--tone) var(--strength), var(--mat-sys-outline));
    }
    [data-shade^='-'] {
      --tone: var(--mat-sys-primary);
    }
    [data-shade='1'],
    [data-shade='-1'] {
      --strength: 40%;
    }
    [data-shade='2'],
    [data-shade='-2'] {
      --strength: 60%;
    }
    [data-shade='3'],
    [data-shade='-3'] {
      --strength: 76%;
    }
    [data-shade='4'],
    [data-shade='-4'] {
      --strength: 90%;
    }
    [data-shade='5'],
    [data-shade='-5'] {
      --strength: 100%;
    }

    .note {
      fill: var(--colour);
    }
    .note.drum {
      fill: var(--mat-sys-on-surface-variant);
      opacity: 0.3;
    }
    .note.unmapped {
      stroke: var(--mat-sys-error);
      stroke-width: 1;
    }

    .swatch {
      display: inline-block;
      flex: none;
      width: 14px;
      height: 10px;
      border-radius: 2px;
      background: var(--colour);
    }
    .swatch.drum {
      background: var(--mat-sys-on-surface-variant);
      opacity: 0.3;
    }
    .swatch.hatch {
      box-sizing: border-box;
      border: 1px solid var(--mat-sys-error);
      background: repeating-linear-gradient(
        45deg,
        var(--mat-sys-error) 0 1.5px,
        var(--mat-sys-error-container) 1.5px 4px
      );
    }
    .legend {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 16px;
      margin: 8px 0 0;
      padding: 0;
      list-style: none;
      font: var(--mat-sys-body-small);
    }
    .legend li {
      display: flex;
      align-items: center;
      gap: 6px;
      min-width: 0;
    }
    .track-name {
      overflow-wrap: anywhere;
    }
    .channel {
      color: var(--mat-sys-on-surface-variant);
      white-space: nowrap;
    }
    .unmapped-entry {
      color: var(--mat-sys-error);
    }
    .unmapped-entry.none {
      color: var(--mat-sys-on-surface-variant);
    }
    .scale {
      margin: 8px 0 0;
      font: var(--mat-sys-body-small);
    }
    .scale-title {
      display: block;
      color: var(--mat-sys-on-surface-variant);
      margin-bottom: 2px;
    }
    .scale-steps {
      display: flex;
      gap: 2px;
    }
    .scale-step {
      display: flex;
      flex-direction: column;
      align-items: center;
      width: 28px;
    }
    .scale-step .swatch {
      width: 100%;
      border-radius: 0;
    }
    .scale-label {
      font-size: 10px;
      color: var(--mat-sys-on-surface-variant);
      white-space: nowrap;
    }
    .cents-range,
    .note-cap,
    .empty {
      margin: 8px 0 0;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .cents-range strong {
      color: var(--mat-sys-on-surface);
      font-variant-numeric: tabular-nums;
    }
  `,
})
export class SongRoll {
  readonly roll = input.required<SongRollNotes>();
  /**
   * For the song as written: the keys the chosen tuning leaves unmapped, or null while no key table
   * is known.
   */
  readonly unmappedKeys = input<readonly number[] | null>(null);

  protected readonly axisWidth = axisWidth;
  protected readonly drawnAtMost = drawnAtMost;
  protected readonly trackColours = trackColours;
  private readonly rollId = `song-roll-${++rollsMade}`;
  protected readonly hatchId = `${this.rollId}-hatch`;
  protected readonly scaleId = `${this.rollId}-scale`;
  protected readonly hatchFill = `url(#${this.hatchId})`;
  protected readonly scaleSteps = [-5, -4, -3, -2, -1, 0, 1, 2, 3, 4, 5].map(shadeStep);

  /** Pitched notes only: drums say nothing about keys or tuning. */
  private readonly pitched = computed(() => this.roll().notes.filter((note) => !note.drum));
  private readonly unmappedSet = computed(() => {
    const keys = this.unmappedKeys();
    return keys && this.roll().kind === 'written' ? new Set(keys) : null;
  });

  /** The keys drawn: the song's, a key more on each side, and at least an octave and a key. */
  private readonly keyRange = computed(() => {
    const notes = this.roll().notes;
    let low = Math.min(...notes.map((note) => note.key)) - 1;
    let high = Math.max(...notes.map((note) => note.key)) + 1;
    while (high - low < 12) {
      low--;
      high++;
    }
    return { low, high };
  });
  protected readonly rowHeight = computed(() => {
    const { low, high } = this.keyRange();
    return Math.max(3, Math.min(10, Math.floor(220 / (high - low + 1))));
  });
  protected readonly noteHeight = computed(() => Math.max(2, this.rowHeight() - 1));
  protected readonly plotHeight = computed(() => {
    const { low, high } = this.keyRange();
    return (high - low + 1) * this.rowHeight();
  });
  protected readonly height = computed(() => this.plotHeight() + timeAxisHeight);
  protected readonly minWidth = computed(() =>
    Math.min(widestPlot, Math.ceil(this.seconds() * leastPixelsPerSecond)),
  );
  private readonly seconds = computed(() => Math.max(this.roll().seconds, 0.001));

  protected readonly blackRows = computed(() => {
    const { low, high } = this.keyRange();
    const rows: number[] = [];
    for (let key = low; key <= high; key++)
      if (blackKeys.has(((key % 12) + 12) % 12)) rows.push(this.yOf(key));
    return rows;
  });
  protected readonly keyLabels = computed(() => {
    const { low, high } = this.keyRange();
    const labels: { key: number; name: string; y: number }[] = [];
    for (let key = low; key <= high; key++) {
      if (key % 12 === 0)
        labels.push({ key, name: noteName(key), y: this.yOf(key) + this.rowHeight() / 2 + 3.5 });
    }
    return labels;
  });
  protected readonly timeTicks = computed(() => {
    const seconds = this.seconds();
    const room = Math.max(4, Math.floor(Math.max(this.minWidth(), 280) / 70));
    const step =
      timeSteps.find((candidate) => seconds / candidate <= room) ?? timeSteps[timeSteps.length - 1];
    const ticks: { x: string; label: string }[] = [];
    for (let index = 0; index === 0 || index * step <= seconds - step * 0.4; index++) {
      const at = index * step;
      ticks.push({ x: percent((100 * at) / seconds), label: clock(at, step < 1 ? 1 : 0) });
    }
    return ticks;
  });

  protected readonly shapes = computed(() => {
    const song = this.roll();
    const seconds = this.seconds();
    const unmapped = this.unmappedSet();
    const least = (100 * 2) / Math.max(this.minWidth(), 280);
    return song.notes.slice(0, drawnAtMost).map((note): NoteShape => {
      const off = !note.drum && unmapped !== null && unmapped.has(note.key);
      return {
        x: percent((100 * note.start) / seconds),
        y: this.yOf(note.key) + 0.5,
        width: percent(Math.max(least, (100 * (note.end - note.start)) / seconds)),
        colour: song.kind === 'written' ? note.track % trackColours : null,
        shade: note.cents === null ? null : shadeOf(note.cents),
        drum: note.drum,
        unmapped: off,
        title: this.titleOf(note, off),
      };
    });
  });

  /**
   * Notes (drums aside) on keys the tuning leaves unmapped, counted over the whole song; null while
   * unknown.
   */
  protected readonly unmappedCount = computed(() => {
    const unmapped = this.unmappedSet();
    if (!unmapped) return null;
    return { notes: this.pitched().filter((note) => unmapped.has(note.key)).length };
  });

  protected readonly centsRange = computed(() => {
    const cents = this.pitched().flatMap((note) => (note.cents === null ? [] : [note.cents]));
    if (cents.length === 0) return null;
    return { low: signedCentsText(Math.min(...cents)), high: signedCentsText(Math.max(...cents)) };
  });

  /** What a screen reader hears for the whole picture. */
  protected readonly label = computed(() => {
    const song = this.roll();
    const pitched = this.pitched();
    const drums = song.notes.length - pitched.length;
    const keys = pitched.map((note) => note.key);
    const [low, high] = [Math.min(...keys), Math.max(...keys)];
    const range = keys.length ? `, keys ${low}–${high} (${noteName(low)}–${noteName(high)})` : '';
    if (song.kind === 'retuned') {
      const cents = this.centsRange();
      const offsets = cents
        ? `; from ${cents.low} to ${cents.high} from 12-tone equal temperament`
        : '';
      return `Piano roll of the retuned song: ${plural(pitched.length, 'note')}${range}${offsets}`;
    }
    const tracks = song.tracks.filter((track) => !track.drums).length;
    const unmapped = this.unmappedCount();
    return (
      `Piano roll of the song: ${plural(pitched.length, 'note')} in ${plural(tracks, 'track')}` +
      range +
      (unmapped ? `, ${unmapped.notes} on keys the tuning leaves unmapped` : '') +
      (drums ? `; ${plural(drums, 'drum note')} on channel 10, drawn faint` : '')
    );
  });

  private yOf(key: number): number {
    return (this.keyRange().high - key) * this.rowHeight();
  }

  private titleOf(note: RollNote, unmapped: boolean): string {
    const song = this.roll();
    const when = `${clock(note.start, 2)}–${clock(note.end, 2)}`;
    const key = `${noteName(note.key)} (key ${note.key})`;
    if (note.cents !== null)
      return `${key}, ${signedCentsText(note.cents)} from 12-tone equal temperament, ${when}`;
    const track = song.tracks[note.track]?.name ?? '';
    const off = unmapped ? ', on an unmapped key' : '';
    return `${note.drum ? `Drum key ${note.key}` : key}, ${track}, ${when}${off}`;
  }
}
