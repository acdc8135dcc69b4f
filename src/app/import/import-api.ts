import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { PresetDocument } from '@shared/preset/preset-document';
import { Observable } from 'rxjs';

/** What the server found in a file: MTS messages, a preset document, or a list of intervals. */
export type ImportKind = 'syx' | 'preset' | 'intervals';

export interface ImportedTuning {
  kind: ImportKind;
  document: PresetDocument;
}

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
