/**
 * Where each flag, lamp and sign goes on the drawing. The markings say their place in words ("rear extremity of the
 * projection", "front left corner", "end of the overhang, flag 2"); this is the one reader of those words, used by
 * both drawings (the plan's and the run sheet's).
 */
import type { FlagPlacement, LampPlacement, MarkingsResult, SignPlacement } from '@amberline/common';

/** Along the load: its front end, its rear end, or between them (the widest point). */
export type Along = 'front' | 'rear' | 'middle';
/** Across the load, facing forward: the road (left) side, the curb (right) side, or the middle. */
export type Side = 'left' | 'right' | 'center';
/** What the mark is on: the load's piece at that end, the part of the load that sticks out sideways, or the vehicle. */
export type On = 'load' | 'projection' | 'vehicle';
export type MarkSpot = { along: Along; side: Side; on: On };

export type PlacementContext = {
  /** This mark's place among the marks of the same wording (flag 1, flag 2, …). */
  index: number;
  /** How many marks share the wording (or the lamp count). */
  count: number;
  /** The sides the load projects beyond; empty when unknown or none. */
  projecting: readonly ('left' | 'right')[];
};

const word = (p: string, w: string) => new RegExp(`\\b${w}\\b`).test(p);

/** The spots a marking's plain-words position puts it at; none when the words name no place on the load or vehicle. */
export function placeMarking(position: string, ctx: PlacementContext): MarkSpot[] {
  const p = position.toLowerCase();
  const left = word(p, 'left');
  const right = word(p, 'right');
  const named = (fallback: Side[]): Side[] => (left ? ['left'] : right ? ['right'] : fallback);
  const projecting: Side[] = ctx.projecting.length ? [...ctx.projecting] : ['left', 'right'];
  const alternate: Side = ctx.index % 2 === 0 ? 'left' : 'right';
  const at = (along: Along, sides: Side[], on: On): MarkSpot[] => sides.map((side) => ({ along, side, on }));
  const end: Along = word(p, 'front') ? 'front' : 'rear';

  if (p.includes('escort')) return [];
  if (/front of (the )?(vehicle|power unit)/.test(p)) return at('front', ['center'], 'vehicle');
  if (p.includes('corner')) return at(end, named(['left', 'right']), 'load');
  if (p.includes('side projection') || p.includes('of the projection') || p.includes('projecting side')) return at(end, named(projecting), 'projection');
  if (/sides? of the projecting load/.test(p)) return at('middle', named(projecting), 'projection');
  if (p.includes('widest')) return at('middle', [alternate], 'load');
  if (p.includes('overhang')) return at(p.includes('front overhang') ? 'front' : 'rear', ctx.count > 1 ? [alternate] : ['center'], 'load');
  if (word(p, 'rear')) {
    const onVehicle = /rear of (the )?(vehicle|towed unit)/.test(p) && !p.startsWith('rear of the load') && !p.startsWith('rear of load');
    return at('rear', named(ctx.count > 1 ? ['left', 'right'] : ['center']), onVehicle ? 'vehicle' : 'load');
  }
  if (word(p, 'front')) return at('front', named(['center']), 'load');
  return [];
}

/** A load piece as drawn: along the deck from the trailer front (x), across from the centerline (y, + curb side), heights above the road. */
export type DrawnPiece = { id: string; x0: number; x1: number; y0: number; y1: number; deck: number; bottom: number; top: number };
export type Extremes = { front: DrawnPiece; rear: DrawnPiece; leftmost: DrawnPiece; rightmost: DrawnPiece };

/** The pieces at each end and edge of the load; null with no pieces. */
export function extremesOf(pieces: readonly DrawnPiece[]): Extremes | null {
  if (pieces.length === 0) return null;
  const pick = (better: (a: DrawnPiece, b: DrawnPiece) => boolean) => pieces.reduce((b, a) => (better(a, b) ? a : b));
  return { front: pick((a, b) => a.x0 < b.x0), rear: pick((a, b) => a.x1 > b.x1), leftmost: pick((a, b) => a.y0 < b.y0), rightmost: pick((a, b) => a.y1 > b.y1) };
}

/** The piece a spot marks: the projecting piece for a side projection or the widest point, else the piece at that end. */
export function pieceAt(spot: MarkSpot, ex: Extremes): DrawnPiece {
  if ((spot.on === 'projection' || spot.along === 'middle') && spot.side !== 'center') return spot.side === 'left' ? ex.leftmost : ex.rightmost;
  return spot.along === 'front' ? ex.front : ex.rear;
}

/** Along the deck: the piece's front or rear end, or its middle. */
export const spotX = (spot: MarkSpot, piece: DrawnPiece) => (spot.along === 'front' ? piece.x0 : spot.along === 'rear' ? piece.x1 : (piece.x0 + piece.x1) / 2);
/** Across: the piece's left or right edge, or its middle. */
export const spotLateral = (spot: MarkSpot, piece: DrawnPiece) => (spot.side === 'left' ? piece.y0 : spot.side === 'right' ? piece.y1 : (piece.y0 + piece.y1) / 2);

export type PlacedMark =
  | { kind: 'flag'; marking: FlagPlacement; spot: MarkSpot; piece: DrawnPiece }
  | { kind: 'lamp-red' | 'lamp-amber'; marking: LampPlacement; spot: MarkSpot; piece: DrawnPiece }
  | { kind: 'sign'; marking: SignPlacement; spot: MarkSpot; piece: DrawnPiece };

/** Every flag, lamp and sign of the markings at its spots on these pieces. */
export function placeMarkings(markings: MarkingsResult, pieces: readonly DrawnPiece[], projecting: readonly ('left' | 'right')[]): PlacedMark[] {
  const ex = extremesOf(pieces);
  if (!ex) return [];
  const out: PlacedMark[] = [];
  // flags of one wording apart from their number ("end of the overhang, flag 2") share out the sides between them
  const wording = (f: FlagPlacement) => f.position.replace(/flag \d+/, '');
  markings.flags.forEach((f, i) => {
    const same = markings.flags.filter((x) => wording(x) === wording(f));
    const ctx = { index: markings.flags.slice(0, i).filter((x) => wording(x) === wording(f)).length, count: same.length, projecting };
    for (const spot of placeMarking(f.position, ctx)) out.push({ kind: 'flag', marking: f, spot, piece: pieceAt(spot, ex) });
  });
  for (const l of markings.lamps) {
    for (const spot of placeMarking(l.position, { index: 0, count: l.count, projecting })) {
      out.push({ kind: l.color === 'red' ? 'lamp-red' : 'lamp-amber', marking: l, spot, piece: pieceAt(spot, ex) });
    }
  }
  for (const s of markings.signs) {
    for (const spot of placeMarking(s.position, { index: 0, count: 1, projecting })) out.push({ kind: 'sign', marking: s, spot, piece: pieceAt(spot, ex) });
  }
  return out;
}
