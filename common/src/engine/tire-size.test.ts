import { parseTireSize } from './tire-size';

describe('parseTireSize (tire size notation: nominal section width)', () => {
  it.each([
    ['11R22.5', 11, 22.5, 'inch notation: 11 in nominal section width'],
    ['11-22.5', 11, 22.5, 'inch notation, bias: 11 in'],
    ['11R24.5', 11, 24.5, 'inch notation'],
    ['425/65R22.5', 425 / 25.4, 22.5, 'metric: 425 mm = 16.73 in'],
    ['275/80R22.5', 275 / 25.4, 22.5, 'metric: 275 mm = 10.83 in'],
    ['445/50R22.5', 445 / 25.4, 22.5, 'F.A.C. 14-26.0091(3): "445/50R22.5 designates a tire section width of 445 mm (17.5 inches)"'],
    ['275/80R22.5 144/141L', 275 / 25.4, 22.5, 'service marks after the size are ignored'],
  ])('%s → %f in wide on a %f in rim (%s)', (size, width, rim) => {
    const t = parseTireSize(size);
    expect(t.sectionWidthIn).toBeCloseTo(width, 9);
    expect(t.rimDiameterIn).toBe(rim);
  });

  it('F.A.C. 14-26.0091(3): 445/50R22.5 reads as 17.5 in to the tenth', () => {
    expect(Math.round(parseTireSize('445/50R22.5').sectionWidthIn * 10) / 10).toBe(17.5);
  });

  it.each(['', 'big', '22.5', '425/65', 'R22.5'])('"%s" is not a size → RangeError', (size) => {
    expect(() => parseTireSize(size)).toThrow(RangeError);
  });
});
