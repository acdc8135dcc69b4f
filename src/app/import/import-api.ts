import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { ImportedTuning } from '@shared/api/songs';
import { Observable } from 'rxjs';

export type { ImportedTuning, ImportKind } from '@shared/api/songs';

/** Turns a file into a preset document on the server, which reads .syx, preset .json and interval lists alike. */
@Injectable({ providedIn: 'root' })
export class ImportApi {
  private readonly http = inject(HttpClient);

  importFile(file: File): Observable<ImportedTuning> {
    const form = new FormData();
    form.append('file', file, file.name);
    return this.http.post<ImportedTuning>('/api/import', form);
  }
}
