import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { loader } from '../api/loader';
import { AuditNames, auditSentence } from './audit-sentence';
import { BandDetail, BandsApi } from './bands-api';

/** Who changed what in the band, newest first, in plain words (owners only). */
@Component({
  selector: 'app-band-audit',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DatePipe],
  template: `
    @if (failure(); as message) {
      <p class="failure" role="alert">{{ message }}</p>
    } @else if (lines(); as lines) {
      <ol class="audit">
        @for (line of lines; track line.id) {
          <li>
            <span>{{ line.sentence }}</span>
            <time [attr.datetime]="line.createdAt">{{
              line.createdAt | date: 'd MMM y, HH:mm'
            }}</time>
          </li>
        } @empty {
          <li>Nothing has happened in this band yet.</li>
        }
      </ol>
    } @else {
      <p>Loading the log…</p>
    }
  `,
  styles: `
    .audit {
      list-style: none;
      margin: 0;
      padding: 0;
      max-height: 420px;
      overflow-y: auto;
    }
    li {
      display: flex;
      flex-wrap: wrap;
      justify-content: space-between;
      gap: 0 12px;
      padding: 6px 0;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    time {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
      white-space: nowrap;
    }
    .failure {
      color: var(--mat-sys-error);
    }
  `,
})
export class BandAudit {
  private readonly api = inject(BandsApi);

  /** The band as last loaded; the log is read again whenever the band is. */
  readonly band = input.required<BandDetail>();
  /** Names of the band's presets by id, including those in the trash. */
  readonly presetNames = input.required<ReadonlyMap<string, string>>();

  private readonly log = loader(() => this.api.audit(this.band().id), {
    fallback: 'The log could not be loaded.',
  });
  protected readonly failure = this.log.failure;
  protected readonly lines = computed(() => {
    const entries = this.log.value();
    if (!entries) return null;
    const names: AuditNames = {
      presets: this.presetNames(),
      members: new Map(this.band().members.map((m) => [m.userId, m.name ?? m.login])),
    };
    return entries.map((entry) => ({
      id: entry.id,
      createdAt: entry.createdAt,
      sentence: auditSentence(entry, names),
    }));
  });
}
