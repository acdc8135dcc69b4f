import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatChipsModule } from '@angular/material/chips';
import type { TemperamentResult } from '@shared/api/temperaments';
import { centsText, signedCentsText } from '../scale/cents-text';

/** The results that share one temperament (its commas and mapping), one per tuning. */
export interface Temperament {
  commas: string[];
  primes: number[];
  mapping: [number[], number[]];
  periodsPerOctave: number;
  tunings: TemperamentResult[];
}

/** A MOS size of one tuned result, chosen to open as a scale. */
export interface ChosenSize {
  result: TemperamentResult;
  size: number;
}

/** Gathers results into temperaments, in the order the server gave them. */
export function temperamentsOf(results: TemperamentResult[]): Temperament[] {
  const found = new Map<string, Temperament>();
  for (const result of results) {
    const key = JSON.stringify([result.commas, result.primes, result.mapping]);
    const temperament = found.get(key) ?? {
      commas: result.commas,
      primes: result.primes,
      mapping: result.mapping,
      periodsPerOctave: result.periodsPerOctave,
      tunings: [],
    };
    temperament.tunings.push(result);
    found.set(key, temperament);
  }
  return [...found.values()];
}

/** A mapping written as the trade writes it: its two rows as vals, `[⟨1 1 0], ⟨0 1 4]⟩`. */
function mappingText(mapping: [number[], number[]]): string {
  return `[${mapping.map((row) => `⟨${row.join(' ')}]`).join(', ')}⟩`;
}

const tuningNames: Record<TemperamentResult['tuning'], string> = {
  TE: 'Tenney-Euclidean',
  POTE: 'Tenney-Euclidean, pure period',
  minimax: 'Minimax',
};

/**
 * One temperament: its commas and mapping, then a row per tuning with its period and generator and the error of each
 * target interval, and under the table each tuning's MOS sizes as chips to choose one from (outside the table, so
 * that they stay in view on a phone while the figures scroll sideways).
 */
@Component({
  selector: 'app-temperament-table',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatChipsModule],
  template: `
    @let temperament = this.temperament();
    <h3 class="commas">Tempering out {{ temperament.commas.join(', ') || 'no comma' }}</h3>
    <p class="mapping">
      Mapping <span class="vals">{{ mapping() }}</span> over the primes
      {{ temperament.primes.join('.') }}
      @if (temperament.periodsPerOctave > 1) {
        · {{ temperament.periodsPerOctave }} periods to the octave
      }
    </p>
    <div class="frame">
      <table>
        <caption class="visually-hidden">
          Tunings of the temperament tempering out
          {{
            temperament.commas.join(', ')
          }}
        </caption>
        <thead>
          <tr>
            <th scope="col">Tuning</th>
            <th scope="col" class="number">Period</th>
            <th scope="col" class="number">Generator</th>
            @for (interval of targets(); track interval) {
              <th scope="col" class="number error">Error of {{ interval }}</th>
            }
          </tr>
        </thead>
        <tbody>
          @for (result of temperament.tunings; track result.tuning) {
            <tr>
              <th scope="row" class="tuning">
                <span class="short">{{ result.tuning }}</span>
                <span class="long"> {{ tuningName(result) }}</span>
              </th>
              <td class="number period">{{ cents(result.period) }}</td>
              <td class="number generator">{{ cents(result.generator) }}</td>
              @for (interval of targets(); track interval) {
                <td class="number error">{{ errorOf(result, interval) }}</td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
    <div class="sizes">
      <h4 class="sizes-heading">MOS sizes: choose one to open as a scale</h4>
      @for (result of temperament.tunings; track result.tuning) {
        <div class="sizes-line">
          <span class="sizes-tuning" aria-hidden="true">{{ result.tuning }}</span>
          <mat-chip-listbox
            [attr.aria-label]="'MOS sizes of the ' + result.tuning + ' tuning'"
            [value]="chosenSizeOf(result)"
            (change)="choose(result, $event.value)"
          >
            @for (size of result.mosSizes; track size) {
              <mat-chip-option [value]="size">{{ size }}</mat-chip-option>
            }
          </mat-chip-listbox>
        </div>
      }
    </div>
  `,
  styles: `
    :host {
      display: block;
    }
    .commas {
      font: var(--mat-sys-title-medium);
      margin: 0 0 4px;
    }
    .mapping {
      margin: 0 0 8px;
      color: var(--mat-sys-on-surface-variant);
    }
    .vals {
      color: var(--mat-sys-on-surface);
      font-variant-numeric: tabular-nums;
      white-space: nowrap;
    }
    .frame {
      overflow-x: auto;
      /* Holds the visually hidden headings, which would otherwise widen the page from outside the scroller. */
      position: relative;
    }
    table {
      border-collapse: collapse;
      font-variant-numeric: tabular-nums;
    }
    th,
    td {
      padding: 6px 10px;
      text-align: left;
      vertical-align: middle;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    thead th {
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
      white-space: nowrap;
    }
    .number {
      text-align: right;
      white-space: nowrap;
    }
    thead th.error {
      white-space: normal;
      min-width: 4.5em;
    }
    th.tuning {
      position: sticky;
      z-index: 1;
      left: 0;
      background: var(--mat-sys-surface-container-low);
      font-weight: normal;
    }
    thead th:first-child {
      position: sticky;
      z-index: 1;
      left: 0;
      background: var(--mat-sys-surface-container-low);
    }
    .short {
      display: block;
      font: var(--mat-sys-title-small);
    }
    .long {
      display: block;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      min-width: 9em;
    }
    .sizes {
      margin-top: 12px;
    }
    .sizes-heading {
      font: var(--mat-sys-title-small);
      margin: 0 0 4px;
    }
    .sizes-line {
      display: flex;
      align-items: flex-start;
      gap: 0 12px;
    }
    .sizes-tuning {
      flex: none;
      width: 4.5em;
      /* Level with the first row of chips. */
      padding-top: 10px;
      font: var(--mat-sys-label-large);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class TemperamentTable {
  readonly temperament = input.required<Temperament>();
  readonly chosen = input<ChosenSize | null>(null);
  readonly sizeChosen = output<ChosenSize | null>();

  protected readonly mapping = computed(() => mappingText(this.temperament().mapping));
  /** Every target interval any tuning reports, in the order first met. */
  protected readonly targets = computed(() => [
    ...new Set(
      this.temperament().tunings.flatMap((result) => result.errors.map((e) => e.interval)),
    ),
  ]);

  protected cents(value: number): string {
    return centsText(value, 2);
  }

  protected tuningName(result: TemperamentResult): string {
    return tuningNames[result.tuning];
  }

  protected errorOf(result: TemperamentResult, interval: string): string {
    const error = result.errors.find((candidate) => candidate.interval === interval);
    return error ? signedCentsText(error.cents, 2) : '';
  }

  protected chosenSizeOf(result: TemperamentResult): number | null {
    const chosen = this.chosen();
    return chosen && chosen.result === result ? chosen.size : null;
  }

  protected choose(result: TemperamentResult, size: number | null | undefined): void {
    if (typeof size === 'number') this.sizeChosen.emit({ result, size });
    else if (this.chosen()?.result === result) this.sizeChosen.emit(null);
  }
}
