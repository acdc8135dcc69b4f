import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { SaveDialog, type SaveDialogData } from './save-dialog';

describe('SaveDialog', () => {
  async function render(data: SaveDialogData) {
    const close = jasmine.createSpy('close');
    TestBed.configureTestingModule({
      imports: [SaveDialog],
      providers: [
        { provide: MAT_DIALOG_DATA, useValue: data },
        { provide: MatDialogRef, useValue: { close } },
      ],
    });
    const fixture = TestBed.createComponent(SaveDialog);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const saveButton = () =>
      Array.from(element.querySelectorAll('button')).find(
        (button) => button.textContent?.trim() === 'Save',
      )!;
    return { fixture, element, close, saveButton };
  }

  const bands = [
    { id: 'b-2', name: 'Copper Fen', role: 'editor' as const, createdAt: '2026-11-01T10:00:00Z' },
  ];

  it('saves into my library unless a band is chosen', async () => {
    const { element, fixture, close, saveButton } = await render({
      name: 'Fifths',
      bands,
      nextRevision: null,
    });
    expect(element.querySelector('h2')?.textContent?.trim()).toBe('Save preset');
    expect(element.querySelector('mat-select')?.textContent).toContain('My library');
    saveButton().click();
    expect(close).toHaveBeenCalledWith({ name: 'Fifths', bandId: null, note: '' });

    const library = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness);
    await library.open();
    await library.clickOptions({ text: /Copper Fen/ });
    const note = element.querySelector<HTMLTextAreaElement>('textarea')!;
    note.value = ' widened the wolf ';
    note.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    saveButton().click();
    expect(close).toHaveBeenCalledWith({ name: 'Fifths', bandId: 'b-2', note: 'widened the wolf' });
  });

  it('names the revision a saved preset will get, and asks for no library', async () => {
    const { element } = await render({ name: 'Fifths', bands: null, nextRevision: 5 });
    expect(element.querySelector('h2')?.textContent?.trim()).toBe('Save revision 5');
    expect(element.querySelector('mat-select')).toBeNull();
  });

  it('will not save a preset without a name, and says so under the field', async () => {
    const { element, fixture, close, saveButton } = await render({
      name: 'Fifths',
      bands: null,
      nextRevision: null,
    });
    const name = element.querySelector<HTMLInputElement>('input')!;
    name.value = '   ';
    name.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    expect(element.querySelector('mat-error')?.textContent).toContain('A preset needs a name');
    expect(saveButton().disabled).toBeTrue();
    name.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter' }));
    expect(close).not.toHaveBeenCalled();
  });
});
