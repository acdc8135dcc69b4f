import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatChipListboxHarness } from '@angular/material/chips/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import type { TemperamentResult, TemperamentsAnswer } from '@shared/api/temperaments';
import { decodeDesign } from '../design/design-address';
import { PageTest } from '../testing/page-test';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { TemperamentsPage } from './temperaments-page';

/** The commas' meantone in the 5-limit, as `POST /api/temperaments` answers it for 81/80 (shared/api/temperaments.ts). */
const meantone = {
  primes: [2, 3, 5],
  // Fifth as generator, four fifths to 5/1 (from memory: the standard mapping of meantone).
  mapping: [
    [1, 1, 0],
    [0, 1, 4],
  ] as [number[], number[]],
  commas: ['81/80'],
  periodsPerOctave: 1,
  // The generator chain's MOS sizes (from memory: 5, 7, 12, 19, 31 are meantone's familiar scale sizes).
  mosSizes: [2, 3, 5, 7, 12, 19, 31, 50, 81],
};
/**
 * The TE tuning worked out from its definition (least squares over the primes 2, 3, 5, each weighted by 1/log2 p)
 * for this fixture; POTE scales it to a pure octave (from memory: the POTE fifth of meantone is about 696.24 cents).
 */
const te: TemperamentResult = {
  ...meantone,
  tuning: 'TE',
  period: 1201.39685136,
  generator: 697.04911064,
  errors: [
    { interval: '3/2', cents: -4.90589023 },
    { interval: '5/4', cents: -0.91097405 },
    { interval: '6/5', cents: -3.99491618 },
  ],
};
const pote: TemperamentResult = {
  ...meantone,
  tuning: 'POTE',
  period: 1200,
  generator: 696.238659035547,
  errors: [
    { interval: '3/2', cents: -5.71634183 },
    { interval: '5/4', cents: -1.35907772 },
    { interval: '6/5', cents: -4.35726411 },
  ],
};
const meantoneAnswer: TemperamentsAnswer = { results: [te, pote] };

describe('TemperamentsPage', () => {
  let pages: PageTest;

  beforeEach(async () => {
    pages = new PageTest([
      { path: 'temperaments', component: TemperamentsPage },
      { path: 'design', children: [] },
    ]);
    await pages.open('/temperaments', null);
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();
  const text = (selector: string) => pages.text(selector);
  const settle = () => pages.settle();
  const formField = (label: string) =>
    pages.loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }));
  const input = async (label: string) =>
    (await formField(label)).getControl(MatInputHarness) as Promise<MatInputHarness>;
  const toggle = (text: string) => pages.loader.getHarness(MatButtonToggleHarness.with({ text }));
  const submit = async () => {
    page().querySelector('form')!.requestSubmit();
    await settle();
  };
  const rows = () =>
    Array.from(page().querySelectorAll('app-temperament-table tbody tr')).map((row) =>
      Array.from(row.children).map((cell) => cell.textContent!.replace(/\s+/g, ' ').trim()),
    );

  async function searchMeantone(): Promise<void> {
    await (await input('Commas to temper out')).setValue('81/80');
    await submit();
    pages.http.expectOne('/api/temperaments').flush(meantoneAnswer);
    await settle();
  }

  it('sends the question the form asks when it is submitted, and shows that it is searching', async () => {
    await (await input('Commas to temper out')).setValue('81/80');
    // Enter in a field submits the form: the form has a submit button, which is what Enter presses.
    expect(page().querySelector('form button[type=submit]')?.textContent).toContain('Search');
    await submit();

    const request = pages.http.expectOne('/api/temperaments');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ limit: 5, commas: ['81/80'], tunings: ['TE', 'POTE'] });
    expect(page().querySelector('mat-progress-bar')).not.toBeNull();
    expect(page().querySelector<HTMLButtonElement>('button.search')!.disabled).toBeTrue();
    expect(text('.announcement')).toBe('Searching…');
    request.flush(meantoneAnswer);
    await settle();
    expect(page().querySelector('mat-progress-bar')).toBeNull();
    expect(text('.announcement')).toBe('1 temperament found.');
  });

  it('asks about intervals the composer names, in the tunings chosen', async () => {
    await (await toggle('Intervals I name')).check();
    await settle();
    await (await input('Target intervals')).setValue('3/2, 5/4  7/4');
    await (await input('Commas to temper out')).setValue('81/80 225/224');
    await (await pages.loader.getHarness(MatCheckboxHarness.with({ label: /^TE:/ }))).uncheck();
    await (await pages.loader.getHarness(MatCheckboxHarness.with({ label: /^Minimax/ }))).check();
    await submit();
    expect(pages.http.expectOne('/api/temperaments').request.body).toEqual({
      targets: ['3/2', '5/4', '7/4'],
      commas: ['81/80', '225/224'],
      tunings: ['POTE', 'minimax'],
    });
  });

  it('asks in the prime limit chosen', async () => {
    const limit = await pages.loader.getHarness(MatSelectHarness);
    await limit.open();
    await limit.clickOptions({ text: '7-limit (2.3.5.7)' });
    await (await input('Commas to temper out')).setValue('225/224 81/80');
    await submit();
    expect(pages.http.expectOne('/api/temperaments').request.body).toEqual({
      limit: 7,
      commas: ['225/224', '81/80'],
      tunings: ['TE', 'POTE'],
    });
  });

  it('shows each tuning with its mapping, period, generator, errors in signed cents and MOS sizes', async () => {
    await searchMeantone();
    expect(text('app-temperament-table .commas')).toBe('Tempering out 81/80');
    expect(text('app-temperament-table .mapping')).toBe(
      'Mapping [⟨1 1 0], ⟨0 1 4]⟩ over the primes 2.3.5',
    );
    const headers = Array.from(page().querySelectorAll('app-temperament-table thead th')).map(
      (cell) => cell.textContent!.replace(/\s+/g, ' ').trim(),
    );
    expect(headers).toEqual([
      'Tuning',
      'Period',
      'Generator',
      'Error of 3/2',
      'Error of 5/4',
      'Error of 6/5',
    ]);
    const [teRow, poteRow] = rows();
    expect(teRow.slice(0, 6)).toEqual([
      'TE Tenney-Euclidean',
      '1201.40¢',
      '697.05¢',
      '−4.91¢',
      '−0.91¢',
      '−3.99¢',
    ]);
    expect(poteRow.slice(0, 6)).toEqual([
      'POTE Tenney-Euclidean, pure period',
      '1200.00¢',
      '696.24¢',
      '−5.72¢',
      '−1.36¢',
      '−4.36¢',
    ]);
    const listboxes = await pages.loader.getAllHarnesses(MatChipListboxHarness);
    expect(listboxes.length).toBe(2);
    const sizes = await Promise.all((await listboxes[1].getChips()).map((chip) => chip.getText()));
    expect(sizes).toEqual(['2', '3', '5', '7', '12', '19', '31', '50', '81']);
  });

  it(
    "shows the server's refusal of a comma beside the commas field, and goes there",
    async () => {
      await (await input('Commas to temper out')).setValue('81/80 81/8x');
      await submit();
      // The fault of shared/tuning/interval.ts for text that is no interval, at the path the server names.
      const fault = '"81/8x" is not an interval: write a ratio such as 3/2';
      pages.http
        .expectOne('/api/temperaments')
        .flush(
          { error: { code: 'invalid', message: `commas[1]: ${fault}`, field: 'commas[1]' } },
          { status: 400, statusText: 'Bad Request' },
        );
      const commas = await formField('Commas to temper out');
      await waitFor(
        'the refusal beside the field',
        async () => (await commas.getTextErrors()).length,
        settle,
      );
      expect(await commas.getTextErrors()).toEqual([`Comma 2: ${fault}`]);
      const control = page().querySelector<HTMLInputElement>('input.commas')!;
      expect(control.getAttribute('aria-invalid')).toBe('true');
      expect(document.activeElement).toBe(control);
      expect(page().querySelector('.actions .fault')).toBeNull();
      expect(page().querySelector('app-temperament-table')).toBeNull();

      // Typing again clears the fault: it no longer describes what the field holds.
      await (await input('Commas to temper out')).setValue('81/80');
      await settle();
      expect(await commas.getTextErrors()).toEqual([]);
    },
    patientSpecMs,
  );

  it(
    'shows a refusal of the prime limit under the limit, and one naming no field under the button',
    async () => {
      await (await input('Commas to temper out')).setValue('81/80');
      await submit();
      pages.http.expectOne('/api/temperaments').flush(
        {
          error: {
            code: 'invalid',
            message: 'limit: 81/80 and 2048/2025 leave a temperament of rank 1, not 2',
            field: 'limit',
          },
        },
        { status: 400, statusText: 'Bad Request' },
      );
      const limit = await pages.loader.getHarness(
        MatFormFieldHarness.with({ floatingLabelText: 'Prime limit' }),
      );
      await waitFor(
        'the refusal under the limit',
        async () => (await limit.getTextErrors()).length,
        settle,
      );
      expect(await limit.getTextErrors()).toEqual([
        '81/80 and 2048/2025 leave a temperament of rank 1, not 2',
      ]);

      await submit();
      pages.http
        .expectOne('/api/temperaments')
        .flush('upstream hiccup', { status: 502, statusText: 'Bad Gateway' });
      await waitFor('the refusal under the button', () => text('.actions .fault'), settle);
      expect(text('.actions .fault')).toBe('The search could not be made.');
      expect(await limit.getTextErrors()).toEqual([]);
    },
    patientSpecMs,
  );

  it('refuses to search without a comma or a tuning, naming the field, before asking the server', async () => {
    await submit();
    pages.http.expectNone('/api/temperaments');
    expect(await (await formField('Commas to temper out')).getTextErrors()).toEqual([
      'Name at least one comma, such as 81/80, or ask for suggestions.',
    ]);
    expect(document.activeElement).toBe(page().querySelector('input.commas'));

    await (await input('Commas to temper out')).setValue('81/80');
    for (const label of [/^TE:/, /^POTE:/]) {
      await (await pages.loader.getHarness(MatCheckboxHarness.with({ label }))).uncheck();
    }
    await submit();
    pages.http.expectNone('/api/temperaments');
    expect(text('.tunings .field-fault')).toBe('Choose at least one tuning.');
  });

  it('asks for suggested commas, and adds the one clicked to the commas to search with', async () => {
    await (await toggle('Suggest some')).check();
    await settle();
    await (await input('Notes per octave')).setValue('12');
    await submit();
    const request = pages.http.expectOne('/api/temperaments');
    expect(request.request.body).toEqual({ limit: 5, count: 12, tunings: ['TE', 'POTE'] });
    // Sizes 1200·log2(n/d) and Tenney heights log2(n·d) of commas that vanish in 12 equal steps (arithmetic).
    request.flush({
      results: [],
      suggestions: [
        { ratio: '81/80', cents: 21.5062896, complexity: 12.6617781 },
        { ratio: '128/125', cents: 41.0588584, complexity: 13.9657843 },
        { ratio: '648/625', cents: 62.565148, complexity: 18.6275624 },
      ],
    } satisfies TemperamentsAnswer);
    await settle();
    expect(text('.suggestions h3')).toBe('Commas worth tempering out for 12 notes');
    const suggestions = Array.from(page().querySelectorAll('.suggestions li')).map((item) =>
      item.textContent!.replace(/\s+/g, ' ').trim(),
    );
    expect(suggestions).toEqual([
      'add 81/80 21.51¢ · Tenney height 12.66',
      'add 128/125 41.06¢ · Tenney height 13.97',
      'add 648/625 62.57¢ · Tenney height 18.63',
    ]);
    expect(text('.announcement')).toBe('0 temperaments found, 3 commas suggested.');

    page()
      .querySelector<HTMLButtonElement>('button[aria-label="Add 128/125 to the commas"]')!
      .click();
    await settle();
    const commas = page().querySelector<HTMLInputElement>('input.commas')!;
    expect(commas.value).toBe('128/125');
    expect(document.activeElement).toBe(commas);
    page()
      .querySelector<HTMLButtonElement>('button[aria-label="Add 81/80 to the commas"]')!
      .click();
    await settle();
    expect(commas.value).toBe('128/125 81/80');

    await submit();
    expect(pages.http.expectOne('/api/temperaments').request.body).toEqual({
      limit: 5,
      commas: ['128/125', '81/80'],
      tunings: ['TE', 'POTE'],
    });
  });

  it('opens a chosen MOS size in the designer as a generated scale of the tempered generator and period', async () => {
    await searchMeantone();
    // Twelve is chosen at first, in the first tuning.
    expect(text('.opening .what')).toContain('12 notes from the TE tuning');
    const poteSizes = (await pages.loader.getAllHarnesses(MatChipListboxHarness))[1];
    await poteSizes.selectChips({ text: '19' });
    await settle();

    expect(text('.opening .what')).toBe(
      '19 notes from the POTE tuning: generator 696.238659c in a period of 2/1, 12 generators up and 6 down.',
    );
    // Nineteen notes of meantone: twelve chromatic semitones (7 fifths less 4 octaves) and seven dieses (a diatonic
    // semitone, 3 octaves less 5 fifths, less a chromatic one): arithmetic on the fifth of 696.239 cents.
    expect(text('.opening .pattern')).toMatch(/^[Ls]{19}$/);
    expect(text('.opening .badge')).toBe('MOS');
    expect(text('.opening .steps')).toBe('L = 73.67¢ × 12 s = 45.14¢ × 7');

    const open = page().querySelector<HTMLAnchorElement>('a.open')!;
    expect(open.textContent).toContain('Open 19 notes in the designer');
    open.click();
    await settle();
    const address = TestBed.inject(Router).parseUrl(TestBed.inject(Router).url);
    expect(address.root.children['primary'].segments.map((s) => s.path)).toEqual(['design']);
    const design = decodeDesign(address.queryParamMap.get('d')!);
    if (typeof design === 'string') fail(design);
    else {
      expect(design.scale.kind).toBe('generated');
      if (design.scale.kind === 'generated') {
        expect(Number(design.scale.generator.replace(/c$/, ''))).toBeCloseTo(696.238659, 6);
        expect(design.scale.period).toBe('2/1');
        expect(Number(design.scale.up) + Number(design.scale.down) + 1).toBe(19);
      }
      expect(design.name).toBe('19 notes tempering out 81/80 (POTE)');
    }
  });

  it('opens twelve notes of the TE tuning with its tempered period in cents', async () => {
    await searchMeantone();
    expect(text('.opening .steps')).toMatch(/^L = [\d.]+¢ × 7 s = [\d.]+¢ × 5$/);
    page().querySelector<HTMLAnchorElement>('a.open')!.click();
    await settle();
    const router = TestBed.inject(Router);
    const design = decodeDesign(router.parseUrl(router.url).queryParamMap.get('d')!);
    if (typeof design === 'string') fail(design);
    else if (design.scale.kind !== 'generated') fail(design.scale.kind);
    else {
      expect(Number(design.scale.generator.replace(/c$/, ''))).toBeCloseTo(697.04911064, 6);
      expect(Number(design.scale.period.replace(/c$/, ''))).toBeCloseTo(1201.39685136, 6);
      // Twelve fifths from E-flat to G-sharp around C: three below, eight above (common practice).
      expect([design.scale.down, design.scale.up]).toEqual([3, 8]);
    }
  });
});
