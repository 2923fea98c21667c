/** The plan drawing's layout: where the tractor, trailer, decks and each load piece sit, measured from the data. */
import {
  overallDimensions,
  type DimensionsResult,
  type PlacedArticle,
  type TractorInput,
  type TrailerInput,
} from '@amberline/common';
import type { DrawnPiece } from './placement';

export type DiagramTractor = Pick<TractorInput, 'wheelbaseFt' | 'fifthWheelAheadOfDriveFt' | 'bumperToSteerIn' | 'widthIn' | 'heightIn' | 'driveAxleOffsetsFt'>;
export type DiagramTrailer = Pick<TrailerInput, 'lengthIn' | 'widthIn' | 'decks' | 'kingpinFromFrontIn' | 'axleOffsetsFt' | 'axleGroupFromKingpinFt'> & {
  heightIn?: number | null;
};
export type DiagramArticle = PlacedArticle & { id: string; description?: string };

/** The plan facts the drawing needs: this load on this trailer behind this tractor. */
export type DiagramPlan = {
  tractor: DiagramTractor;
  trailer: DiagramTrailer;
  articles: DiagramArticle[];
  /** Trailer axle-group center behind the kingpin (sliding axle); the trailer's own setting when absent. */
  sliderSettingFt?: number | null;
};

/** The plan laid out in inches: x behind the front bumper, y across from the centerline (+ curb side), heights above the road. */
export type Geometry = {
  steerX: number;
  driveXs: number[];
  kingpinX: number;
  trailerFront: number;
  trailerRear: number;
  trailerAxleXs: number[];
  articles: (DrawnPiece & { a: DiagramArticle })[];
  xMin: number;
  xMax: number;
  topMax: number;
  dims: DimensionsResult;
};

export function geometry(plan: DiagramPlan, dims: DimensionsResult | undefined): Geometry {
  const { tractor, trailer } = plan;
  const steerX = tractor.bumperToSteerIn;
  const kingpinX = steerX + (tractor.wheelbaseFt - tractor.fifthWheelAheadOfDriveFt) * 12;
  const driveXs = tractor.driveAxleOffsetsFt.map((o) => steerX + (tractor.wheelbaseFt + o) * 12);
  const trailerFront = kingpinX - trailer.kingpinFromFrontIn;
  const trailerRear = trailerFront + trailer.lengthIn;
  const group = (plan.sliderSettingFt ?? trailer.axleGroupFromKingpinFt) * 12;
  const trailerAxleXs = trailer.axleOffsetsFt.map((o) => kingpinX + group + o * 12);
  const d =
    dims ??
    overallDimensions({
      tractor: { bumperToKingpinIn: kingpinX, widthIn: tractor.widthIn, heightIn: tractor.heightIn },
      trailer: {
        kingpinFromFrontIn: trailer.kingpinFromFrontIn,
        lengthIn: trailer.lengthIn,
        widthIn: trailer.widthIn,
        decks: trailer.decks,
        ...(trailer.heightIn ? { heightIn: trailer.heightIn } : {}),
      },
      articles: plan.articles,
    });
  const articles = plan.articles.map((a, i) => {
    const deck = d.articles[i]?.deckHeightIn ?? a.deckHeightIn ?? 0;
    const bottom = deck + (a.dunnageIn ?? 0);
    const off = a.lateralOffsetIn ?? 0;
    return {
      a,
      id: a.id,
      x0: trailerFront + a.positionFromTrailerFrontIn,
      x1: trailerFront + a.positionFromTrailerFrontIn + a.lengthIn,
      deck,
      bottom,
      top: bottom + a.heightIn,
      y0: off - a.widthIn / 2,
      y1: off + a.widthIn / 2,
    };
  });
  const xMin = Math.min(0, ...articles.map((p) => p.x0));
  const xMax = Math.max(trailerRear, ...articles.map((p) => p.x1));
  const topMax = Math.max(tractor.heightIn, d.heightIn, ...articles.map((p) => p.top));
  return { steerX, driveXs, kingpinX, trailerFront, trailerRear, trailerAxleXs, articles, xMin, xMax, topMax, dims: d };
}

