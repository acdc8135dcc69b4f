import { type HttpInterceptorFn, HttpErrorResponse, HttpEventType } from '@angular/common/http';
import { Injectable, inject, signal } from '@angular/core';
import { tap } from 'rxjs';

/** Whether the Keyloom server answers: lost when a request gets no answer at all, back with the next answer. */
@Injectable({ providedIn: 'root' })
export class Connection {
  readonly lost = signal(false);
}

/** Watches every request so that the shell can say when the server stops answering, and when it is back. */
export const connectionInterceptor: HttpInterceptorFn = (request, next) => {
  const connection = inject(Connection);
  return next(request).pipe(
    tap({
      next: (event) => {
        if (event.type === HttpEventType.Response) connection.lost.set(false);
      },
      error: (error: unknown) => {
        // Status 0: no answer (server down, network gone); a 503 says the same of the database.
        const status = error instanceof HttpErrorResponse ? error.status : -1;
        connection.lost.set(status === 0 || status === 503);
      },
    }),
  );
};
