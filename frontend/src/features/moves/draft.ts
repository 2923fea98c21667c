/** The move form's draft: what the dispatcher types (feet-inches text, dates), and its conversion to the API's MoveInput. */
import dayjs, { type Dayjs } from 'dayjs';
import {
  axleGroupLoads,
  checkAxleWeights,
  combinationAxles,
  formatFeetInches,
  parseFeetInches,
  suggestSliderPosition,
  type AxleCheckResult,
  type AxleInput,
  type MoveArticle,
  type MoveDto,
  type MoveInput,
  type MoveTiedown,
  type RoadType,
  type SliderSuggestion,
  type TractorDto,
  type TrailerDto,
  type WeightSource,
} from '@amberline/common';
import { apiFieldPath } from '../../components/form-errors';

export type TiedownDraft = Partial<MoveTiedown>;

export type ArticleDraft = {
  id: string;
  description?: string;
  /** Feet-inches text, e.g. 32'0". */
  length?: string;
  width?: string;
  height?: string;
  weightLb?: number | null;
  weightSource?: WeightSource;
  /** Center of gravity behind the piece's front, feet-inches; empty = middle of the piece. */
  cg?: string;
  /** Front of the piece behind the trailer front, feet-inches; a leading minus puts it ahead of the trailer. */
  position?: string;
  lateralOffsetIn?: number | null;
  dunnageIn?: number | null;
  blockedForward?: boolean;
  heavyEquipment?: boolean;
  sharpEdges?: boolean;
  tiedowns?: TiedownDraft[];
};

export type SegmentDraft = {
  jurisdiction?: string;
  roads?: string;
  miles?: number | null;
  roadType?: RoadType;
  urban?: boolean;
  zip?: string;
  /** A point kept from the saved move (when it had no ZIP), valid for `pointFor`'s jurisdiction. */
  lat?: number;
  lon?: number;
  pointFor?: string;
};

export type MoveDraft = {
  customer?: string;
  customerRef?: string;
  commodity?: string;
  articles?: ArticleDraft[];
  tractorId?: string;
  trailerId?: string;
  sliderSettingFt?: number | null;
  route?: SegmentDraft[];
  origin?: string;
  destination?: string;
  requestedDeparture?: Dayjs | null;
  travelDays?: number | null;
  driverId?: string | null;
  notes?: string;
};

/** Feet-inches with an optional leading minus (a piece ahead of the trailer front). Throws RangeError when unreadable. */
export function parseSignedFeetInches(text: string): number {
  const t = text.trim();
  if (t.startsWith('-')) return -parseFeetInches(t.slice(1));
  return parseFeetInches(t);
}

export function formatSignedFeetInches(inches: number): string {
  return inches < 0 ? `-${formatFeetInches(-inches)}` : formatFeetInches(inches);
}

const tryParse = (text: string | undefined, signed = false): number | undefined => {
  if (!text || !text.trim()) return undefined;
  try {
    return signed ? parseSignedFeetInches(text) : parseFeetInches(text);
  } catch {
    return undefined;
  }
};

/** A form validator for feet-inches fields. */
export const feetInchesRule = (label: string, { required = true, signed = false, positive = true } = {}) => ({
  validator: async (_: unknown, value: string | undefined) => {
    if (!value || !value.trim()) {
      if (required) throw new Error(`${label} is needed`);
      return;
    }
    let v: number;
    try {
      v = signed ? parseSignedFeetInches(value) : parseFeetInches(value);
    } catch (e) {
      throw new Error((e as Error).message.replace(/^feet-inches value/, label));
    }
    if (positive && v <= 0) throw new Error(`${label} must be more than 0`);
  },
});

export const newArticle = (n: number): ArticleDraft => ({
  id: `P${n}`,
  description: '',
  weightSource: 'spec_sheet',
  position: `0'0"`,
  lateralOffsetIn: 0,
  dunnageIn: 0,
  blockedForward: false,
  heavyEquipment: false,
  sharpEdges: false,
  tiedowns: [],
});

export const newSegment = (): SegmentDraft => ({ roadType: 'two-lane', urban: false });

export const newTiedown = (n: number): TiedownDraft => ({ label: `tiedown ${n}`, kind: 'chain', chainSize: '3/8', chainGrade: 70, anchorKind: 'stake_pocket', path: 'direct', edgeProtection: false });

function tiedownComplete(t: TiedownDraft): t is MoveTiedown {
  if (!t.kind || !t.anchorKind || !t.path) return false;
  if (t.markedWllLb) return true;
  if (t.kind === 'chain') return !!t.chainSize;
  if (t.kind === 'webbing') return !!t.webbingWidth;
  return false;
}

function cleanTiedown(t: MoveTiedown): MoveTiedown {
  const out: MoveTiedown = { kind: t.kind, anchorKind: t.anchorKind, path: t.path, edgeProtection: !!t.edgeProtection };
  if (t.label?.trim()) out.label = t.label.trim();
  if (t.kind === 'chain') {
    if (t.chainSize) out.chainSize = t.chainSize;
    if (t.chainGrade) out.chainGrade = t.chainGrade;
  }
  if (t.kind === 'webbing' && t.webbingWidth) out.webbingWidth = t.webbingWidth;
  if (t.markedWllLb) out.markedWllLb = t.markedWllLb;
  return out;
}

/** One piece of the draft as the API wants it, or the reason it is not complete yet. */
export function articleFromDraft(a: ArticleDraft, i: number): { article: MoveArticle; incomplete: string[] } | { article: null; incomplete: string[] } {
  const name = a.id?.trim() || `piece ${i + 1}`;
  const lengthIn = tryParse(a.length);
  const widthIn = tryParse(a.width);
  const heightIn = tryParse(a.height);
  const position = tryParse(a.position, true) ?? (a.position?.trim() ? undefined : 0);
  const missing: string[] = [];
  if (!lengthIn) missing.push(`${name}: length`);
  if (!widthIn) missing.push(`${name}: width`);
  if (!heightIn) missing.push(`${name}: height`);
  if (!a.weightLb || a.weightLb <= 0) missing.push(`${name}: weight`);
  if (position === undefined) missing.push(`${name}: position on the deck`);
  if (missing.length || !lengthIn || !widthIn || !heightIn || !a.weightLb || position === undefined) return { article: null, incomplete: missing };
  const tiedowns = (a.tiedowns ?? []).filter(tiedownComplete).map(cleanTiedown);
  const skipped = (a.tiedowns ?? []).length - tiedowns.length;
  const cg = tryParse(a.cg);
  const article: MoveArticle = {
    id: name,
    description: a.description?.trim() || name,
    lengthIn,
    widthIn,
    heightIn,
    weightLb: a.weightLb,
    weightSource: a.weightSource ?? 'estimate',
    positionFromTrailerFrontIn: position,
    lateralOffsetIn: a.lateralOffsetIn ?? 0,
    dunnageIn: a.dunnageIn ?? 0,
    blockedForward: !!a.blockedForward,
    heavyEquipment: !!a.heavyEquipment,
    sharpEdges: !!a.sharpEdges,
    tiedowns,
    ...(cg !== undefined ? { cgFromFrontIn: cg } : {}),
  };
  return { article, incomplete: skipped > 0 ? [`${name}: ${skipped} tiedown${skipped === 1 ? '' : 's'} not complete (left out)`] : [] };
}

export type DraftConversion = {
  /** The body for POST /moves (or /moves/preview), null while something essential is missing. */
  input: MoveInput | null;
  /** What is still missing, in plain words. */
  missing: string[];
};

/**
 * Converts the draft. With `forPreview`, empty free-text fields are filled with a placeholder so the engine can
 * assess a plan whose paperwork is not finished.
 */
export function draftToInput(d: MoveDraft, { forPreview = false } = {}): DraftConversion {
  const missing: string[] = [];
  const text = (v: string | undefined, label: string) => {
    const t = v?.trim() ?? '';
    if (!t && !forPreview) missing.push(label);
    return t || 'draft';
  };
  const articles: MoveArticle[] = [];
  (d.articles ?? []).forEach((a, i) => {
    const r = articleFromDraft(a, i);
    missing.push(...r.incomplete);
    if (r.article) articles.push(r.article);
  });
  if ((d.articles ?? []).length === 0) missing.push('at least one load piece');
  if (!d.tractorId) missing.push('tractor');
  if (!d.trailerId) missing.push('trailer');
  const route = (d.route ?? []).map((s, i) => {
    if (!s.jurisdiction) missing.push(`route segment ${i + 1}: state`);
    if (!s.miles || s.miles <= 0) missing.push(`route segment ${i + 1}: miles`);
    const zip = s.zip?.trim();
    const keepPoint = !zip && s.lat !== undefined && s.lon !== undefined && s.pointFor === s.jurisdiction;
    return {
      order: i + 1,
      jurisdiction: s.jurisdiction ?? '',
      roads: text(s.roads, `route segment ${i + 1}: roads`),
      miles: s.miles ?? 0,
      roadType: s.roadType ?? 'two-lane',
      urban: !!s.urban,
      ...(zip ? { zip } : {}),
      ...(keepPoint ? { lat: s.lat, lon: s.lon } : {}),
    };
  });
  if (route.length === 0) missing.push('at least one route segment');
  if (!d.requestedDeparture) missing.push('departure date');
  const complete = articles.length === (d.articles ?? []).length && articles.length > 0 && !!d.tractorId && !!d.trailerId && route.length > 0 && route.every((s) => s.jurisdiction && s.miles > 0) && !!d.requestedDeparture;
  const input: MoveInput = {
    customer: text(d.customer, 'customer'),
    commodity: text(d.commodity, 'commodity'),
    articles,
    tractorId: d.tractorId ?? '',
    trailerId: d.trailerId ?? '',
    sliderSettingFt: d.sliderSettingFt ?? null,
    route,
    origin: text(d.origin, 'origin'),
    destination: text(d.destination, 'destination'),
    requestedDeparture: d.requestedDeparture ? d.requestedDeparture.format('YYYY-MM-DD') : '',
    travelDays: d.travelDays ?? 1,
    driverId: d.driverId ?? null,
    ...(d.customerRef?.trim() ? { customerRef: d.customerRef.trim() } : {}),
    ...(d.notes?.trim() ? { notes: d.notes.trim() } : {}),
  };
  return { input: complete && (forPreview || missing.length === 0) ? input : null, missing };
}

/** A saved move back into the form's draft. */
export function moveToDraft(m: MoveDto): MoveDraft {
  return {
    customer: m.customer,
    customerRef: m.customerRef ?? '',
    commodity: m.commodity,
    tractorId: m.tractorId,
    trailerId: m.trailerId,
    sliderSettingFt: m.sliderSettingFt ?? null,
    origin: m.origin,
    destination: m.destination,
    requestedDeparture: dayjs(m.requestedDeparture),
    travelDays: m.travelDays,
    driverId: m.driverId ?? null,
    notes: m.notes ?? '',
    articles: m.articles.map((a) => ({
      id: a.id,
      description: a.description,
      length: formatFeetInches(a.lengthIn, 8),
      width: formatFeetInches(a.widthIn, 8),
      height: formatFeetInches(a.heightIn, 8),
      weightLb: a.weightLb,
      weightSource: a.weightSource,
      cg: a.cgFromFrontIn !== undefined ? formatFeetInches(a.cgFromFrontIn, 8) : '',
      position: formatSignedFeetInches(a.positionFromTrailerFrontIn),
      lateralOffsetIn: a.lateralOffsetIn ?? 0,
      dunnageIn: a.dunnageIn ?? 0,
      blockedForward: a.blockedForward,
      heavyEquipment: !!a.heavyEquipment,
      sharpEdges: !!a.sharpEdges,
      tiedowns: a.tiedowns.map((t) => ({ ...t })),
    })),
    route: m.route.map((s) => ({
      jurisdiction: s.jurisdiction,
      roads: s.roads,
      miles: s.miles,
      roadType: s.roadType,
      urban: !!s.urban,
      zip: s.zip ?? '',
      ...(s.zip ? {} : { lat: s.lat, lon: s.lon, pointFor: s.jurisdiction }),
    })),
  };
}

export type InstantAxles = {
  axles: AxleInput[];
  check: AxleCheckResult;
  steerLb: number;
  driveLb: number;
  trailerLb: number;
  kingpinLb: number;
  warnings: string[];
  suggestion: SliderSuggestion | null;
  settingFt: number;
};

/**
 * The axle-group loads of the draft, computed in the browser by the same engine the server uses, so that moving
 * the slider shows every group's change at once. Null while the equipment or a piece's weight and placement is missing.
 */
export function instantAxles(articles: MoveArticle[], tractor: TractorDto | undefined, trailer: TrailerDto | undefined, sliderSettingFt: number | null | undefined): InstantAxles | null {
  if (!tractor || !trailer || articles.length === 0) return null;
  const settingFt = sliderSettingFt ?? trailer.axleGroupFromKingpinFt;
  const loads = articles.map((a) => ({
    weightLb: a.weightLb,
    cgFromKingpinFt: (a.positionFromTrailerFrontIn + (a.cgFromFrontIn ?? a.lengthIn / 2) - trailer.kingpinFromFrontIn) / 12,
  }));
  const t = { tareLb: trailer.tareLb, tareCgFromKingpinFt: trailer.tareCgFromKingpinFt, axleGroupFromKingpinFt: settingFt };
  const layout = { driveAxleOffsetsFt: tractor.driveAxleOffsetsFt, trailerAxleOffsetsFt: trailer.axleOffsetsFt };
  try {
    const r = axleGroupLoads({ tractor, trailer: t, loads });
    const axles = combinationAxles(r, tractor, t, layout);
    const check = checkAxleWeights(axles);
    const suggestion = trailer.slider ? suggestSliderPosition({ tractor, trailer: t, loads, slider: trailer.slider, layout }) : null;
    return { axles, check, steerLb: r.steerLb, driveLb: r.driveLb, trailerLb: r.trailerLb, kingpinLb: r.kingpinLb, warnings: r.warnings, suggestion, settingFt };
  } catch {
    return null;
  }
}

/** Where the form keeps each API field: `articles[0].widthIn` → ['articles', 0, 'width']. */
const FIELD_ALIASES: Record<string, string> = {
  lengthIn: 'length',
  widthIn: 'width',
  heightIn: 'height',
  cgFromFrontIn: 'cg',
  positionFromTrailerFrontIn: 'position',
};

export function formFieldPath(apiField: string): (string | number)[] {
  const parts = apiFieldPath(apiField);
  if (parts[0] === 'articles' && parts.length === 3 && typeof parts[2] === 'string') parts[2] = FIELD_ALIASES[parts[2]] ?? parts[2];
  return parts;
}

/** Which step of the form holds a field. */
export function stepOfField(path: (string | number)[]): number {
  const head = path[0];
  if (head === 'articles') return path[2] === 'tiedowns' ? 3 : ['position', 'lateralOffsetIn', 'dunnageIn', 'deckHeightIn'].includes(String(path[2])) ? 2 : 1;
  if (head === 'tractorId' || head === 'trailerId' || head === 'sliderSettingFt') return 2;
  if (head === 'route' || head === 'requestedDeparture' || head === 'travelDays' || head === 'driverId' || head === 'origin' || head === 'destination') return 4;
  return 0;
}
