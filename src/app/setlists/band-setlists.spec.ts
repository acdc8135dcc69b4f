import { provideRouter } from '@angular/router';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { By } from '@angular/platform-browser';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import type { BandDetail } from '../bands/bands-api';
import type { PresetRow } from '../library/library-api';
import { BandSetlists } from './band-setlists';
import type { Setlist } from './setlists-api';

const fenId = '3f1c2a10-0000-4000-8000-000000000001';
const reedId = '3f1c2a10-0000-4000-8000-000000000002';
const mossId = '3f1c2a10-0000-4000-8000-000000000003';
const band: BandDetail = {
  id: 'b-fen',
  name: 'Copper Fen',
  createdAt: '2026-11-01T10:00:00Z',
  role: 'editor',
  canManage: false,
  members: [],
};
const row = (id: string, name: string, revision: number): PresetRow => ({
  id,
  name,
  bandId: 'b-fen',
  bandName: 'Copper Fen',
  ownerId: 'u-mira',
  ownerLogin: 'mira-vale',
  revision,
  updatedAt: '2026-11-20T09:30:00Z',
  deletedAt: null,
  access: 'edit',
});
const presets = [
  row(fenId, 'Fen Fifths', 3),
  row(reedId, 'Reed Thirds', 2),
  row(mossId, 'Moss Sevens', 1),
];
const friday: Setlist = {
  id: 's1',
  bandId: 'b-fen',
  name: 'Friday',
  position: 0,
  access: 'edit',
  createdAt: '2026-11-21T10:00:00Z',
  updatedAt: '2026-11-21T10:00:00Z',
  entries: [
    { presetId: fenId, revision: null, trigger: 1, presetName: 'Fen Fifths', latestRevision: 3 },
    { presetId: reedId, revision: 2, trigger: null, presetName: 'Reed Thirds', latestRevision: 2 },
    {
      presetId: mossId,
      revision: null,
      trigger: null,
      presetName: 'Moss Sevens',
      latestRevision: 1,
    },
  ],
};

describe('BandSetlists', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<BandSetlists>;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const element = () => fixture.nativeElement as HTMLElement;
  const settle = async () => {
    await fixture.whenStable();
    fixture.detectChanges();
  };
  const button = (label: string, within: ParentNode = element()) =>
    Array.from(within.querySelectorAll<HTMLButtonElement>('button')).find(
      (b) => b.textContent!.includes(label) || b.getAttribute('aria-label') === label,
    )!;
  const order = () =>
    Array.from(element().querySelectorAll('.entry .preset')).map((p) => p.textContent!.trim());
  const faults = () =>
    Array.from(element().querySelectorAll('.entry .fault')).map((p) => p.textContent!.trim());

  async function open(as: BandDetail, setlists: Setlist[]) {
    fixture = TestBed.createComponent(BandSetlists);
    fixture.componentRef.setInput('band', as);
    fixture.componentRef.setInput('presets', presets);
    await settle();
    http.expectOne({ method: 'GET', url: '/api/bands/b-fen/setlists' }).flush({ items: setlists });
    await settle();
  }

  function typeTrigger(index: number, value: string) {
    const input = element().querySelectorAll<HTMLInputElement>('input.trigger')[index];
    input.value = value;
    input.dispatchEvent(new Event('input'));
  }

  it('shows a viewer the setlists read-only, in order, with what each entry follows', async () => {
    await open({ ...band, role: 'viewer' }, [{ ...friday, access: 'read' }]);
    const items = Array.from(element().querySelectorAll('ol.read-only li')).map((li) =>
      li.textContent!.replace(/\s+/g, ' ').trim(),
    );
    expect(items).toEqual([
      'Fen Fifths latest revision (3) · program change 1',
      'Reed Thirds pinned to revision 2',
      'Moss Sevens latest revision (1)',
    ]);
    expect(element().querySelectorAll('input, mat-select, button').length).toBe(0);
    expect(element().querySelector('form.create')).toBeNull();
    // Every member may open the setlist on the stage page.
    const stage = element().querySelector<HTMLAnchorElement>('a.stage-link')!;
    expect(stage.textContent).toContain(`Open ${friday.name} on stage`);
    expect(new URL(stage.href).pathname).toBe(`/stage/${friday.id}`);
  });

  it('starts a setlist only with a name the schema takes', async () => {
    await open(band, []);
    expect(element().querySelector('.empty')!.textContent).toContain('No setlists yet.');
    const name = element().querySelector<HTMLInputElement>('form.create input')!;
    name.value = '  ';
    name.dispatchEvent(new Event('input'));
    button('Start setlist').click();
    await settle();
    expect(element().querySelector('form.create mat-error')!.textContent).toBe(
      'The setlist name must not be empty.',
    );
    http.expectNone('/api/bands/b-fen/setlists');
    name.value = 'Friday';
    name.dispatchEvent(new Event('input'));
    button('Start setlist').click();
    const post = http.expectOne({ method: 'POST', url: '/api/bands/b-fen/setlists' });
    expect(post.request.body).toEqual({ name: 'Friday', entries: [] });
    post.flush({ ...friday, entries: [] });
    await waitFor('the new setlist', () => element().querySelector('app-setlist-card'), settle);
    expect(element().querySelector<HTMLInputElement>('.name input')!.value).toBe('Friday');
  });

  it(
    'reorders by keyboard and by buttons, keeping the focus on what moved',
    async () => {
      await open(band, [friday]);
      const rows = () => Array.from(element().querySelectorAll<HTMLElement>('.entry'));
      rows()[2].focus();
      rows()[2].dispatchEvent(
        new KeyboardEvent('keydown', { key: 'ArrowUp', altKey: true, bubbles: true }),
      );
      await waitFor(
        'the moved entry to keep the focus',
        () => document.activeElement === rows()[1],
        settle,
      );
      expect(order()).toEqual(['1. Fen Fifths', '2. Moss Sevens', '3. Reed Thirds']);
      expect(element().querySelector('.announcement')!.textContent).toBe(
        'Moss Sevens moved to position 2 of 3.',
      );
      rows()[1].dispatchEvent(
        new KeyboardEvent('keydown', { key: 'ArrowUp', altKey: true, bubbles: true }),
      );
      await waitFor('the second move', () => order()[0] === '1. Moss Sevens', settle);
      // Without Alt the arrow keys do nothing to the order.
      rows()[0].dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowDown', bubbles: true }));
      await settle();
      expect(order()).toEqual(['1. Moss Sevens', '2. Fen Fifths', '3. Reed Thirds']);
      expect(button('Move Moss Sevens up').disabled).toBeTrue();

      button('Move Reed Thirds up').click();
      await waitFor(
        'the button to keep the focus',
        () => document.activeElement === button('Move Reed Thirds up'),
        settle,
      );
      expect(order()).toEqual(['1. Moss Sevens', '2. Reed Thirds', '3. Fen Fifths']);
      // At the end of the list its move-down button is off, and the focus stays on the entry itself.
      button('Move Reed Thirds down').click();
      await waitFor(
        'the entry to keep the focus',
        () => document.activeElement === element().querySelectorAll('.entry')[2],
        settle,
      );
      button('Move Reed Thirds up').click();
      await waitFor('the move back', () => order()[1] === '2. Reed Thirds', settle);

      // A drop from the drag-and-drop list lands the same way.
      fixture.debugElement
        .query(By.css('.entries'))
        .triggerEventHandler('cdkDropListDropped', { previousIndex: 2, currentIndex: 0 });
      await settle();
      expect(order()).toEqual(['1. Fen Fifths', '2. Moss Sevens', '3. Reed Thirds']);

      button('Save setlist').click();
      const put = http.expectOne({ method: 'PUT', url: '/api/setlists/s1' });
      expect(put.request.body.entries.map((e: { presetId: string }) => e.presetId)).toEqual([
        fenId,
        mossId,
        reedId,
      ]);
      put.flush({ ...friday, entries: [friday.entries[0], friday.entries[2], friday.entries[1]] });
      await waitFor('the save to land', () => button('Save setlist').disabled, settle);
    },
    patientSpecMs,
  );

  it('names the entry whose program change is taken or out of range, and saves pins, triggers and removals', async () => {
    await open(band, [friday]);
    typeTrigger(2, '1');
    await settle();
    expect(faults()).toEqual([
      "Entry 3's program change is 1, already the trigger of entry 1; each program number selects one entry.",
    ]);
    expect(button('Save setlist').disabled).toBeTrue();
    typeTrigger(2, '200');
    await settle();
    expect(faults().length).toBe(1);
    expect(faults()[0]).toMatch(/^Entry 3's program change .*127/);
    typeTrigger(2, '7');
    await settle();
    expect(faults()).toEqual([]);

    // Pin Fen Fifths to revision 2; Reed Thirds follows the latest again.
    const selects = () =>
      Array.from(
        element().querySelectorAll<HTMLElement>('.entry mat-select .mat-mdc-select-trigger'),
      );
    async function pick(select: number, label: string) {
      selects()[select].click();
      await settle();
      Array.from(document.querySelectorAll<HTMLElement>('mat-option'))
        .find((o) => o.textContent!.trim() === label)!
        .click();
      await settle();
    }
    await pick(0, 'Pinned to 2');
    await pick(1, 'Latest (2)');
    button('Remove Moss Sevens from the setlist').click();
    const name = element().querySelector<HTMLInputElement>('.name input')!;
    name.value = 'Friday late';
    name.dispatchEvent(new Event('input'));
    await settle();
    button('Save setlist').click();
    const put = http.expectOne({ method: 'PUT', url: '/api/setlists/s1' });
    expect(put.request.body).toEqual({
      name: 'Friday late',
      entries: [
        { presetId: fenId, revision: 2, trigger: 1 },
        { presetId: reedId, revision: null, trigger: null },
      ],
    });
    put.flush({ ...friday, name: 'Friday late' });
    await settle();
  });

  it('names an empty setlist name and deletes a setlist after asking', async () => {
    await open(band, [friday]);
    const name = element().querySelector<HTMLInputElement>('.name input')!;
    name.value = '';
    name.dispatchEvent(new Event('input'));
    await settle();
    expect(element().querySelector('.name mat-hint')!.textContent).toBe(
      'The setlist name must not be empty.',
    );
    expect(button('Save setlist').disabled).toBeTrue();

    button('Delete setlist').click();
    await settle();
    button('Delete setlist', document.querySelector('mat-dialog-container')!).click();
    await waitFor(
      'the delete request',
      () => http.match({ method: 'DELETE', url: '/api/setlists/s1' })[0],
      settle,
    ).then((r) => r.flush(null, { status: 204, statusText: 'No Content' }));
    await waitFor('the setlist to go', () => !element().querySelector('app-setlist-card'), settle);
    expect(element().querySelector('.empty')!.textContent).toContain('No setlists yet.');
  });
});
