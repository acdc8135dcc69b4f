import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

/**
 * A place to drop a file that is also a button: pressed (by pointer or keyboard), it opens the
 * file picker. Says which file was chosen through `chosen`; judging the file is the page's business.
 */
@Component({
  selector: 'app-file-drop',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [MatIconModule],
  template: `
    <button
      type="button"
      class="drop"
      [class.over]="over()"
      [attr.aria-describedby]="hintId"
      (click)="picker.click()"
      (dragenter)="acceptDrag($event)"
      (dragover)="acceptDrag($event)"
      (dragleave)="over.set(false)"
      (drop)="takeDropped($event)"
    >
      <mat-icon aria-hidden="true">{{ icon() }}</mat-icon>
      <span class="label">{{ label() }}</span>
      <span class="hint" [id]="hintId">{{ hint() }}</span>
    </button>
    <input
      #picker
      type="file"
      class="visually-hidden"
      tabindex="-1"
      aria-hidden="true"
      [accept]="accept()"
      (change)="takePicked(picker)"
    />
  `,
  styles: `
    :host {
      display: block;
    }
    .drop {
      display: flex;
      flex-direction: column;
      align-items: center;
      gap: 4px;
      width: 100%;
      padding: 20px 16px;
      border: 2px dashed var(--mat-sys-outline);
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-surface-container-lowest);
      color: var(--mat-sys-on-surface);
      font: var(--mat-sys-body-medium);
      text-align: center;
      cursor: pointer;
    }
    .drop:hover {
      background: var(--mat-sys-surface-container);
    }
    .drop:focus-visible {
      outline: 3px solid var(--mat-sys-primary);
      outline-offset: 2px;
    }
    .drop.over {
      border-color: var(--mat-sys-primary);
      background: var(--mat-sys-primary-container);
    }
    mat-icon {
      color: var(--mat-sys-primary);
      font-size: 32px;
      width: 32px;
      height: 32px;
    }
    .label {
      font: var(--mat-sys-title-small);
    }
    .hint {
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class FileDrop {
  private static count = 0;

  /** What pressing does, in words: "Choose a MIDI song". */
  readonly label = input.required<string>();
  readonly hint = input('');
  readonly icon = input('upload_file');
  /** The file picker's filter, such as ".mid,.midi". */
  readonly accept = input('');
  readonly chosen = output<File>();

  protected readonly over = signal(false);
  protected readonly hintId = `file-drop-hint-${++FileDrop.count}`;

  protected acceptDrag(event: DragEvent): void {
    event.preventDefault();
    if (event.dataTransfer) event.dataTransfer.dropEffect = 'copy';
    this.over.set(true);
  }

  protected takeDropped(event: DragEvent): void {
    event.preventDefault();
    this.over.set(false);
    const file = event.dataTransfer?.files[0];
    if (file) this.chosen.emit(file);
  }

  protected takePicked(picker: HTMLInputElement): void {
    const file = picker.files?.[0];
    // Cleared, so that choosing the same file again is noticed.
    picker.value = '';
    if (file) this.chosen.emit(file);
  }
}
