import { Injectable, Injector, computed, inject, signal } from '@angular/core';
import { toObservable } from '@angular/core/rxjs-interop';
import {
  type InstrumentSettings,
  type ReceiveForm,
  exportOfReceiveForm,
  instrumentSettings,
} from '@shared/api/instruments';
import { EMPTY, catchError, firstValueFrom, map, of, switchMap } from 'rxjs';
import { Session } from '../auth/session';
import { apiErrorMessage } from '../api/api-error';
import { type ExportFormat, exportFormats } from '../output/export-formats';
import { InstrumentsApi } from './instruments-api';

/** An instrument as the app lists it: kept in the member's account, or in this browser for a guest. */
export interface MyInstrument extends InstrumentSettings {
  id: string;
}

/** Where a guest's instruments are kept in this browser. */
export const browserInstrumentsKey = 'keyloom.instruments';

/** How each form reads in a list. */
export const receiveFormLabels: Record<ReceiveForm, string> = {
  'mts-bulk': 'MTS bulk dump',
  'mts-bulk-bank': 'MTS bulk dump with bank',
  'mts-notes': 'MTS single-note changes',
  'mts-octave-1': 'MTS scale/octave, 1-byte',
  'mts-octave-2': 'MTS scale/octave, 2-byte',
  mpe: 'MPE: one note per channel with bends',
  'bend-table': 'Pitch-bend table',
  sfz: 'SFZ sampler map',
};

/** The export file an instrument takes its tuning as. */
export function exportOfInstrument(instrument: InstrumentSettings): ExportFormat {
  const id = exportOfReceiveForm[instrument.receives];
  return exportFormats.find((format) => format.id === id)!;
}

/** One line on what an instrument takes: "MTS bulk dump · device 16 · program 5 · port Ondes". */
export function instrumentSummary(instrument: InstrumentSettings): string {
  const parts = [receiveFormLabels[instrument.receives], `device ${instrument.deviceId}`];
  if (instrument.receives === 'mts-bulk-bank')
    parts.push(`bank ${instrument.bank}`, `program ${instrument.program}`);
  else if (instrument.receives === 'mts-bulk' || instrument.receives === 'mts-notes') {
    parts.push(`program ${instrument.program}`);
  } else if (instrument.receives === 'mpe' || instrument.receives === 'bend-table') {
    const [first, last] = instrument.memberChannels;
    parts.push(`channels ${first}-${last}`, `bend range ${instrument.bendRange}`);
  }
  if (instrument.port) parts.push(`port ${instrument.port}`);
  return parts.join(' · ');
}

function readBrowserInstruments(): MyInstrument[] {
  let stored: unknown;
  try {
    stored = JSON.parse(localStorage.getItem(browserInstrumentsKey) ?? '[]');
  } catch {
    return [];
  }
  if (!Array.isArray(stored)) return [];
  return stored.flatMap((entry: unknown) => {
    if (typeof entry !== 'object' || entry === null) return [];
    const { id, ...settings } = entry as Record<string, unknown>;
    const parsed = instrumentSettings.safeParse(settings);
    return typeof id === 'string' && parsed.success ? [{ id, ...parsed.data }] : [];
  });
}

/**
 * The player's instruments, wherever they are kept: in the account when signed in (`/api/instruments`), in this
 * browser's local storage for a guest. The same calls add, change and remove them either way.
 */
@Injectable({ providedIn: 'root' })
export class MyInstruments {
  private readonly api = inject(InstrumentsApi);
  private readonly session = inject(Session);

  /** Where they are kept, once sign-in is known. */
  readonly keptIn = computed(() => {
    const member = this.session.member();
    return member === undefined ? undefined : member ? ('account' as const) : ('browser' as const);
  });
  /** The instruments, or null until `load()` has read them. */
  readonly list = signal<MyInstrument[] | null>(null);
  readonly failure = signal<string | null>(null);

  private readonly injector = inject(Injector);
  private loading = false;

  /** Starts reading the instruments (once), and again whenever sign-in changes. */
  load(): void {
    if (this.loading) return;
    this.loading = true;
    toObservable(this.keptIn, { injector: this.injector })
      .pipe(
        switchMap((kept) => {
          if (kept === undefined) return EMPTY;
          if (kept === 'browser') return of(readBrowserInstruments());
          return this.api.instruments().pipe(
            map((items) => items.map((item) => this.trimmed(item))),
            catchError((error: unknown) => {
              void apiErrorMessage(error, 'Your instruments could not be loaded.').then((message) =>
                this.failure.set(message),
              );
              return of([]);
            }),
          );
        }),
      )
      .subscribe((items) => this.list.set(items));
  }

  async add(settings: InstrumentSettings): Promise<MyInstrument> {
    const added =
      this.keptIn() === 'account'
        ? this.trimmed(await firstValueFrom(this.api.create(settings)))
        : { id: `browser-${crypto.randomUUID()}`, ...settings };
    this.keep([...(this.list() ?? []), added]);
    return added;
  }

  async update(id: string, settings: InstrumentSettings): Promise<MyInstrument> {
    const changed =
      this.keptIn() === 'account'
        ? this.trimmed(await firstValueFrom(this.api.update(id, settings)))
        : { id, ...settings };
    this.keep(
      (this.list() ?? []).map((instrument) => (instrument.id === id ? changed : instrument)),
    );
    return changed;
  }

  async remove(id: string): Promise<void> {
    if (this.keptIn() === 'account') await firstValueFrom(this.api.remove(id));
    this.keep((this.list() ?? []).filter((instrument) => instrument.id !== id));
  }

  /**
   * What a download for `instrument` adds to the address: the instrument's id for one kept in the account, its
   * settings for a guest's (the server has never seen it).
   */
  downloadQuery(instrument: MyInstrument): Record<string, string> {
    if (this.keptIn() === 'account') return { instrument: instrument.id };
    const [first, last] = instrument.memberChannels;
    return {
      receives: instrument.receives,
      deviceId: String(instrument.deviceId),
      program: String(instrument.program),
      bank: String(instrument.bank),
      bendRange: String(instrument.bendRange),
      memberChannels: `${first}-${last}`,
    };
  }

  private trimmed({
    createdAt: _,
    updatedAt: __,
    ...instrument
  }: MyInstrument & { createdAt?: string; updatedAt?: string }) {
    return instrument;
  }

  private keep(items: MyInstrument[]): void {
    this.list.set(items);
    if (this.keptIn() === 'browser')
      localStorage.setItem(browserInstrumentsKey, JSON.stringify(items));
  }
}
