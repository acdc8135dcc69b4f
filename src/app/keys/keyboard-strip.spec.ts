import { TestBed } from '@angular/core/testing';
import { fifthsPreset, resolvedPreset } from '@shared/preset/presets.testing';
import { previewTable } from '@shared/tuning/preview';
import { KeyboardStrip } from './keyboard-strip';

describe('KeyboardStrip', () => {
  function render(mapping: unknown, anchorKey: number | null = null) {
    const preset = resolvedPreset({ ...fifthsPreset('T'), mapping });
    const fixture = TestBed.createComponent(KeyboardStrip);
    fixture.componentRef.setInput('keys', previewTable(preset).keys);
    fixture.componentRef.setInput('rootKey', preset.mapping.rootKey);
    fixture.componentRef.setInput('scaleSize', 7);
    fixture.componentRef.setInput('anchorKey', anchorKey);
    fixture.detectChanges();
    const element = fixture.nativeElement as HTMLElement;
    const key = (n: number) => element.querySelector<SVGGElement>(`g.key[data-key="${n}"]`)!;
    return { element, key };
  }

  it('draws all 128 keys, 75 white and 53 black', () => {
    const { element } = render({ rootKey: 60 });
    expect(element.querySelectorAll('g.key').length).toBe(128);
    expect(element.querySelectorAll('g.key.black').length).toBe(53);
  });

  it('numbers each key with the degree it plays and marks the root key', () => {
    const { key } = render({ rootKey: 60 });
    expect(key(60).classList).toContain('root');
    expect(key(60).querySelector('text')?.textContent).toBe('0');
    expect(key(62).querySelector('text')?.textContent).toBe('2');
    expect(key(67).querySelector('text')?.textContent).toBe('0');
    expect(key(60).querySelector('title')?.textContent).toBe('Key 60 (C4): degree 0, 261.626 Hz');
  });

  it('marks the key tuned to the reference pitch, and says so below', () => {
    const plain = render({ rootKey: 60 });
    expect(plain.element.querySelector('g.key.anchor')).toBeNull();
    expect(plain.element.querySelector('.legend')?.textContent).not.toContain(
      'tuned to the reference pitch',
    );
    const { element, key } = render({ rootKey: 60, anchor: { key: 69, hz: 415 } }, 69);
    expect(key(69).classList).toContain('anchor');
    expect(element.querySelectorAll('g.key.anchor').length).toBe(1);
    expect(element.querySelector('.legend')?.textContent).toContain(
      'key 69 is tuned to the reference pitch',
    );
  });

  it('marks unmapped keys, hatched and crossed, and says how many there are', () => {
    const layout = [0, null, 1, null, 2, 3, null, 4, null, 5, null, 6];
    const { element, key } = render({ rootKey: 60, layout });
    expect(key(61).classList).toContain('unmapped');
    expect(key(61).querySelector('rect')?.getAttribute('fill')).toBe('url(#unmapped-hatch)');
    expect(key(61).querySelector('text')?.textContent).toBe('×');
    expect(key(61).querySelector('title')?.textContent).toContain('unmapped, plays nothing');
    expect(key(62).classList).not.toContain('unmapped');
    expect(element.querySelectorAll('g.key.unmapped').length).toBe(53);
    expect(element.querySelector('svg')?.getAttribute('aria-label')).toContain(
      '75 play a degree, 53 unmapped',
    );
  });
});
