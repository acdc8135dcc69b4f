import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Instrument, InstrumentSettings } from '@shared/api/instruments';
import type { ItemList } from '@shared/api/wire';
import { Observable, map } from 'rxjs';

export type { Instrument, InstrumentSettings, ReceiveForm } from '@shared/api/instruments';

/** A member's own instruments, private to them: how each takes a tuning. */
@Injectable({ providedIn: 'root' })
export class InstrumentsApi {
  private readonly http = inject(HttpClient);

  instruments(): Observable<Instrument[]> {
    return this.http
      .get<ItemList<Instrument>>('/api/instruments')
      .pipe(map((answer) => answer.items));
  }

  create(settings: InstrumentSettings): Observable<Instrument> {
    return this.http.post<Instrument>('/api/instruments', settings);
  }

  update(id: string, changes: Partial<InstrumentSettings>): Observable<Instrument> {
    return this.http.patch<Instrument>(this.path(id), changes);
  }

  remove(id: string): Observable<void> {
    return this.http.delete<void>(this.path(id));
  }

  private path(id: string): string {
    return `/api/instruments/${encodeURIComponent(id)}`;
  }
}
