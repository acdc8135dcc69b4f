import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatMenuModule } from '@angular/material/menu';
import { noteName } from '@shared/tuning/twelve-edo';
import { DesignField } from '../design/design-field';
import { DesignState } from '../design/design-state';
import { typedText } from '../design/draft-document';
import { centsText } from '../scale/cents-text';

interface LayoutKey {
  index: number;
  note: string;
  degree: number | null;
  fault: string | null;
  name: string;
}

/**
 * One period's worth of keys from the root key up: which degree each plays, or none. A key opens a
 * menu of the degrees (click, Enter or Space); the block repeats a period higher across the keyboard.
 */
@Component({
  selector: 'app-layout-editor',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [DesignField, MatButtonModule, MatMenuModule],
  template: `
    <fieldset [disabled]="state.readOnly()">
      <legend>Key layout</legend>
      <div class="controls">
        <app-design-field
          class="count"
          label="Keys per period"
          path="mapping.keysPerPeriod"
          inputMode="numeric"
          [value]="keysPerPeriodText()"
          (edited)="state.setKeysPerPeriod($event)"
          hint="Keys before the layout repeats a period higher"
        />
        <button
          mat-stroked-button
          type="button"
          (click)="state.useConsecutiveKeys()"
          [disabled]="!state.layout()"
        >
          One degree per key
        </button>
        <button mat-stroked-button type="button" (click)="placeOnNearestKeys()">
          Place degrees on nearest keys
        </button>
      </div>
      @if (notice()) {
        <p class="notice" role="status">{{ notice() }}</p>
      } @else if (state.nearestKeysByDefault() && state.layout()) {
        <p class="notice" role="status">
          Fewer than 12 degrees in an octave: each degree starts on the key of its nearest
          equal-tempered note, and the keys between play nothing. "One degree per key" puts them on
          keys in a row instead.
        </p>
      }
      <ol class="layout" aria-label="Keys of one period from the root key">
        @for (key of keys(); track key.index) {
          <li>
            <button
              mat-stroked-button
              type="button"
              class="layout-key"
              [class.unmapped]="key.degree === null"
              [class.faulty]="key.fault !== null"
              [matMenuTriggerFor]="degreeMenu"
              [matMenuTriggerData]="{ index: key.index }"
              [attr.aria-label]="key.name"
            >
              <span class="note">{{ key.note }}</span>&ngsp;<span class="degree">{{
                key.degree ?? '–'
              }}</span>
            </button>
          </li>
        }
      </ol>
      @for (key of faultyKeys(); track key.index) {
        <p class="fault" role="alert">Key {{ key.index + 1 }} ({{ key.note }}): {{ key.fault }}</p>
      }
    </fieldset>
    <mat-menu #degreeMenu="matMenu" class="degree-menu">
      <ng-template matMenuContent let-index="index">
        <button mat-menu-item (click)="state.assignKey(index, null)">
          Unmapped (plays nothing)
        </button>
        @for (degree of degrees(); track degree.degree) {
          <button mat-menu-item (click)="state.assignKey(index, degree.degree)">
            {{ degree.label }}
          </button>
        }
      </ng-template>
    </mat-menu>
  `,
  styles: `
    fieldset {
      border: 0;
      padding: 0;
      margin: 0;
      min-width: 0;
    }
    legend {
      font: var(--mat-sys-title-small);
      padding: 0;
      margin-bottom: 8px;
    }
    .controls {
      display: flex;
      flex-wrap: wrap;
      gap: 8px 12px;
      align-items: flex-start;
    }
    .count {
      width: 180px;
    }
    .controls button {
      margin-top: 8px;
    }
    .layout {
      list-style: none;
      padding: 0;
      margin: 12px 0 0;
      display: flex;
      flex-wrap: wrap;
      gap: 6px;
    }
    .layout-key {
      min-width: 52px;
      height: 56px;
      padding: 0 6px;
      display: inline-flex;
      flex-direction: column;
      line-height: 1.2;
    }
    .layout-key .note {
      display: block;
      font: var(--mat-sys-label-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .layout-key .degree {
      display: block;
      font: var(--mat-sys-title-medium);
    }
    .layout-key.unmapped {
      border-style: dashed;
    }
    .layout-key.unmapped .degree {
      color: var(--mat-sys-on-surface-variant);
    }
    .layout-key.faulty {
      border-color: var(--mat-sys-error);
      color: var(--mat-sys-error);
    }
    .fault {
      color: var(--mat-sys-error);
      font: var(--mat-sys-body-small);
      margin: 6px 0 0;
    }
    .notice {
      font: var(--mat-sys-body-small);
      margin: 6px 0 0;
    }
  `,
})
export class LayoutEditor {
  protected readonly state = inject(DesignState);
  protected readonly notice = signal<string | null>(null);
  protected readonly keysPerPeriodText = computed(() => {
    const typed = this.state.draft().mapping.keysPerPeriod;
    return typed !== undefined ? typedText(typed) : String(this.state.keysPerPeriod());
  });
  protected readonly keys = computed(() => {
    const layout = this.state.layout();
    const rootKey = this.state.shown()?.preset.mapping.rootKey ?? 60;
    return Array.from({ length: this.state.keysPerPeriod() }, (_, index): LayoutKey => {
      const degree = layout ? layout[index] : index;
      const note = noteName(rootKey + index);
      const plays = degree === null ? 'unmapped' : `plays degree ${degree}`;
      return {
        index,
        note,
        degree,
        fault: this.state.faultAt(`mapping.layout[${index}]`),
        // The name starts with what the button shows (its note and degree), as speech input needs.
        name: `${note} ${degree ?? '–'}: key ${index + 1} of the period, ${plays}; choose its degree`,
      };
    });
  });
  protected readonly faultyKeys = computed(() => this.keys().filter((key) => key.fault !== null));
  protected readonly degrees = computed(() =>
    (this.state.shown()?.table.degrees ?? []).map((degree) => ({
      degree: degree.degree,
      label: `Degree ${degree.degree} · ${centsText(degree.cents, 1)} · near ${degree.nearestNote.name}`,
    })),
  );

  protected placeOnNearestKeys(): void {
    this.notice.set(
      this.state.placeOnNearestKeys()
        ? 'Each degree now sits on the key of its nearest equal-tempered note; the keys between play nothing.'
        : 'Two degrees share a nearest key, so they cannot each have their own; assign the keys by hand.',
    );
  }
}
