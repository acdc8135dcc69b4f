import {
  DestroyRef,
  Injector,
  PendingTasks,
  type Signal,
  assertInInjectionContext,
  computed,
  inject,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { Observable, catchError, concat, from, map, of, switchMap } from 'rxjs';
import { apiErrorMessage, isNotFound } from './api-error';

/** Data a page shows from the server, as signals, and the way to fetch it again. */
export interface Loaded<T> {
  /** The last value that came; it stays while the next one loads, and after a failure. */
  readonly value: Signal<T | undefined>;
  readonly loading: Signal<boolean>;
  /** Why the last load failed, in the server's words (api-error.ts); null once one succeeds. */
  readonly failure: Signal<string | null>;
  /** Fetches again with the same request: after a change the page made, say. */
  reload(): void;
}

export interface LoaderOptions {
  /** What to say when a load fails and the server gave no message of its own. */
  fallback: string;
  /** What to say when the server answers 404, where not finding the thing needs its own words. */
  notFound?: string;
  /** The injector to use outside an injection context (a constructor, a field initialiser). */
  injector?: Injector;
}

type Step<T> =
  | { kind: 'idle' }
  | { kind: 'loading' }
  | { kind: 'loaded'; value: T }
  | { kind: 'failed'; message: string }
  | { kind: 'settled' };

/**
 * The one way a page loads data. `request` is read like a `computed`: it runs again, and the
 * load with it, whenever a signal it reads changes (a load still under way is dropped). It gives
 * the observable to load from, or null when there is nothing to load (signed out, say), which
 * clears the value and the failure. Call it in an injection context, or pass `injector`.
 */
export function loader<T>(request: () => Observable<T> | null, options: LoaderOptions): Loaded<T> {
  if (!options.injector) assertInInjectionContext(loader);
  const injector = options.injector ?? inject(Injector);
  const reloads = signal(0);
  const value = signal<T | undefined>(undefined);
  const loading = signal(false);
  const failure = signal<string | null>(null);
  const requests = computed(() => {
    reloads();
    return request();
  });
  // Reading an error body can take a moment (a Blob); until it is read, the app is not stable.
  const pendingTasks = injector.get(PendingTasks);
  const failed = async (error: unknown): Promise<Step<T>> => {
    const done = pendingTasks.add();
    try {
      const notFound = options.notFound && isNotFound(error) ? options.notFound : null;
      const message = notFound ?? (await apiErrorMessage(error, options.fallback));
      return { kind: 'failed', message };
    } finally {
      done();
    }
  };

  toObservable(requests, { injector })
    .pipe(
      switchMap((source): Observable<Step<T>> => {
        if (source === null) return of({ kind: 'idle' });
        const outcome = source.pipe(
          map((loaded): Step<T> => ({ kind: 'loaded', value: loaded })),
          catchError((error: unknown) => from(failed(error))),
        );
        const started: Step<T> = { kind: 'loading' };
        return concat(of(started), outcome, of<Step<T>>({ kind: 'settled' }));
      }),
      takeUntilDestroyed(injector.get(DestroyRef)),
    )
    .subscribe((step) => {
      switch (step.kind) {
        case 'idle':
          value.set(undefined);
          failure.set(null);
          loading.set(false);
          break;
        case 'loading':
          loading.set(true);
          break;
        case 'loaded':
          value.set(step.value);
          failure.set(null);
          loading.set(false);
          break;
        case 'failed':
          failure.set(step.message);
          loading.set(false);
          break;
        case 'settled':
          loading.set(false);
      }
    });

  return {
    value: value.asReadonly(),
    loading: loading.asReadonly(),
    failure: failure.asReadonly(),
    reload: () => reloads.update((n) => n + 1),
  };
}
