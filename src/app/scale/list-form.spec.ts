import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { ListForm } from './list-form';

describe('ListForm', () => {
  async function render() {
    TestBed.configureTestingModule({ imports: [ListForm], providers: [DesignState] });
    const state = TestBed.inject(DesignState);
    state.chooseKind('list');
    const fixture = TestBed.createComponent(ListForm);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const field = element.querySelector<HTMLTextAreaElement>('textarea')!;
    const type = async (text: string) => {
      field.value = text;
      field.dispatchEvent(new Event('input'));
      await fixture.whenStable();
    };
    const notices = () =>
      Array.from(element.querySelectorAll('.notices li')).map((li) => li.textContent?.trim());
    return { state, field, type, notices };
  }

  it('reads a list pasted on one line, drops the leading 1/1, takes the closing 2/1 as the period, and says so', async () => {
    const { state, field, type, notices } = await render();
    await type('1/1, 9/8, 5/4, 4/3, 3/2, 5/3, 15/8, 2/1');
    expect(state.draft().scale).toEqual({
      kind: 'list',
      degrees: ['9/8', '5/4', '4/3', '3/2', '5/3', '15/8'],
      period: '2/1',
    });
    expect(state.faults()).toEqual([]);
    expect(field.value).toBe('1/1, 9/8, 5/4, 4/3, 3/2, 5/3, 15/8, 2/1');
    expect(notices()).toEqual([
      'The leading 1/1 is the tonic, which every scale has: it was left out of the list.',
      'The closing 2/1 is the period: it was taken as the period, not as a degree.',
    ]);
  });

  it('says nothing more for a list typed one a line', async () => {
    const { state, type, notices } = await render();
    await type('9/8\n5/4\n\n3/2\n');
    expect(state.draft().scale).toEqual({
      kind: 'list',
      degrees: ['9/8', '5/4', '3/2'],
      period: '2/1',
    });
    expect(notices()).toEqual([]);
  });
});
