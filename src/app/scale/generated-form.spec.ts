import { TestBed } from '@angular/core/testing';
import { DesignState } from '../design/design-state';
import { GeneratedForm } from './generated-form';

describe('GeneratedForm', () => {
  async function render() {
    TestBed.configureTestingModule({ imports: [GeneratedForm], providers: [DesignState] });
    const fixture = TestBed.createComponent(GeneratedForm);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const field = (label: string) => {
      const formField = Array.from(element.querySelectorAll('mat-form-field')).find(
        (candidate) => candidate.querySelector('mat-label')?.textContent?.trim() === label,
      )!;
      return { formField, input: formField.querySelector('input')! };
    };
    const type = async (label: string, text: string) => {
      const { input } = field(label);
      input.value = text;
      input.dispatchEvent(new Event('input'));
      await fixture.whenStable();
    };
    return { fixture, element, field, type, state: TestBed.inject(DesignState) };
  }

  it('labels its fields in plain words', async () => {
    const { element } = await render();
    const labels = Array.from(element.querySelectorAll('mat-label')).map((label) =>
      label.textContent?.trim(),
    );
    expect(labels).toEqual(['Generator', 'Period', 'Generators up', 'Generators down']);
  });

  it('shows the message for "1.5" as a generator under the field as it is typed, and marks it invalid', async () => {
    const { field, type } = await render();
    await type('Generator', '1.5');
    const { formField, input } = field('Generator');
    expect(formField.querySelector('mat-error')?.textContent).toContain(
      '1.5 needs a unit: write 1.5c for cents',
    );
    expect(input.getAttribute('aria-invalid')).toBe('true');

    await type('Generator', '701.955c');
    expect(formField.querySelector('mat-error')).toBeNull();
    expect(input.getAttribute('aria-invalid')).toBe('false');
  });

  it('asks for a whole number of generators, keeping what was typed', async () => {
    const { field, type, state } = await render();
    await type('Generators up', '2.5');
    expect(field('Generators up').formField.querySelector('mat-error')?.textContent).toContain(
      'must be a whole number',
    );
    expect(field('Generators up').input.value).toBe('2.5');
    expect(state.draft().scale).toEqual(jasmine.objectContaining({ up: 2.5 }));
  });

  it('tempers the generator by a quarter of 81/80 when asked, and names the narrowed size', async () => {
    const { element, fixture, state } = await render();
    Array.from(element.querySelectorAll<HTMLButtonElement>('mat-button-toggle button'))
      .find((button) => button.textContent?.includes('Temper every generator alike'))!
      .click();
    await fixture.whenStable();
    expect(state.draft().scale).toEqual(
      jasmine.objectContaining({ temper: { comma: '81/80', fraction: '1/4' } }),
    );
    // 3/2 narrowed by 1/4 of 81/80 is 696.578c (standard acoustics texts: the quarter-comma fifth).
    expect(element.textContent).toContain('the generator becomes 696.578c');
  });
});
