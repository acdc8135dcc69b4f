import { HttpClient, HttpErrorResponse, HttpEvent, HttpEventType, HttpResponse } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { RetuneMode, RetuneReport } from '@shared/midi/song-retune';
import { Observable, catchError, filter, from, map } from 'rxjs';
import { apiErrorMessage } from '../library/api-error';

/** The report the server sends beside the song: every stolen note counted, the first hundred listed. */
export interface SongReportHeader extends RetuneReport {
  notesStolenCount: number;
  uploadSha256: string;
}

/** The tuning to retune with: a preset saved in the library, or a preset document sent along. */
export type RetuneTuning = { presetId: string } | { document: unknown };

interface RetunedSong {
  blob: Blob;
  fileName: string;
  report: SongReportHeader | null;
}

/** Where a retune stands: sending the song (the fraction sent, when known), retuning, done, or refused. */
export type RetuneStep =
  | { kind: 'sending'; fraction: number | null }
  | { kind: 'retuning' }
  | { kind: 'done'; song: RetunedSong }
  | { kind: 'refused'; message: string };

function reportOf(response: HttpResponse<Blob>): SongReportHeader | null {
  const header = response.headers.get('Keyloom-Report');
  if (!header) return null;
  try {
    return JSON.parse(decodeURIComponent(header)) as SongReportHeader;
  } catch {
    return null;
  }
}

/** The name the server gave the file in Content-Disposition. */
function fileNameOf(response: HttpResponse<Blob>, mode: RetuneMode): string {
  const disposition = response.headers.get('Content-Disposition') ?? '';
  const encoded = /filename\*\s*=\s*UTF-8''([^;]+)/i.exec(disposition);
  if (encoded) return decodeURIComponent(encoded[1]);
  const plain = /filename\s*=\s*"?([^";]+)"?/i.exec(disposition);
  return plain ? plain[1] : `retuned-${mode}.mid`;
}

function stepOf(event: HttpEvent<Blob>, mode: RetuneMode): RetuneStep | null {
  switch (event.type) {
    case HttpEventType.Sent:
      return { kind: 'sending', fraction: 0 };
    case HttpEventType.UploadProgress:
      if (event.total && event.loaded >= event.total) return { kind: 'retuning' };
      return { kind: 'sending', fraction: event.total ? event.loaded / event.total : null };
    case HttpEventType.ResponseHeader:
      return { kind: 'retuning' };
    case HttpEventType.Response:
      return { kind: 'done', song: { blob: event.body ?? new Blob(), fileName: fileNameOf(event, mode), report: reportOf(event) } };
    default:
      return null;
  }
}

/** A refusal in the server's words; its JSON body arrives as a Blob because the answer was asked for as one. */
async function refusalOf(error: unknown): Promise<RetuneStep> {
  let message: unknown = null;
  if (error instanceof HttpErrorResponse && error.error instanceof Blob) {
    try {
      message = (JSON.parse(await error.error.text()) as { error?: { message?: unknown } }).error?.message;
    } catch {
      message = null;
    }
  }
  if (typeof message === 'string' && message) return { kind: 'refused', message };
  const status = error instanceof HttpErrorResponse ? error.status : null;
  const fallback = status === 413 ? 'file: larger than the limit of 5 MB.' : `The server did not retune the song (${status ?? 'no answer'}).`;
  return { kind: 'refused', message: apiErrorMessage(error, fallback) };
}

/**
 * Sends songs to be retuned. Provided by the page, so that it uses the uploading client of the
 * retune route (see upload-http.ts), which reports how much of the song has been sent.
 */
@Injectable()
export class RetuneApi {
  private readonly http = inject(HttpClient);

  retune(song: File, tuning: RetuneTuning, mode: RetuneMode): Observable<RetuneStep> {
    const form = new FormData();
    form.append('mode', mode);
    if ('presetId' in tuning) form.append('presetId', tuning.presetId);
    else form.append('preset', JSON.stringify(tuning.document));
    form.append('file', song, song.name);
    return this.http
      .post('/api/retune', form, { reportProgress: true, observe: 'events', responseType: 'blob' })
      .pipe(
        map((event) => stepOf(event, mode)),
        filter((step): step is RetuneStep => step !== null),
        catchError((error: unknown) => from(refusalOf(error))),
      );
  }
}
