import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { TemperamentRequest, TemperamentsAnswer } from '@shared/api/temperaments';
import { Observable } from 'rxjs';

export type {
  TemperamentRequest,
  TemperamentResult,
  TemperamentsAnswer,
} from '@shared/api/temperaments';

/** Generator search: the rank-2 temperaments that fit a composer's intervals and commas, tuned on the server. */
@Injectable({ providedIn: 'root' })
export class TemperamentsApi {
  private readonly http = inject(HttpClient);

  search(question: TemperamentRequest): Observable<TemperamentsAnswer> {
    return this.http.post<TemperamentsAnswer>('/api/temperaments', question);
  }
}
