import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  ElementRef,
  Injector,
  PendingTasks,
  afterNextRender,
  computed,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatCheckbox, MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelect, MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import {
  type PrimeLimit,
  type TemperamentTuning,
  primeLimits,
  temperamentTunings,
} from '@shared/api/temperaments';
import { Subscription } from 'rxjs';
import { readApiError } from '../api/api-error';
import { FieldFault } from '../design/field-fault';
import { centsText } from '../scale/cents-text';
import { scaleOpening } from './scale-opening';
import {
  type CommaSource,
  type Measure,
  type QuestionFault,
  type QuestionField,
  faultFrom,
  intervalList,
  requestFrom,
} from './temperament-question';
import { type ChosenSize, TemperamentTable, temperamentsOf } from './temperament-table';
import {
  type TemperamentRequest,
  type TemperamentResult,
  type TemperamentsAnswer,
  TemperamentsApi,
} from './temperaments-api';

const primesUpTo: Record<PrimeLimit, string> = {
  3: '2.3',
  5: '2.3.5',
  7: '2.3.5.7',
  11: '2.3.5.7.11',
  13: '2.3.5.7.11.13',
};

const tuningLabels: Record<TemperamentTuning, string> = {
  TE: 'TE: Tenney-Euclidean least squares',
  POTE: 'POTE: the same with a pure period',
  minimax: 'Minimax: the smallest largest error over the targets',
};

/** The MOS size a result opens with at first: 12 when it has one, else the size nearest to it. */
function firstSize(sizes: number[]): number | null {
  let best: number | null = null;
  for (const size of sizes) {
    if (best === null || Math.abs(size - 12) < Math.abs(best - 12)) best = size;
  }
  return best;
}

/**
 * Generator search: from the intervals a composer wants and the commas they will give up, the temperaments that
 * fit, tuned by published methods, and any of their MOS sizes opened in the designer as a generated scale.
 */
@Component({
  selector: 'app-temperaments-page',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    DecimalPipe,
    RouterLink,
    MatButtonModule,
    MatButtonToggleModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    FieldFault,
    TemperamentTable,
  ],
  templateUrl: './temperaments-page.html',
  styleUrl: './temperaments-page.scss',
})
export class TemperamentsPage {
  private readonly api = inject(TemperamentsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly injector = inject(Injector);
  private readonly pendingTasks = inject(PendingTasks);

  protected readonly limits = primeLimits;
  protected readonly tuningChoices = temperamentTunings.map((tuning) => ({
    tuning,
    label: tuningLabels[tuning],
  }));
  protected readonly primesUpTo = primesUpTo;

  protected readonly measure = signal<Measure>('limit');
  protected readonly limit = signal<PrimeLimit>(5);
  protected readonly targets = signal('3/2 5/4 6/5');
  protected readonly commaSource = signal<CommaSource>('commas');
  protected readonly commas = signal('');
  protected readonly count = signal('12');
  protected readonly tunings = signal<TemperamentTuning[]>(['TE', 'POTE']);

  protected readonly searching = signal(false);
  protected readonly fault = signal<QuestionFault | null>(null);
  /** The last answer, with the question it answers. */
  protected readonly answered = signal<{
    request: TemperamentRequest;
    answer: TemperamentsAnswer;
  } | null>(null);
  protected readonly temperaments = computed(() =>
    temperamentsOf(this.answered()?.answer.results ?? []),
  );
  protected readonly chosen = signal<ChosenSize | null>(null);
  protected readonly opening = computed(() => {
    const chosen = this.chosen();
    return chosen ? scaleOpening(chosen.result, chosen.size) : null;
  });
  /** What a screen reader hears when a search starts and ends. */
  protected readonly announcement = computed(() => {
    if (this.searching()) return 'Searching…';
    const answer = this.answered()?.answer;
    if (!answer) return '';
    const found = this.temperaments().length;
    const suggested = answer.suggestions?.length ?? 0;
    const parts = [
      `${found} ${found === 1 ? 'temperament' : 'temperaments'} found`,
      ...(answer.suggestions
        ? [`${suggested} ${suggested === 1 ? 'comma' : 'commas'} suggested`]
        : []),
    ];
    return `${parts.join(', ')}.`;
  });

  private readonly targetsField = viewChild<ElementRef<HTMLInputElement>>('targetsField');
  private readonly commasField = viewChild<ElementRef<HTMLInputElement>>('commasField');
  private readonly countField = viewChild<ElementRef<HTMLInputElement>>('countField');
  private readonly limitField = viewChild(MatSelect);
  private readonly firstTuning = viewChild(MatCheckbox);
  private running: Subscription | null = null;

  protected faultAt(field: QuestionField): string | null {
    const fault = this.fault();
    return fault?.field === field ? fault.message : null;
  }

  protected cents(value: number): string {
    return centsText(value, 2);
  }

  protected chooseTuning(tuning: TemperamentTuning, on: boolean): void {
    this.tunings.update((chosen) =>
      temperamentTunings.filter((each) => (each === tuning ? on : chosen.includes(each))),
    );
    if (this.fault()?.field === 'tunings') this.fault.set(null);
  }

  /** A field edited: its fault no longer describes what it holds. */
  protected edited(field: QuestionField): void {
    if (this.fault()?.field === field) this.fault.set(null);
  }

  protected chooseSize(chosen: ChosenSize | null): void {
    this.chosen.set(chosen);
  }

  /** Adds a suggested comma to the commas field, and leaves the composer there to search with it. */
  protected addComma(ratio: string): void {
    const commas = intervalList(this.commas());
    this.commaSource.set('commas');
    if (!commas.includes(ratio)) this.commas.set([...commas, ratio].join(' '));
    this.edited('commas');
    afterNextRender(() => this.commasField()?.nativeElement.focus(), { injector: this.injector });
  }

  protected search(event?: Event): void {
    event?.preventDefault();
    const asked = requestFrom({
      measure: this.measure(),
      limit: this.limit(),
      targets: this.targets(),
      commaSource: this.commaSource(),
      commas: this.commas(),
      count: this.count(),
      tunings: this.tunings(),
    });
    if (!asked.ok) return this.refuse(asked.fault);
    const { request } = asked;
    this.running?.unsubscribe();
    this.fault.set(null);
    this.searching.set(true);
    this.running = this.api
      .search(request)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (answer) => {
          this.searching.set(false);
          this.answered.set({ request, answer });
          this.chosen.set(this.firstChoice(answer.results));
        },
        error: async (error: unknown) => {
          // Reading the refusal takes a moment; until it is shown, the page is not stable.
          const done = this.pendingTasks.add();
          try {
            const read = await readApiError(error, 'The search could not be made.');
            this.searching.set(false);
            this.answered.set(null);
            this.chosen.set(null);
            this.refuse(faultFrom(read));
          } finally {
            done();
          }
        },
      });
  }

  private firstChoice(results: TemperamentResult[]): ChosenSize | null {
    const result = temperamentsOf(results)[0]?.tunings[0];
    const size = result && firstSize(result.mosSizes);
    return result && size ? { result, size } : null;
  }

  /** Shows a fault beside its field and takes the composer there. */
  private refuse(fault: QuestionFault): void {
    this.fault.set(fault);
    afterNextRender(
      () => {
        switch (fault.field) {
          case 'limit':
            return this.limitField()?.focus();
          case 'targets':
            return this.targetsField()?.nativeElement.focus();
          case 'commas':
            return this.commasField()?.nativeElement.focus();
          case 'count':
            return this.countField()?.nativeElement.focus();
          case 'tunings':
            return this.firstTuning()?.focus();
        }
      },
      { injector: this.injector },
    );
  }
}
