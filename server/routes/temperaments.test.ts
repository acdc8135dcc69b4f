import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer } from '../../tests/support/test-server';

let server: Awaited<ReturnType<typeof startTestServer>>;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(() => server.close());

const search = (body: unknown) =>
  request(server.app)
    .post('/api/temperaments')
    .send(body as object);

describe('POST /api/temperaments', () => {
  it('answers meantone for 81/80 in the 5-limit, TE and POTE by default, without sign-in', async () => {
    const res = await search({ limit: 5, commas: ['81/80'] });
    expect(res.status).toBe(200);
    expect(res.body.suggestions).toBeUndefined();
    expect(res.body.results.map((result: { tuning: string }) => result.tuning)).toEqual([
      'TE',
      'POTE',
    ]);
    const [te, pote] = res.body.results;
    expect(pote).toMatchObject({
      primes: [2, 3, 5],
      mapping: [
        [1, 2, 4],
        [0, -1, -4],
      ],
      commas: ['81/80'],
      periodsPerOctave: 1,
      period: 1200,
    });
    // from memory (published temperament tables): meantone POTE fifth 696.239 c; TE octave 1201.397 c
    expect(pote.period - pote.generator).toBeCloseTo(696.239, 3);
    expect(te.period).toBeCloseTo(1201.397, 3);
    expect(pote.errors).toHaveLength(6);
    expect(pote.mosSizes).toEqual(expect.arrayContaining([5, 7, 12, 19]));
  });

  it('answers minimax when asked, and the suggestions for a count', async () => {
    const res = await search({ limit: 5, count: 12, tunings: ['minimax'] });
    expect(res.status).toBe(200);
    expect(res.body.suggestions[0]).toMatchObject({ ratio: '81/80' });
    // standard acoustics texts: syntonic comma 21.5062895967 c
    expect(res.body.suggestions[0].cents).toBeCloseTo(21.5062895967, 9);
    expect(res.body.results).toHaveLength(1);
    // from memory: meantone's 5-odd-limit minimax is quarter-comma, fifth 696.5784284662 c (standard acoustics
    // texts)
    const [minimax] = res.body.results;
    expect(minimax.period - minimax.generator).toBeCloseTo(696.5784284662, 9);
  });

  it('answers a 13-limit subgroup search with two commas', async () => {
    const res = await search({
      limit: 13,
      targets: ['3/2', '11/8', '13/8', '13/11'],
      commas: ['243/242', '144/143'],
    });
    expect(res.status).toBe(200);
    expect(res.body.results[0].primes).toEqual([2, 3, 11, 13]);
  });

  it('refuses bad fields with 400, naming each', async () => {
    const cases: [unknown, string, RegExp][] = [
      [{ limit: 4 }, 'limit', /3 or 5 or 7 or 11 or 13/],
      [{}, 'limit', /prime limit .* or target intervals/],
      [{ targets: ['3/2', 'fifth'] }, 'targets[1]', /not an interval/],
      [{ limit: 5, targets: ['7/4'] }, 'targets[0]', /beyond the 5-limit/],
      [{ limit: 5, commas: ['81/80', '701.955c'] }, 'commas[1]', /size in cents/],
      [{ limit: 5, commas: ['81/80', '19/18'] }, 'commas[1]', /above 13/],
      [{ limit: 5, commas: ['9/1'] }, 'commas[0]', /power of 3 alone/],
      [{ limit: 5, count: 101 }, 'count', /100/],
      [{ limit: 5, tunings: ['least squares'] }, 'tunings[0]', /TE, POTE or minimax/],
      [{ limit: 5, extra: true }, 'extra', /not a field/],
    ];
    for (const [body, field, message] of cases) {
      const res = await search(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.code).toBe('invalid');
      expect(res.body.error.field, JSON.stringify(body)).toBe(field);
      expect(res.body.error.message).toMatch(message);
    }
  });

  it('refuses commas that leave rank 3, saying how many more rank 2 needs', async () => {
    const res = await search({ limit: 7, commas: ['81/80'] });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('commas');
    expect(res.body.error.message).toMatch(/rank-3 .* temper out 1 more independent comma/);
  });

  it('refuses commas that contradict each other', async () => {
    // arithmetic: (81/80)^2 = 6561/6400 follows from 81/80
    const dependent = await search({ limit: 7, commas: ['81/80', '6561/6400'] });
    expect(dependent.status).toBe(400);
    expect(dependent.body.error.field).toBe('commas[1]');
    // arithmetic: tempering out 3/2 and 4/3 tempers out 2/1
    const unison = await search({ limit: 7, commas: ['3/2', '4/3'] });
    expect(unison.status).toBe(400);
    expect(unison.body.error.field).toBe('commas');
    expect(unison.body.error.message).toMatch(/2\/1 and 3\/1 a unison/);
    // arithmetic: 81/80 and 128/125 together leave a rank-1 temperament (12 equal) of 2.3.5
    const rankOne = await search({ limit: 5, commas: ['81/80', '128/125'] });
    expect(rankOne.status).toBe(400);
    expect(rankOne.body.error.message).toMatch(/rank-1/);
  });

  it('refuses a body that is not JSON with 415', async () => {
    const res = await request(server.app)
      .post('/api/temperaments')
      .set('Content-Type', 'text/plain')
      .send('limit=5');
    expect(res.status).toBe(415);
  });
});
