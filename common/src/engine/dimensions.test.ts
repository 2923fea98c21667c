import { overallDimensions, type DimensionsInput } from './dimensions';

const FT = 12;
// Low-profile step deck: upper deck 60 in, lower deck about 34 in above the road
// (common practice, no published source).
const stepDeck: DimensionsInput['trailer'] = {
  kingpinFromFrontIn: 36,
  lengthIn: 53 * FT,
  widthIn: 102,
  decks: [
    { name: 'upper', fromFrontIn: 0, toFrontIn: 11 * FT, heightIn: 60 },
    { name: 'lower', fromFrontIn: 11 * FT, toFrontIn: 53 * FT, heightIn: 34 },
  ],
};
const tractor = { bumperToKingpinIn: 20 * FT, widthIn: 100, heightIn: 11 * FT };

describe('overallDimensions', () => {
  it.each([
    [120, 0, 154, 'common practice, no published source: lower deck 34 in + 120 in load = 154 in'],
    [120, 4, 158, 'common practice, no published source: plus 4 in of dunnage'],
    [140, 0, 174, 'common practice, no published source'],
  ])('load %i in high, dunnage %i in on the lower deck → %i in overall (%s)', (h, dunnage, total) => {
    const r = overallDimensions({
      tractor,
      trailer: stepDeck,
      articles: [{ lengthIn: 20 * FT, widthIn: 96, heightIn: h, positionFromTrailerFrontIn: 15 * FT, dunnageIn: dunnage }],
    });
    expect(r.heightIn).toBe(total);
    expect(r.articles[0].deckHeightIn).toBe(34);
    expect(r.caution).toMatch(/planning aid/i);
  });

  it('an article straddling the step rests on the upper deck (highest section under it)', () => {
    const r = overallDimensions({ tractor, trailer: stepDeck, articles: [{ lengthIn: 10 * FT, widthIn: 96, heightIn: 100, positionFromTrailerFrontIn: 8 * FT }] });
    expect(r.heightIn).toBe(160);
  });

  it('width, side projection, overhangs and overall length from the placement (23 CFR 658.15: cargo counts toward width)', () => {
    const r = overallDimensions({
      tractor,
      trailer: stepDeck,
      articles: [{ lengthIn: 50 * FT, widthIn: 132, heightIn: 100, positionFromTrailerFrontIn: 10 * FT, lateralOffsetIn: 6 }],
    });
    // Trailer front at 240 − 36 = 204 in; rear at 204 + 636 = 840; load 324 … 924 → 84 in rear overhang.
    expect(r.rearOverhangIn).toBe(84);
    expect(r.frontOverhangIn).toBe(0);
    expect(r.lengthIn).toBe(924);
    expect(r.widthIn).toBe(132); // load edges −60 … 72 (offset 6 in right); trailer −51 … 51
    expect(r.sideProjectionRightIn).toBe(21);
    expect(r.sideProjectionLeftIn).toBe(9);
    expect(r.sideProjectionIn).toBe(21);
    expect(r.rearProjectionWidthIn).toBe(132);
  });

  it('a load projecting ahead of the front bumper counts as front overhang', () => {
    const r = overallDimensions({ tractor, trailer: stepDeck, articles: [{ lengthIn: 40 * FT, widthIn: 24, heightIn: 24, positionFromTrailerFrontIn: -220 }] });
    expect(r.frontOverhangIn).toBe(16);
    expect(r.lengthIn).toBe(16 + 840);
  });

  it.each([
    [{ heightIn: -3 }, /articles\[0\].heightIn must be greater than 0/],
    [{ widthIn: Number.NaN }, /articles\[0\].widthIn must be a finite number/],
    [{ lengthIn: 1e6 }, /articles\[0\].lengthIn must be at most .*absurd/],
    [{ positionFromTrailerFrontIn: 5000 }, /not over any deck section/],
  ])('bad article %j → RangeError', (patch, msg) => {
    const article = { lengthIn: 10 * FT, widthIn: 96, heightIn: 100, positionFromTrailerFrontIn: 15 * FT, ...patch };
    expect(() => overallDimensions({ tractor, trailer: stepDeck, articles: [article] })).toThrow(RangeError);
    expect(() => overallDimensions({ tractor, trailer: stepDeck, articles: [article] })).toThrow(msg);
  });
});
