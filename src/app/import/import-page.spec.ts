import { HttpTestingController } from '@angular/common/http/testing';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { decodeDesign } from '../design/design-address';
import { ImportPage } from './import-page';
import { PageTest } from '../testing/page-test';

/** What server/routes/imports.ts answers for a text list of Pythagorean intervals (shared/import/interval-list.ts). */
const fenFifthsList = {
  kind: 'intervals',
  document: {
    format: 'keyloom.preset',
    version: 1,
    name: 'Fen Fifths',
    notes: 'Imported from a list of intervals.',
    scale: {
      kind: 'list',
      degrees: ['9/8', '81/64', '4/3', '3/2', '27/16', '243/128'],
      period: '2/1',
    },
    mapping: { rootKey: 60 },
  },
};

describe('ImportPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(async () => {
    pages = new PageTest([{ path: 'import', component: ImportPage }]);
    http = pages.http;
    await pages.open('/import', null);
  });

  afterEach(() => pages.verify());

  const page = () => pages.page();
  const text = (selector: string) => pages.text(selector);

  const settle = () => pages.settle();

  async function drop(file: File) {
    const transfer = new DataTransfer();
    transfer.items.add(file);
    page()
      .querySelector('app-file-drop button')!
      .dispatchEvent(new DragEvent('drop', { dataTransfer: transfer, cancelable: true }));
    await settle();
  }

  it('shows the degrees of an imported list and opens it in the designer with the same scale', async () => {
    await drop(
      new File(['# Fen Fifths\n9/8\n81/64\n4/3\n3/2\n27/16\n243/128\n'], 'fen-fifths.txt', {
        type: 'text/plain',
      }),
    );
    expect(text('.chosen')).toContain('fen-fifths.txt');
    expect(text('.status')).toBe('Reading the file…');
    const request = http.expectOne('/api/import');
    expect(request.request.method).toBe('POST');
    expect(((request.request.body as FormData).get('file') as File).name).toBe('fen-fifths.txt');
    request.flush(fenFifthsList);
    await settle();

    expect(text('.kind')).toContain('A list of intervals');
    expect(text('.announcement')).toBe('Found Fen Fifths: A list of intervals.');
    expect(text('.tuning-name')).toBe('Fen Fifths');
    expect(text('.summary')).toContain('7 degrees in a period of 2/1');
    expect(text('.notes')).toContain('It repeats every octave, 7 keys to the octave.');
    expect(text('.notes')).toContain('Degree 0 sounds on key 60 (C4) at 261.63 Hz.');
    const rows = Array.from(page().querySelectorAll('app-degree-table tbody tr')).map((row) =>
      Array.from(row.children).map((cell) => cell.textContent!.trim()),
    );
    expect(rows.map((row) => row[2])).toEqual([
      '1/1',
      '9/8',
      '81/64',
      '4/3',
      '3/2',
      '27/16',
      '243/128',
    ]);
    // 1200·log2(9/8) = 203.910 cents and 1200·log2(81/64) = 407.820 cents (from memory, checked by the shared tests).
    expect(rows[1][3]).toBe('203.910¢');
    expect(rows[2][3]).toBe('407.820¢');

    const open = page().querySelector<HTMLAnchorElement>('a.open')!;
    expect(open.textContent).toContain('Open in the designer');
    const address = new URL(open.href);
    expect(address.pathname).toBe('/design');
    const design = decodeDesign(address.searchParams.get('d')!);
    if (typeof design === 'string') fail(design);
    else {
      expect(design.scale).toEqual(fenFifthsList.document.scale as typeof design.scale);
      expect(design.name).toBe('Fen Fifths');
      expect(design.mapping.rootKey).toBe(60);
    }
    expect(
      new URL(page().querySelector<HTMLAnchorElement>('a.retune')!.href).searchParams.get('d'),
    ).toBe(address.searchParams.get('d'));
  });

  it(
    "shows the server's refusal, which names the line at fault",
    async () => {
      await drop(new File(['9/8\n5/4\n1.5\n'], 'reed-hollow.txt', { type: 'text/plain' }));
      // The message shared/tuning/interval.ts gives for a bare decimal, at the line shared/import/interval-list.ts names.
      const message = 'line 3: 1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2';
      http
        .expectOne('/api/import')
        .flush(
          { error: { code: 'invalid', message, field: 'line 3' } },
          { status: 400, statusText: 'Bad Request' },
        );
      await waitFor('the refusal', () => page().querySelector('.refusal'), settle);
      expect(text('.refusal h3')).toBe('This file could not be imported');
      expect(text('.refusal-message')).toBe(message);
      expect(text('.announcement')).toBe('');
      expect(page().querySelector('a.open')).toBeNull();
    },
    patientSpecMs,
  );

  it('refuses a file over 5 MB without sending it', async () => {
    await drop(new File([new Uint8Array(6 * 1024 * 1024)], 'copper-fen.syx'));
    http.expectNone('/api/import');
    expect(text('.refusal-message')).toContain('larger than the limit of 5 MB');
  });

  it('opens the file picker from the drop zone, which is a button reachable by keyboard', async () => {
    const button = page().querySelector<HTMLButtonElement>('app-file-drop button')!;
    const picker = page().querySelector<HTMLInputElement>('app-file-drop input[type=file]')!;
    const opened = spyOn(picker, 'click');
    expect(button.type).toBe('button');
    expect(button.textContent).toContain('Choose a file to import');
    button.focus();
    expect(document.activeElement).toBe(button);
    button.click();
    expect(opened).toHaveBeenCalled();
  });
});
