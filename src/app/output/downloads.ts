import { HttpClient, type HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { type Observable, firstValueFrom } from 'rxjs';
import type { DraftDocument } from '../design/draft-document';
import type { ExportFormat } from './export-formats';

/** What a file is made from: a saved preset's latest revision, or a design that is not saved as it stands. */
export type ExportSource = { presetId: string } | { document: DraftDocument };

function decodedOrNull(text: string): string | null {
  try {
    return decodeURIComponent(text.trim());
  } catch {
    return null;
  }
}

/** The file name a `Content-Disposition` header gives, preferring the UTF-8 form. */
export function fileNameFrom(disposition: string | null): string | null {
  if (!disposition) return null;
  const extended = /filename\*\s*=\s*UTF-8''([^;]+)/i.exec(disposition);
  const decoded = extended && decodedOrNull(extended[1]);
  if (decoded) return decoded;
  const plain = /filename\s*=\s*(?:"([^"]*)"|([^;]+))/i.exec(disposition);
  return plain ? (plain[1] ?? plain[2]).trim() : null;
}

/** A file handed to the browser, and what the server said about it (keys it had to clamp, say). */
interface DeliveredFile {
  name: string;
  warnings: string[];
}

/** The notes the server sends with a file in its `Keyloom-Warnings` header: a URI-encoded JSON list. */
function warningsFrom(header: string | null): string[] {
  if (!header) return [];
  try {
    const warnings: unknown = JSON.parse(decodeURIComponent(header));
    return Array.isArray(warnings) ? warnings.map(String) : [];
  } catch {
    return [];
  }
}

/** Fetches export files from the server and hands them to the browser as downloads. */
@Injectable({ providedIn: 'root' })
export class Downloads {
  private readonly http = inject(HttpClient);

  /**
   * Downloads one format; resolves to the saved file, rejects with the server's refusal. `query`
   * aims the file at an instrument (`instrument=ID`, or a guest's settings).
   */
  async download(
    format: ExportFormat,
    source: ExportSource,
    query: Record<string, string> = {},
  ): Promise<DeliveredFile> {
    const response = await firstValueFrom(this.request(format.id, source, query));
    const name =
      fileNameFrom(response.headers.get('Content-Disposition')) ??
      `keyloom-${format.id}.${format.extension}`;
    this.deliver(response.body ?? new Blob([]), name);
    return { name, warnings: warningsFrom(response.headers.get('Keyloom-Warnings')) };
  }

  private request(
    format: string,
    source: ExportSource,
    params: Record<string, string>,
  ): Observable<HttpResponse<Blob>> {
    const options = { observe: 'response' as const, responseType: 'blob' as const, params };
    if ('document' in source) {
      return this.http.post(`/api/preview/export/${format}`, source.document, options);
    }
    const id = encodeURIComponent(source.presetId);
    const path =
      format === 'bundle' ? `/api/presets/${id}/bundle` : `/api/presets/${id}/export/${format}`;
    return this.http.get(path, options);
  }

  private deliver(file: Blob, name: string): void {
    const link = document.createElement('a');
    link.href = URL.createObjectURL(file);
    link.download = name;
    link.click();
    setTimeout(() => URL.revokeObjectURL(link.href), 0);
  }
}
