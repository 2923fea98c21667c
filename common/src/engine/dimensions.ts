/** Overall dimensions of the loaded combination, in inches. */
import { PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { formatFeetInches } from './units';
import { ABSURD, checkNumber } from './validate';

/** A deck section, measured from the trailer's front: e.g. a step deck's upper and lower decks. */
export type DeckSection = {
  name: string;
  fromFrontIn: number;
  toFrontIn: number;
  /** Deck surface above the road. */
  heightIn: number;
};

export type TractorBody = {
  /** Front bumper to the kingpin (fifth-wheel pivot). */
  bumperToKingpinIn: number;
  widthIn: number;
  /** Cab, stacks or fairings above the road. */
  heightIn: number;
};

export type TrailerBody = {
  /** Trailer front (nose / gooseneck) ahead of the kingpin. */
  kingpinFromFrontIn: number;
  lengthIn: number;
  widthIn: number;
  decks: DeckSection[];
  /** Highest fixed part of the empty trailer (headboard, gooseneck). */
  heightIn?: number;
};

/** One article placed on the deck. */
export type PlacedArticle = {
  id?: string;
  lengthIn: number;
  widthIn: number;
  heightIn: number;
  /** Front of the article behind the trailer front; negative when it projects ahead of the trailer. */
  positionFromTrailerFrontIn: number;
  /** Article centerline offset from the trailer centerline, positive to the right (curb side). */
  lateralOffsetIn?: number;
  dunnageIn?: number;
  /** Deck height under the article; by default the highest deck section under its footprint. */
  deckHeightIn?: number;
};

export type DimensionsInput = {
  tractor: TractorBody;
  trailer: TrailerBody;
  articles: PlacedArticle[];
};

export type DimensionsResult = {
  heightIn: number;
  widthIn: number;
  lengthIn: number;
  frontOverhangIn: number;
  rearOverhangIn: number;
  /** Largest projection beyond either side of the trailer. */
  sideProjectionIn: number;
  sideProjectionLeftIn: number;
  sideProjectionRightIn: number;
  /** Width of the part of the load that projects beyond the rear (for the one- or two-flag rule). */
  rearProjectionWidthIn: number;
  /** Per article: the deck height used and its overall height. */
  articles: { id: string; deckHeightIn: number; topIn: number }[];
  reasons: Reason[];
  caution: string;
};

/**
 * Height = deck height under each article + dunnage + article height (highest of all, and of the tractor and
 * trailer); width = widest of tractor, trailer and the articles with their lateral offsets; length and front /
 * rear overhang from the placement on the deck. Overhangs are measured beyond the front bumper and beyond the
 * trailer's rear.
 */
export function overallDimensions(input: DimensionsInput): DimensionsResult {
  const { tractor, trailer, articles } = input;
  checkNumber('tractor.bumperToKingpinIn', tractor.bumperToKingpinIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
  checkNumber('tractor.widthIn', tractor.widthIn, { min: 0, max: ABSURD.widthIn, unit: 'in' });
  checkNumber('tractor.heightIn', tractor.heightIn, { min: 0, max: ABSURD.heightIn, unit: 'in' });
  checkNumber('trailer.kingpinFromFrontIn', trailer.kingpinFromFrontIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
  checkNumber('trailer.lengthIn', trailer.lengthIn, { min: 0, minExclusive: true, max: ABSURD.lengthIn, unit: 'in' });
  checkNumber('trailer.widthIn', trailer.widthIn, { min: 0, minExclusive: true, max: ABSURD.widthIn, unit: 'in' });
  if (trailer.heightIn !== undefined) checkNumber('trailer.heightIn', trailer.heightIn, { min: 0, max: ABSURD.heightIn, unit: 'in' });
  if (!Array.isArray(trailer.decks) || trailer.decks.length === 0) throw new RangeError('trailer.decks must list at least one deck section');
  trailer.decks.forEach((d, i) => {
    checkNumber(`trailer.decks[${i}].heightIn`, d.heightIn, { min: 0, max: ABSURD.heightIn, unit: 'in' });
    checkNumber(`trailer.decks[${i}].fromFrontIn`, d.fromFrontIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
    checkNumber(`trailer.decks[${i}].toFrontIn`, d.toFrontIn, { min: d.fromFrontIn, max: ABSURD.lengthIn, unit: 'in' });
  });

  // Along the road, inches from the tractor's front bumper.
  const trailerFront = tractor.bumperToKingpinIn - trailer.kingpinFromFrontIn;
  const trailerRear = trailerFront + trailer.lengthIn;
  const half = trailer.widthIn / 2;
  let front = Math.min(0, trailerFront);
  let rear = Math.max(trailerRear, 0);
  let left = -half;
  let right = half;
  let height = Math.max(tractor.heightIn, trailer.heightIn ?? 0, ...trailer.decks.map((d) => d.heightIn));
  let rearProjectionWidthIn = 0;
  let rearmost = trailerRear;
  const perArticle: DimensionsResult['articles'] = [];
  const reasons: Reason[] = [];

  articles.forEach((a, i) => {
    const f = `articles[${i}]`;
    checkNumber(`${f}.lengthIn`, a.lengthIn, { min: 0, minExclusive: true, max: ABSURD.lengthIn, unit: 'in' });
    checkNumber(`${f}.widthIn`, a.widthIn, { min: 0, minExclusive: true, max: ABSURD.widthIn, unit: 'in' });
    checkNumber(`${f}.heightIn`, a.heightIn, { min: 0, minExclusive: true, max: ABSURD.heightIn, unit: 'in' });
    checkNumber(`${f}.positionFromTrailerFrontIn`, a.positionFromTrailerFrontIn, { min: -ABSURD.lengthIn, max: ABSURD.lengthIn, unit: 'in' });
    const offset = checkNumber(`${f}.lateralOffsetIn`, a.lateralOffsetIn ?? 0, { min: -ABSURD.widthIn, max: ABSURD.widthIn, unit: 'in' });
    const dunnage = checkNumber(`${f}.dunnageIn`, a.dunnageIn ?? 0, { min: 0, max: 120, unit: 'in' });
    const aFront = a.positionFromTrailerFrontIn;
    const aRear = aFront + a.lengthIn;
    let deck: number;
    if (a.deckHeightIn !== undefined) {
      deck = checkNumber(`${f}.deckHeightIn`, a.deckHeightIn, { min: 0, max: ABSURD.heightIn, unit: 'in' });
    } else {
      // Highest deck section under the article's footprint (it rests on the highest surface).
      const under = trailer.decks.filter((d) => d.fromFrontIn < aRear && d.toFrontIn > aFront);
      if (under.length === 0) throw new RangeError(`${f} is not over any deck section of the trailer`);
      deck = Math.max(...under.map((d) => d.heightIn));
    }
    const top = deck + dunnage + a.heightIn;
    const id = a.id ?? `article ${i + 1}`;
    perArticle.push({ id, deckHeightIn: deck, topIn: top });
    reasons.push({
      code: 'article-height',
      message: `${id}: deck ${formatFeetInches(deck)} + dunnage ${formatFeetInches(dunnage)} + load ${formatFeetInches(a.heightIn)} = ${formatFeetInches(top)}`,
      value: top,
      unit: 'in',
      source: SOURCES.practice,
    });
    height = Math.max(height, top);
    front = Math.min(front, trailerFront + aFront);
    const absRear = trailerFront + aRear;
    if (absRear > rearmost + 1e-9) {
      rearmost = absRear;
      rearProjectionWidthIn = a.widthIn;
    } else if (Math.abs(absRear - rearmost) <= 1e-9 && absRear > trailerRear) {
      rearProjectionWidthIn = Math.max(rearProjectionWidthIn, a.widthIn);
    }
    rear = Math.max(rear, absRear);
    left = Math.min(left, offset - a.widthIn / 2);
    right = Math.max(right, offset + a.widthIn / 2);
  });

  const tractorHalf = tractor.widthIn / 2;
  const widthIn = Math.max(right, tractorHalf) - Math.min(left, -tractorHalf);
  const sideProjectionLeftIn = Math.max(0, -half - left);
  const sideProjectionRightIn = Math.max(0, right - half);
  const frontOverhangIn = Math.max(0, -front);
  const rearOverhangIn = Math.max(0, rear - trailerRear);
  const lengthIn = rear - front;
  reasons.push({
    code: 'overall',
    message: `overall ${formatFeetInches(widthIn)} wide, ${formatFeetInches(height)} high, ${formatFeetInches(lengthIn)} long; overhang ${formatFeetInches(
      frontOverhangIn,
    )} front, ${formatFeetInches(rearOverhangIn)} rear`,
    source: SOURCES.practice,
  });
  return {
    heightIn: height,
    widthIn,
    lengthIn,
    frontOverhangIn,
    rearOverhangIn,
    sideProjectionIn: Math.max(sideProjectionLeftIn, sideProjectionRightIn),
    sideProjectionLeftIn,
    sideProjectionRightIn,
    rearProjectionWidthIn: rearOverhangIn > 0 ? rearProjectionWidthIn : 0,
    articles: perArticle,
    reasons,
    caution: PLANNING_CAUTION,
  };
}
