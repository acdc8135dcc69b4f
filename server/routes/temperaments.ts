import { Router } from 'express';
import { parseRequest } from '../../shared/api/requests';
import { type TemperamentsAnswer, temperamentRequest } from '../../shared/api/temperaments';
import { searchTemperaments } from '../../shared/temperament/temperament-search';
import { valueOrThrow } from '../http/validation';

/**
 * The generator search, for anyone: no sign-in. The work is small and bounded by the request schema (at most 20
 * targets, 6 commas of 40 characters, primes up to 13), so it answers on the event loop.
 */
export function temperamentsRouter(): Router {
  return Router().post('/api/temperaments', (req, res) => {
    const question = valueOrThrow(parseRequest(temperamentRequest, req.body));
    const { results, suggestions } = valueOrThrow(searchTemperaments(question));
    res.json({
      results,
      ...(suggestions ? { suggestions } : {}),
    } satisfies TemperamentsAnswer);
  });
}
