import type { MoveDto, MoveInput } from '@amberline/common';
import { changedFields, inches, stepStyle } from './options';

const baseline = { customer: 'Gulf Crane', customerRef: 'PO-7', commodity: 'dozer', notes: 'call ahead', travelDays: 2, route: [{ jurisdiction: 'TX', miles: 120 }] } as unknown as MoveInput;
const move = { customerRef: 'PO-7', notes: 'call ahead' } as unknown as MoveDto;

describe('changedFields: what an edit sends', () => {
  it('sends nothing when nothing changed', () => {
    expect(changedFields(move, baseline, { ...baseline })).toEqual({});
  });

  it('sends only the fields that differ, comparing lists by value', () => {
    const input = { ...baseline, travelDays: 3, route: [{ jurisdiction: 'TX', miles: 120 }] } as MoveInput;
    expect(changedFields(move, baseline, input)).toEqual({ travelDays: 3 });
  });

  it('sends a cleared reference and notes as empty, so the server clears them', () => {
    const input = { ...baseline } as Partial<MoveInput>;
    delete input.customerRef;
    delete input.notes;
    expect(changedFields(move, baseline, input as MoveInput)).toEqual({ customerRef: '', notes: '' });
  });

  it('sends everything when the loaded move could not be read back as a plan', () => {
    expect(changedFields(move, null, baseline)).toEqual(baseline);
  });
});

describe('inches', () => {
  it.each([
    [`10'6"`, 126],
    [`8'`, 96],
    ['', undefined],
    [undefined, undefined],
    ['ten feet', undefined],
  ])('%p → %p', (text, expected) => {
    expect(inches(text)).toBe(expected);
  });
});

it('keeps every step mounted and shows only the current one', () => {
  expect(stepStyle(true)).toEqual({ display: 'none' });
  expect(stepStyle(false)).toEqual({});
});
