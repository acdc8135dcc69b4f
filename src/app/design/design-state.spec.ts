import { TestBed } from '@angular/core/testing';
import { DesignState } from './design-state';
import { newDraft } from './draft-document';

describe('DesignState', () => {
  let state: DesignState;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [DesignState] });
    state = TestBed.inject(DesignState);
  });

  it('starts from five fifths up and one down, built, with no faults', () => {
    expect(state.faults()).toEqual([]);
    expect(state.shown()?.table.analysis.size).toBe(7);
    expect(state.dirty()).toBeTrue();
  });

  it('puts the message for a bare decimal under the generator, without the path the field already names', () => {
    expect(state.shown()?.table.analysis.size).toBe(7);
    state.setScaleField('generator', '1.5');
    expect(state.faultAt('scale.generator')).toBe(
      '1.5 needs a unit: write 1.5c for cents or a ratio such as 3/2',
    );
    expect(state.faultAt('scale.period')).toBeNull();
    expect(state.stale()).toBeTrue();
    expect(state.shown()?.table.analysis.size)
      .withContext('the last design that built stays shown')
      .toBe(7);
  });

  it('gives the fields of a kind back when the musician returns to it', () => {
    state.setScaleField('up', 11);
    state.chooseKind('equal');
    expect(state.draft().scale).toEqual({ kind: 'equal', divisions: 12, period: '2/1' });
    state.chooseKind('generated');
    expect(state.draft().scale).toEqual({
      kind: 'generated',
      generator: '3/2',
      period: '2/1',
      up: 11,
      down: 1,
    });
  });

  it('starts a scale of fewer than 12 degrees on its nearest keys, and follows the scale until keys are laid by hand', () => {
    // Five fifths up and one down from C: F C G D A E B on the white keys (from memory: the diatonic white keys).
    expect(state.layout()).toEqual([0, null, 1, null, 2, 3, null, 4, null, 5, null, 6]);
    expect(state.nearestKeysByDefault()).toBeTrue();
    state.setScaleField('up', 6);
    expect(state.layout()).toEqual([0, null, 1, null, 2, 3, 4, 5, null, 6, null, 7]);
    state.setScaleField('up', 10);
    // Twelve degrees: one a key again, no layout at all.
    expect(state.layout()).toBeNull();
    state.setScaleField('up', 5);
    state.useConsecutiveKeys();
    expect(state.nearestKeysByDefault()).toBeFalse();
    expect(state.layout()).toBeNull();
    state.setScaleField('up', 4);
    expect(state.layout()).toBeNull();
  });

  it('grows and cuts the key layout without losing keys on the way (12, then 1, then 19)', () => {
    state.useConsecutiveKeys();
    state.setKeysPerPeriod('12');
    expect(state.layout()).toEqual([0, 1, 2, 3, 4, 5, 6, null, null, null, null, null]);
    state.setKeysPerPeriod('1');
    expect(state.layout()).toEqual([0]);
    state.setKeysPerPeriod('19');
    expect(state.layout()?.slice(0, 7)).toEqual([0, 1, 2, 3, 4, 5, 6]);
    expect(state.layout()?.length).toBe(19);
    expect(state.faults()).toEqual([]);
  });

  it('keeps a key count that is not a whole number in the field, for the schema to name', () => {
    state.setKeysPerPeriod('0');
    expect(state.faultAt('mapping.keysPerPeriod')).toContain('at least 1');
    state.setKeysPerPeriod('12');
    expect(state.faultAt('mapping.keysPerPeriod')).toBeNull();
  });

  it('places five fifths up and one down on the white keys', () => {
    expect(state.placeOnNearestKeys()).toBeTrue();
    expect(state.layout()).toEqual([0, null, 1, null, 2, 3, null, 4, null, 5, null, 6]);
  });

  it('marks a layout key that names a degree the scale lacks', () => {
    state.assignKey(2, 9);
    expect(state.faultAt('mapping.layout[2]')).toContain('degree 9 does not exist');
  });

  it('tells the keys which of them MTS cannot express, and the scale which degrees coincide', () => {
    state.setMappingField('rootHz', 19000);
    expect(state.faults()).toEqual([]);
    expect(
      state
        .keyNotices()
        .map((notice) => notice.message)
        .join(),
    ).toContain('outside the pitches MTS can express');
    state.chooseKind('list');
    state.setScaleField('degrees', ['9/8', '18/16']);
    expect(
      state
        .generalNotices()
        .map((notice) => notice.message)
        .join(),
    ).toContain('coincides');
  });

  it('leaves a read-only preset as it was loaded, and tracks changes against the saved revision', () => {
    const saved = newDraft();
    state.open(saved, { id: 'p1', revision: 3, bandId: null, access: 'edit' });
    expect(state.dirty()).toBeFalse();
    state.rename('Changed');
    expect(state.dirty()).toBeTrue();
    state.markSaved(4);
    expect(state.origin()?.revision).toBe(4);
    expect(state.dirty()).toBeFalse();

    state.open(saved, { id: 'p2', revision: 1, bandId: null, access: 'read' });
    state.rename('Not allowed');
    state.setScaleField('up', 2);
    expect(state.draft()).toEqual(saved);
  });

  it('keeps the parts of the preview an edit leaves as they were, so that their pictures are not redrawn', () => {
    const first = state.shown()!.table;
    state.rename('Another name');
    expect(state.shown()!.table).withContext('a new name changes no picture').toBe(first);

    state.assignKey(1, 0);
    const moved = state.shown()!.table;
    expect(moved.keys)
      .withContext('the second key of each block plays another degree')
      .not.toBe(first.keys);
    expect(moved.keys[61].degree).toBe(0);
    expect(moved.degrees).withContext('the degrees did not change').toBe(first.degrees);
    expect(moved.analysis.intervalMatrix).toBe(first.analysis.intervalMatrix);

    state.setScaleField('generator', '696.6c');
    const tempered = state.shown()!.table;
    expect(tempered.degrees).not.toBe(moved.degrees);
    expect(tempered.analysis.intervalMatrix).not.toBe(moved.analysis.intervalMatrix);
    // 696.6 cents is a tempered fifth: the degree two fifths up (less an octave) is 193.2 cents (arithmetic).
    expect(tempered.degrees.find((degree) => degree.stackPosition === 2)!.cents).toBeCloseTo(
      193.2,
      9,
    );
  });
});
