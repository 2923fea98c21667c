import { formatFeetInches, formatPounds, formatUsd, parseFeetInches, parsePounds } from './units';

describe('feet-inches and pounds', () => {
  it.each([
    [`14'2"`, 170],
    [`14' 2"`, 170],
    [`14'-2"`, 170],
    [`14 ft 2 in`, 170],
    [`14'`, 168],
    [`8"`, 8],
    [`14'6 1/2"`, 174.5],
    [`8′6″`, 102],
    [`0'0"`, 0],
  ])('parseFeetInches(%s) → %f in', (text, inches) => {
    expect(parseFeetInches(text)).toBe(inches);
  });

  it.each([
    [170, 1, `14'2"`],
    [168, 1, `14'0"`],
    [102, 1, `8'6"`],
    [143.6, 1, `12'0"`],
    [174.5, 2, `14'6 1/2"`],
    [0.25, 4, `0'1/4"`],
  ] as const)('formatFeetInches(%f, %i) → %s', (inches, precision, text) => {
    expect(formatFeetInches(inches, precision)).toBe(text);
  });

  it.each([``, `14`, `-14'`, `14'13"`, `abc`, `14'2"x`])('parseFeetInches(%j) → RangeError', (text) => {
    expect(() => parseFeetInches(text)).toThrow(RangeError);
  });

  it.each([
    [80_000, '80,000 lb'],
    [1_234_567.4, '1,234,567 lb'],
    [0, '0 lb'],
  ])('formatPounds(%f) → %s', (lb, text) => {
    expect(formatPounds(lb)).toBe(text);
  });

  it.each([
    ['80,000 lb', 80_000],
    ['80000', 80_000],
    ['34,000 lbs', 34_000],
  ])('parsePounds(%s) → %i', (text, lb) => {
    expect(parsePounds(text)).toBe(lb);
  });

  it.each(['-5 lb', '80,00 lb', 'heavy'])('parsePounds(%s) → RangeError', (text) => {
    expect(() => parsePounds(text)).toThrow(RangeError);
  });

  it('formatFeetInches and formatPounds reject negative, NaN and absurd values, naming the field', () => {
    expect(() => formatFeetInches(-1)).toThrow(/inches must be at least 0/);
    expect(() => formatFeetInches(Number.NaN)).toThrow(/inches must be a finite number/);
    expect(() => formatPounds(1e12)).toThrow(/pounds must be at most .*absurd/);
  });

  it('formatUsd rounds to cents', () => {
    expect(formatUsd(265)).toBe('$265.00');
    expect(formatUsd(1234.005)).toBe('$1,234.01');
  });
});
