import { HttpClient, HttpErrorResponse, HttpEvent, HttpEventType } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { RetuneAnswer, SongReport } from '@shared/api/songs';
import { uploadTooLarge } from '@shared/api/uploads';
import type { RetuneMode } from '@shared/midi/retune-report';
import { Observable, catchError, filter, from, map } from 'rxjs';
import { apiErrorMessage } from '../api/api-error';

/** The report the server sends with the song: every stolen note counted, the first hundred listed. */
export type SongReportHeader = SongReport;

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

function songOf(answer: RetuneAnswer): RetunedSong {
  const binary = atob(answer.song);
  const bytes = Uint8Array.from(binary, (character) => character.charCodeAt(0));
  return {
    blob: new Blob([bytes], { type: 'audio/midi' }),
    fileName: answer.fileName,
    report: answer.report,
  };
}

function stepOf(event: HttpEvent<RetuneAnswer>): RetuneStep | null {
  switch (event.type) {
    case HttpEventType.Sent:
      return { kind: 'sending', fraction: 0 };
    case HttpEventType.UploadProgress:
      if (event.total && event.loaded >= event.total) return { kind: 'retuning' };
      return { kind: 'sending', fraction: event.total ? event.loaded / event.total : null };
    case HttpEventType.ResponseHeader:
      return { kind: 'retuning' };
    case HttpEventType.Response:
      return event.body
        ? { kind: 'done', song: songOf(event.body) }
        : { kind: 'refused', message: 'The server sent no song back.' };
    default:
      return null;
  }
}

/** A refusal in the server's words. */
async function refusalOf(error: unknown): Promise<RetuneStep> {
  const status = error instanceof HttpErrorResponse ? error.status : null;
  const fallback =
    status === 413
      ? uploadTooLarge
      : `The server did not retune the song (${status ?? 'no answer'}).`;
  return { kind: 'refused', message: await apiErrorMessage(error, fallback) };
}

/**
 * Sends songs to be retuned. Provided by the page, so that it uses the uploading client of the
 * retune route (see upload-http.ts), which reports how much of the song has been sent.
 */
@Injectable()
export class RetuneApi {
  private readonly http = inject(HttpClient);

  retune(
    song: File,
    tuning: RetuneTuning,
    mode: RetuneMode,
    leadInMs: number,
    instrument: string | null = null,
  ): Observable<RetuneStep> {
    const form = new FormData();
    form.append('mode', mode);
    // The caller's own instrument: its settings stand in for the preset's output block.
    if (instrument) form.append('instrument', instrument);
    form.append('leadInMs', String(leadInMs));
    if ('presetId' in tuning) form.append('presetId', tuning.presetId);
    else form.append('preset', JSON.stringify(tuning.document));
    form.append('file', song, song.name);
    return this.http
      .post<RetuneAnswer>('/api/retune', form, {
        reportProgress: true,
        observe: 'events',
        responseType: 'json',
      })
      .pipe(
        map((event) => stepOf(event)),
        filter((step): step is RetuneStep => step !== null),
        catchError((error: unknown) => from(refusalOf(error))),
      );
  }
}
