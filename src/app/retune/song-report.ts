import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { noteName } from '@shared/tuning/twelve-edo';
import { SongReportHeader } from './retune-api';

/** Channel numbers as a musician writes them: 2-9, 11, 13-16. */
function channelRuns(channels: readonly number[]): string {
  const runs: [number, number][] = [];
  for (const channel of [...channels].sort((a, b) => a - b)) {
    const last = runs[runs.length - 1];
    if (last && last[1] === channel - 1) last[1] = channel;
    else runs.push([channel, channel]);
  }
  return runs.map(([first, last]) => (first === last ? `${first}` : `${first}–${last}`)).join(', ');
}

/** What the server did to a song: notes retuned, the channels it used, notes cut short, and its warnings. */
@Component({
  selector: 'app-song-report',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let summary = report();
    <dl class="figures">
      <div>
        <dt>Notes retuned</dt>
        <dd class="notes-retuned">{{ summary.notesRetuned }}</dd>
      </div>
      <div>
        <dt>{{ summary.mode === 'mpe' ? 'Member channels used' : 'Channels tuned' }}</dt>
        <dd class="channels-used">{{ channels() || 'none' }}</dd>
      </div>
      <div>
        <dt>Notes cut short</dt>
        <dd class="notes-stolen">{{ summary.notesStolenCount }}</dd>
      </div>
      <div>
        <dt>Notes on unmapped keys</dt>
        <dd class="notes-unmapped">{{ summary.notesUnmappedCount }}</dd>
      </div>
      @if (summary.leadIn; as leadIn) {
        <div>
          <dt>Lead-in</dt>
          <dd class="lead-in-ms">{{ leadIn.ms }} ms</dd>
        </div>
      }
    </dl>
    @if (summary.leadIn; as leadIn) {
      <p class="lead-in-note">
        @if (leadIn.ticks > 0) {
          The song starts {{ leadIn.ms }} ms ({{ leadIn.ticks }} ticks) later than written, so the
          instrument takes the tuning before the first note; every note keeps its place against the
          others.
        } @else {
          No lead-in: the first note starts with the tuning, and some instruments need a moment to
          take it.
        }
      </p>
    }

    @if (summary.notesStolenCount > 0) {
      <p>
        These notes were cut short because every member channel was already sounding when another
        note began. More member channels in the preset's output settings leave room for them.
      </p>
      <div class="table-frame">
        <table class="stolen">
          <caption class="visually-hidden">
            Notes cut short
          </caption>
          <thead>
            <tr>
              <th scope="col" class="number">Track</th>
              <th scope="col" class="number">Channel</th>
              <th scope="col">Key</th>
              <th scope="col" class="number">Began at tick</th>
              <th scope="col" class="number">Cut at tick</th>
              <th scope="col" class="number">On member channel</th>
            </tr>
          </thead>
          <tbody>
            @for (note of summary.notesStolen; track $index) {
              <tr>
                <td class="number">{{ note.track }}</td>
                <td class="number">{{ note.channel }}</td>
                <td>{{ note.key }} ({{ keyName(note.key) }})</td>
                <td class="number">{{ note.startTick }}</td>
                <td class="number">{{ note.stolenAtTick }}</td>
                <td class="number">{{ note.memberChannel }}</td>
              </tr>
            }
          </tbody>
        </table>
      </div>
      @if (unlisted() > 0) {
        <p class="unlisted">And {{ unlisted() }} more, not listed here.</p>
      }
    }

    @if (summary.warnings.length) {
      <h3>Worth knowing</h3>
      <ul class="warnings">
        @for (warning of summary.warnings; track $index) {
          <li>{{ warning.message }}</li>
        }
      </ul>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .figures {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 32px;
      margin: 0 0 12px;
    }
    dt {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
      font: var(--mat-sys-title-large);
      font-variant-numeric: tabular-nums;
    }
    h3 {
      font: var(--mat-sys-title-small);
      margin: 16px 0 4px;
    }
    .table-frame {
      overflow-x: auto;
    }
    table {
      border-collapse: collapse;
      font-variant-numeric: tabular-nums;
    }
    th,
    td {
      padding: 4px 10px;
      text-align: start;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      white-space: nowrap;
    }
    thead th {
      font: var(--mat-sys-label-medium);
      color: var(--mat-sys-on-surface-variant);
      white-space: normal;
    }
    .number {
      text-align: end;
    }
    .unlisted {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .warnings {
      margin: 0;
      padding-inline-start: 20px;
    }
    @media (max-width: 480px) {
      th,
      td {
        padding: 4px 6px;
      }
    }
  `,
})
export class SongReport {
  readonly report = input.required<SongReportHeader>();

  protected readonly channels = computed(() => channelRuns(this.report().channelsUsed));
  protected readonly unlisted = computed(
    () => this.report().notesStolenCount - this.report().notesStolen.length,
  );

  protected keyName(key: number): string {
    return noteName(key);
  }
}
