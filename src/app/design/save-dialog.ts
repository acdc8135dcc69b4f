import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { FieldFault } from './field-fault';
import type { BandMembership } from './preset-api';

export interface SaveDialogData {
  name: string;
  /** The bands that can hold a new preset; null when saving a new revision of a saved one. */
  bands: BandMembership[] | null;
  /** The revision the save will create, for a saved preset. */
  nextRevision: number | null;
}

export interface SaveChoice {
  name: string;
  bandId: string | null;
  note: string;
}

const longestName = 200;
/** The library select's value for the member's own library (a null option would clear the select). */
const myLibrary = 'mine';
const longestNote = 500;

/** Asks for the preset's name, the library it goes into (first save only) and a note on the change. */
@Component({
  selector: 'app-save-dialog',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    FieldFault,
    MatDialogModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
  ],
  template: `
    <h2 mat-dialog-title>
      {{ data.nextRevision ? 'Save revision ' + data.nextRevision : 'Save preset' }}
    </h2>
    <div mat-dialog-content class="fields">
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Name</mat-label>
        <input
          matInput
          #nameField
          [value]="name()"
          (input)="name.set(nameField.value)"
          required
          [attr.maxlength]="longestName"
          [appFault]="nameFault()"
          (keydown.enter)="save()"
          cdkFocusInitial
        />
        <mat-error>{{ nameFault() }}</mat-error>
      </mat-form-field>
      @if (data.bands) {
        <mat-form-field subscriptSizing="dynamic">
          <mat-label>Library</mat-label>
          <mat-select [value]="library()" (valueChange)="library.set($event)">
            <mat-option [value]="myLibrary">My library</mat-option>
            @for (band of data.bands; track band.id) {
              <mat-option [value]="band.id">{{ band.name }} (band)</mat-option>
            }
          </mat-select>
          <mat-hint>A band's editors can change its presets</mat-hint>
        </mat-form-field>
      }
      <mat-form-field subscriptSizing="dynamic">
        <mat-label>Note on this change</mat-label>
        <textarea
          matInput
          #noteField
          rows="2"
          [value]="note()"
          (input)="note.set(noteField.value)"
          [attr.maxlength]="longestNote"
        ></textarea>
        <mat-hint align="end">{{ note().length }} / {{ longestNote }}</mat-hint>
      </mat-form-field>
    </div>
    <div mat-dialog-actions align="end">
      <button mat-button mat-dialog-close>Cancel</button>
      <button mat-flat-button (click)="save()" [disabled]="nameFault() !== null">Save</button>
    </div>
  `,
  styles: `
    .fields {
      display: flex;
      flex-direction: column;
      gap: 4px;
      min-width: min(360px, 70vw);
    }
  `,
})
export class SaveDialog {
  protected readonly data = inject<SaveDialogData>(MAT_DIALOG_DATA);
  private readonly dialog = inject<MatDialogRef<SaveDialog, SaveChoice>>(MatDialogRef);
  protected readonly longestName = longestName;
  protected readonly longestNote = longestNote;
  protected readonly name = signal(this.data.name);
  /** The library chosen: a band's id, or `myLibrary`. */
  protected readonly library = signal(myLibrary);
  protected readonly myLibrary = myLibrary;
  protected readonly note = signal('');
  protected readonly nameFault = computed(() =>
    this.name().trim() === '' ? 'A preset needs a name' : null,
  );

  protected save(): void {
    if (this.nameFault()) return;
    const bandId = this.library() === myLibrary ? null : this.library();
    this.dialog.close({ name: this.name().trim(), bandId, note: this.note().trim() });
  }
}
