import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { provideRouter } from '@angular/router';
import type { Instrument } from '@shared/api/instruments';
import { ondes as exampleOndes } from '../testing/example-instruments';
import { waitFor } from '../testing/wait-for';
import { type Member, Session } from '../auth/session';
import { InstrumentsPage } from './instruments-page';
import { browserInstrumentsKey } from './my-instruments';

const mira: Member = {
  id: 'u-mira',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member',
};
const ondes: Instrument = { ...exampleOndes, port: 'Ondes MIDI 1' };

describe('InstrumentsPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<InstrumentsPage>;

  beforeEach(() => {
    localStorage.removeItem(browserInstrumentsKey);
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

  afterEach(() => {
    http.verify();
    localStorage.removeItem(browserInstrumentsKey);
  });

  const page = () => fixture.nativeElement as HTMLElement;

  async function settle() {
    await fixture.whenStable();
    fixture.detectChanges();
    await fixture.whenStable();
  }

  async function open(member: Member | null) {
    TestBed.inject(Session).member.set(member);
    fixture = TestBed.createComponent(InstrumentsPage);
    await settle();
  }

  function button(label: string, within: ParentNode = page()): HTMLButtonElement {
    return Array.from(within.querySelectorAll<HTMLButtonElement>('button')).find(
      (b) => b.textContent!.includes(label) || b.getAttribute('aria-label') === label,
    )!;
  }

  function field(label: string): HTMLInputElement {
    const formField = Array.from(page().querySelectorAll('mat-form-field')).find(
      (candidate) => candidate.querySelector('mat-label')?.textContent?.trim() === label,
    )!;
    return formField.querySelector('input')!;
  }

  function type(label: string, value: string) {
    const input = field(label);
    input.value = value;
    input.dispatchEvent(new Event('input'));
    input.dispatchEvent(new Event('blur'));
  }

  async function chooseForm(label: string) {
    page().querySelector<HTMLElement>('mat-select .mat-mdc-select-trigger')!.click();
    await settle();
    Array.from(document.querySelectorAll<HTMLElement>('mat-option'))
      .find((o) => o.textContent!.includes(label))!
      .click();
    await settle();
  }

  const errors = () =>
    Array.from(page().querySelectorAll('mat-error'))
      .map((e) => e.textContent!.trim())
      .filter(Boolean);

  it("lists a member's instruments and refuses faults by field name before anything is sent", async () => {
    await open(mira);
    http.expectOne({ method: 'GET', url: '/api/instruments' }).flush({ items: [ondes] });
    await settle();
    const row = page().querySelector('.instruments li')!;
    expect(row.querySelector('.name')!.textContent).toBe('Ondes');
    expect(row.querySelector('.summary')!.textContent).toBe(
      'MTS bulk dump · device 16 · program 5 · port Ondes MIDI 1',
    );
    expect(row.querySelector('button[aria-label="Delete Ondes"]')).not.toBeNull();

    button('Add an instrument').click();
    await settle();
    type('Instrument name', '   ');
    type('Device id', '200');
    type('Bend range', '0');
    type('First member channel', '9');
    type('Last member channel', '2');
    button('Add instrument').click();
    await settle();
    expect(errors()).toEqual([
      'The instrument name must not be empty.',
      'The device id must be at most 127 (got 200).',
      'The bend range must be at least 1 (got 0).',
      'The channel range runs from 9 down to 2; write the lower channel first.',
    ]);
    http.expectNone('/api/instruments');

    type('Instrument name', 'Lattice board');
    type('Device id', '3');
    type('Bend range', '48');
    type('Last member channel', '15');
    await chooseForm('MPE');
    button('Add instrument').click();
    await settle();
    const post = http.expectOne({ method: 'POST', url: '/api/instruments' });
    expect(post.request.body).toEqual({
      name: 'Lattice board',
      receives: 'mpe',
      deviceId: 3,
      program: 0,
      bank: 0,
      bendRange: 48,
      memberChannels: [9, 15],
      port: null,
    });
    post.flush({ ...ondes, ...post.request.body, id: 'i-board' });
    await waitFor(
      'the new instrument',
      () => page().querySelectorAll('.instruments li').length === 2,
      settle,
    );
    expect(
      Array.from(page().querySelectorAll('.instruments .name')).map((n) => n.textContent),
    ).toEqual(['Ondes', 'Lattice board']);
    expect(
      page().querySelectorAll('.instruments li')[1].querySelector('.summary')!.textContent,
    ).toBe('MPE: one note per channel with bends · device 3 · channels 9-15 · bend range 48');
  });

  it("changes and deletes a member's instrument through its own address", async () => {
    await open(mira);
    http.expectOne('/api/instruments').flush({ items: [ondes] });
    await settle();
    button('Change Ondes').click();
    await settle();
    expect(field('Tuning program').value).toBe('5');
    type('Tuning program', '6');
    button('Save changes').click();
    await settle();
    const patch = http.expectOne({ method: 'PATCH', url: '/api/instruments/i-ondes' });
    expect(patch.request.body).toEqual(
      jasmine.objectContaining({ program: 6, deviceId: 16, port: 'Ondes MIDI 1' }),
    );
    patch.flush({ ...ondes, program: 6 });
    const summary = await waitFor(
      'the changed instrument',
      () => page().querySelector('.summary'),
      settle,
    );
    expect(summary.textContent).toContain('program 6');

    button('Delete Ondes').click();
    await settle();
    button('Delete instrument', document.querySelector('mat-dialog-container')!).click();
    await settle();
    http.expectOne({ method: 'DELETE', url: '/api/instruments/i-ondes' }).flush(null);
    const empty = await waitFor('the empty list', () => page().querySelector('.empty'), settle);
    expect(page().querySelector('.instruments')).toBeNull();
    expect(empty.textContent).toContain('No instruments yet');
  });

  it("keeps a guest's instruments in this browser, without a request", async () => {
    await open(null);
    expect(page().querySelector('.note')!.textContent).toContain('kept in this browser only');
    button('Add an instrument').click();
    await settle();
    type('Instrument name', 'Borrowed synth');
    type('Device id', '16');
    type('Tuning program', '5');
    type('MIDI output port', 'USB MIDI');
    button('Add instrument').click();
    await waitFor('the kept instrument', () => localStorage.getItem(browserInstrumentsKey), settle);
    const kept = JSON.parse(localStorage.getItem(browserInstrumentsKey)!) as Record<
      string,
      unknown
    >[];
    expect(kept).toEqual([
      jasmine.objectContaining({
        name: 'Borrowed synth',
        receives: 'mts-bulk',
        deviceId: 16,
        program: 5,
        port: 'USB MIDI',
      }),
    ]);
    expect(String(kept[0]['id'])).toMatch(/^browser-/);

    // A new visit finds it again.
    fixture.destroy();
    TestBed.resetTestingModule();
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    await open(null);
    expect(page().querySelector('.instruments .name')!.textContent).toBe('Borrowed synth');
  });
});
