import { RouterLink } from '@angular/router';
import {
  CdkDrag,
  CdkDragDrop,
  CdkDragHandle,
  CdkDropList,
  moveItemInArray,
} from '@angular/cdk/drag-drop';
import {
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  afterNextRender,
  computed,
  inject,
  Injector,
  input,
  linkedSignal,
  output,
  signal,
} from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { parseRequest } from '@shared/api/requests';
import { type SetlistBody, setlistRequest } from '@shared/api/setlists';
import { firstValueFrom } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';
import { ConfirmDialog, type ConfirmDialogData } from '../library/confirm-dialog';
import type { PresetRow } from '../library/library-api';
import { type Setlist, type SetlistEntry, SetlistsApi } from './setlists-api';

/** Revisions to pin to, newest first. */
function revisionsOf(entry: SetlistEntry): number[] {
  return Array.from({ length: entry.latestRevision }, (_, index) => entry.latestRevision - index);
}

/** A number typed into a field: empty is null, anything else as typed, for the schema to judge. */
function typedNumber(text: string): number | null {
  return text.trim() === '' ? null : Number(text);
}

/**
 * One setlist: read-only for viewers; for editors a working copy to rename, reorder (drag and drop, the move
 * buttons, or Alt+Arrow keys on a focused entry), pin, trigger and trim, checked by the shared request schema before
 * it is saved whole.
 */
@Component({
  selector: 'app-setlist-card',
  changeDetection: ChangeDetectionStrategy.OnPush,
  imports: [
    CdkDropList,
    CdkDrag,
    CdkDragHandle,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    RouterLink,
  ],
  templateUrl: './setlist-card.html',
  styleUrl: './setlist-card.scss',
})
export class SetlistCard {
  private readonly api = inject(SetlistsApi);
  private readonly dialog = inject(MatDialog);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

  readonly setlist = input.required<Setlist>();
  /** The band's presets, to add to the list. */
  readonly presets = input<PresetRow[]>([]);
  readonly saved = output<Setlist>();
  readonly deleted = output<string>();

  protected readonly revisionsOf = revisionsOf;
  protected readonly editable = computed(() => this.setlist().access === 'edit');
  protected readonly name = linkedSignal(() => this.setlist().name);
  protected readonly entries = linkedSignal<SetlistEntry[]>(() => [...this.setlist().entries]);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** Said to screen readers after a move. */
  protected readonly announcement = signal('');

  protected readonly body = computed<SetlistBody>(() => ({
    name: this.name(),
    entries: this.entries().map(({ presetId, revision, trigger }) => ({
      presetId,
      revision,
      trigger,
    })),
  }));
  /** The schema's faults by field path, as sentences naming the field. */
  protected readonly faults = computed(() => {
    const result = parseRequest(setlistRequest, this.body());
    const faults = new Map<string, string>();
    if (result.ok) return faults;
    for (const error of result.errors) {
      const fault = error.message.slice(error.path.length + 2);
      const entry = /^entries\[(\d+)\]\.(\w+)$/.exec(error.path);
      const subject = entry
        ? `Entry ${Number(entry[1]) + 1}'s ${entry[2] === 'trigger' ? 'program change' : entry[2]}`
        : error.path === 'name'
          ? 'The setlist name'
          : error.path;
      faults.set(error.path, `${subject} ${fault}.`);
    }
    return faults;
  });
  /** Faults that belong to no field shown here (the length of the list, say). */
  protected readonly otherFaults = computed(() =>
    [...this.faults()]
      .filter(([path]) => path !== 'name' && !path.endsWith('.trigger'))
      .map(([, fault]) => fault),
  );
  protected readonly changed = computed(() => {
    const saved = this.setlist();
    return (
      JSON.stringify(this.body()) !==
      JSON.stringify({
        name: saved.name,
        entries: saved.entries.map(({ presetId, revision, trigger }) => ({
          presetId,
          revision,
          trigger,
        })),
      })
    );
  });

  protected setTrigger(index: number, text: string): void {
    this.update(index, { trigger: typedNumber(text) });
  }

  /** A revision to pin to, or 'latest' to follow the newest. */
  protected setRevision(index: number, revision: number | 'latest'): void {
    this.update(index, { revision: revision === 'latest' ? null : revision });
  }

  protected add(preset: PresetRow | null): void {
    if (!preset) return;
    const entry: SetlistEntry = {
      presetId: preset.id,
      revision: null,
      trigger: null,
      presetName: preset.name,
      latestRevision: preset.revision,
    };
    this.entries.update((entries) => [...entries, entry]);
  }

  protected remove(index: number): void {
    this.entries.update((entries) => entries.filter((_, at) => at !== index));
  }

  protected dropped(event: CdkDragDrop<SetlistEntry[]>): void {
    this.move(event.previousIndex, event.currentIndex, false);
  }

  /** Moves an entry by `step` places; the focus stays on what was moved (its row, or the same button). */
  protected moveBy(index: number, step: number, focus: 'row' | 'up' | 'down' | null = null): void {
    this.move(index, index + step, focus);
  }

  protected rowKey(event: KeyboardEvent, index: number): void {
    if (!event.altKey || event.target !== event.currentTarget) return;
    if (event.key !== 'ArrowUp' && event.key !== 'ArrowDown') return;
    event.preventDefault();
    this.moveBy(index, event.key === 'ArrowUp' ? -1 : 1, 'row');
  }

  protected async save(): Promise<void> {
    if (this.faults().size) return;
    this.busy.set(true);
    this.failure.set(null);
    try {
      this.saved.emit(await firstValueFrom(this.api.save(this.setlist().id, this.body())));
    } catch (error) {
      this.failure.set(await apiErrorMessage(error, 'The setlist could not be saved.'));
    } finally {
      this.busy.set(false);
    }
  }

  protected discard(): void {
    this.name.set(this.setlist().name);
    this.entries.set([...this.setlist().entries]);
  }

  protected async deleteSetlist(): Promise<void> {
    const setlist = this.setlist();
    const data: ConfirmDialogData = {
      title: `Delete ${setlist.name}?`,
      message: 'The band loses this setlist and its order. The presets in it stay in the library.',
      confirm: 'Delete setlist',
    };
    const dialog = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data,
    });
    if ((await firstValueFrom(dialog.afterClosed())) !== true) return;
    try {
      await firstValueFrom(this.api.remove(setlist.id));
      this.deleted.emit(setlist.id);
    } catch (error) {
      this.failure.set(await apiErrorMessage(error, 'The setlist could not be deleted.'));
    }
  }

  private update(index: number, change: Partial<SetlistEntry>): void {
    this.entries.update((entries) =>
      entries.map((entry, at) => (at === index ? { ...entry, ...change } : entry)),
    );
  }

  private move(from: number, to: number, focus: 'row' | 'up' | 'down' | false | null): void {
    const entries = [...this.entries()];
    if (to < 0 || to >= entries.length || from === to) return;
    moveItemInArray(entries, from, to);
    this.entries.set(entries);
    this.announcement.set(
      `${entries[to].presetName} moved to position ${to + 1} of ${entries.length}.`,
    );
    if (!focus) return;
    afterNextRender(
      () => {
        const row = this.host.nativeElement.querySelectorAll<HTMLElement>('.entry')[to];
        const target =
          focus === 'row'
            ? row
            : row?.querySelector<HTMLElement>(`button.move-${focus}:not([disabled])`);
        (target ?? row)?.focus();
      },
      { injector: this.injector },
    );
  }
}
