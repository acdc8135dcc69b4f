import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBarHarness } from '@angular/material/snack-bar/testing';
import { MatTabGroupHarness } from '@angular/material/tabs/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { of } from 'rxjs';
import { PageTest } from '../testing/page-test';
import { patientSpecMs, waitFor } from '../testing/wait-for';
import { Session } from '../auth/session';
import { decodeDesign, encodeDesign } from './design-address';
import { ShareDialog } from '../share/share-dialog';
import { DesignPage } from './design-page';
import { type DraftDocument, newDraft } from './draft-document';

const member = {
  id: 'u1',
  login: 'mira-vale',
  name: 'Mira Vale',
  email: null,
  avatarUrl: null,
  siteRole: 'member' as const,
};

describe('DesignPage', () => {
  let http: HttpTestingController;
  let pages: PageTest;

  beforeEach(() => {
    pages = new PageTest(
      [
        { path: 'design', component: DesignPage },
        { path: 'presets/:id', component: DesignPage },
      ],
      [{ provide: MatDialog, useValue: { open: () => ({ afterClosed: () => of(undefined) }) } }],
    );
    http = pages.http;
  });

  afterEach(() => pages.verify());

  async function open(url: string, who: typeof member | null) {
    TestBed.inject(Session).member.set(who);
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, DesignPage);
    const element = harness.routeNativeElement as HTMLElement;
    return {
      harness,
      element,
      nameInput: () => element.querySelector<HTMLInputElement>('app-design-field.name input')!,
    };
  }

  /** The one request for `url`, once the page has sent it. */
  async function requestFor(url: string): Promise<TestRequest> {
    const sent = await waitFor(`a request for ${url}`, () => {
      const found = http.match(url);
      return found.length > 0 ? found : null;
    });
    expect(sent.length).withContext(`requests for ${url}`).toBe(1);
    return sent[0];
  }

  it('shows the designer signed out, with a sign-in that comes back to this very design', async () => {
    const { element } = await open('/design', null);
    expect(element.querySelector('h1')?.textContent).toBe('Design a scale');
    const signIn = element.querySelector<HTMLAnchorElement>('a.sign-in-to-save')!;
    expect(signIn.textContent).toContain('Sign in to save');
    const href = new URL(signIn.href);
    expect(href.pathname).toBe('/auth/github');
    const back = new URL(href.searchParams.get('next')!, 'http://keyloom.test');
    expect(back.pathname).toBe('/design');
    expect(decodeDesign(back.searchParams.get('d')!)).toEqual(newDraft());
    expect(element.querySelectorAll('app-degree-table tbody tr').length).toBe(7);
    expect(element.querySelector('app-period-ring svg')).not.toBeNull();
    expect(element.querySelector('app-offset-chart svg')).not.toBeNull();
    expect(element.querySelectorAll('app-interval-matrix tbody tr').length).toBe(7);
  });

  it(
    'opens the design an address holds, and writes edits back into the address',
    async () => {
      const design: DraftDocument = {
        ...newDraft(),
        name: 'Bookmarked',
        scale: { kind: 'equal', divisions: 31, period: '2/1' },
      };
      const { harness, element, nameInput } = await open(`/design?d=${encodeDesign(design)}`, null);
      expect(nameInput().value).toBe('Bookmarked');
      expect(element.querySelectorAll('app-degree-table tbody tr').length).toBe(31);

      nameInput().value = 'Bookmarked again';
      nameInput().dispatchEvent(new Event('input'));
      const router = TestBed.inject(Router);
      const written = await waitFor(
        'the address to hold the new name',
        () => {
          const d = new URL(router.url, 'http://keyloom.test').searchParams.get('d');
          const held = d ? decodeDesign(d) : null;
          return typeof held === 'object' && held?.name === 'Bookmarked again' ? held : null;
        },
        () => harness.fixture.whenStable(),
      );
      expect(written).toEqual({ ...design, name: 'Bookmarked again' });
    },
    patientSpecMs,
  );

  it('links to the tuner with the design on screen', async () => {
    const { element } = await open('/design', null);
    const tuner = new URL(element.querySelector<HTMLAnchorElement>('a.tuner')!.href);
    expect(tuner.pathname).toBe('/tuner');
    expect(decodeDesign(tuner.searchParams.get('d')!)).toEqual(newDraft());
  });

  it(
    'links to the tuner with a saved preset’s id and revision while it is unchanged',
    async () => {
      const opening = open('/presets/p-9', member);
      (await requestFor('/api/presets/p-9')).flush({
        id: 'p-9',
        name: 'Reed set',
        bandId: null,
        revision: 5,
        document: { ...newDraft(), name: 'Reed set' },
        access: 'edit',
      });
      const { harness, element } = await opening;
      await harness.fixture.whenStable();
      const tuner = new URL(element.querySelector<HTMLAnchorElement>('a.tuner')!.href);
      expect(tuner.pathname + tuner.search).toBe('/tuner?preset=p-9&revision=5');
    },
    patientSpecMs,
  );

  it('says so when the address holds a design it cannot read, and starts a new one', async () => {
    const { element } = await open('/design?d=1.broken', null);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('damaged');
    expect(element.querySelectorAll('app-degree-table tbody tr').length).toBe(7);
  });

  it(
    'opens a saved preset with its revision, read-only for a reader, with a fork button',
    async () => {
      const opening = open('/presets/p-7', member);
      (await requestFor('/api/presets/p-7')).flush({
        id: 'p-7',
        name: 'Guest tuning',
        bandId: null,
        revision: 3,
        document: { ...newDraft(), name: 'Guest tuning' },
        access: 'read',
      });
      const { harness, element, nameInput } = await opening;
      await harness.fixture.whenStable();
      expect(element.querySelector('.status')?.textContent).toContain('Revision 3 · read only');
      expect(nameInput().readOnly).toBeTrue();
      const buttons = Array.from(element.querySelectorAll('button')).map((button) =>
        button.textContent?.trim(),
      );
      expect(buttons.some((text) => text?.includes('Fork to my library'))).toBeTrue();
      expect(buttons.some((text) => text?.includes('Save'))).toBeFalse();
      // A reader may not make share links, so the page offers none.
      expect(element.querySelector('button.share')).toBeNull();
      expect(element.querySelector('fieldset')?.disabled).toBeTrue();
    },
    patientSpecMs,
  );

  it(
    'offers Share on a saved preset its editor opens, with the share dialog for that revision',
    async () => {
      const opening = open('/presets/p-8', member);
      (await requestFor('/api/presets/p-8')).flush({
        id: 'p-8',
        name: 'Band tuning',
        bandId: 'b-1',
        revision: 4,
        document: { ...newDraft(), name: 'Band tuning' },
        access: 'edit',
      });
      const { harness, element } = await opening;
      await harness.fixture.whenStable();
      const opened = spyOn(TestBed.inject(MatDialog), 'open').and.callThrough();
      const share = await waitFor('the Share button', () =>
        element.querySelector<HTMLButtonElement>('button.share'),
      );
      share.click();
      expect(opened).toHaveBeenCalledWith(
        ShareDialog,
        jasmine.objectContaining({ data: { presetId: 'p-8', revision: 4, name: 'Band tuning' } }),
      );
    },
    patientSpecMs,
  );

  it(
    'saves with Ctrl+S when signed in, asking first which library to save into',
    async () => {
      await open('/design', member);
      document.dispatchEvent(
        new KeyboardEvent('keydown', { key: 's', code: 'KeyS', ctrlKey: true, cancelable: true }),
      );
      (await requestFor('/api/bands')).flush({ items: [] });
    },
    patientSpecMs,
  );

  it(
    'says why Ctrl+S cannot save for a visitor who has not signed in',
    async () => {
      const { harness } = await open('/design', null);
      document.dispatchEvent(
        new KeyboardEvent('keydown', { key: 's', code: 'KeyS', ctrlKey: true, cancelable: true }),
      );
      await waitFor('a snack bar', () => document.querySelector('mat-snack-bar-container'));
      const snackBar = await TestbedHarnessEnvironment.documentRootLoader(
        harness.fixture,
      ).getHarness(MatSnackBarHarness);
      expect(await snackBar.getMessage()).toContain('Sign in to save');
    },
    patientSpecMs,
  );

  it('switches tabs with Alt and a number', async () => {
    const { harness, element } = await open('/design', null);
    document.dispatchEvent(
      new KeyboardEvent('keydown', { key: '2', code: 'Digit2', altKey: true }),
    );
    await harness.fixture.whenStable();
    const tabs = await TestbedHarnessEnvironment.loader(harness.fixture).getHarness(
      MatTabGroupHarness,
    );
    expect(await (await tabs.getSelectedTab()).getLabel()).toContain('Keys');
    expect(element.querySelector('app-keyboard-strip')).not.toBeNull();
  });
});
