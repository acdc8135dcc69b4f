import { HttpBackend, HttpXhrBackend, provideHttpClient } from '@angular/common/http';
import { EnvironmentProviders, makeEnvironmentProviders } from '@angular/core';

/**
 * An HttpClient for a route that sends files and shows how far the upload has got. The app's client
 * runs on fetch, which cannot report upload progress; this one runs on XMLHttpRequest, with the same
 * cross-site token interceptor as the app's.
 */
export function provideUploadingHttpClient(): EnvironmentProviders {
  return makeEnvironmentProviders([
    provideHttpClient(),
    { provide: HttpBackend, useExisting: HttpXhrBackend },
  ]);
}
