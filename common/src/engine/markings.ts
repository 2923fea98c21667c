/** Flags, signs and lamps for a projecting or oversize load. */
import {
  JurisdictionRule,
  LampRule,
  MEASURE_LABELS,
  MeasuredLoad,
  cite,
  isKnown,
  triggerFires,
  type KnownFact,
  type SignRule,
  type Trigger,
} from './jurisdiction-rule';
import { NOT_ON_FILE_SOURCE, PLANNING_CAUTION, Reason, SOURCES } from './reasons';
import { formatFeetInches } from './units';
import { ABSURD, checkNumber } from './validate';

export type MarkingsInput = {
  /** Largest projection beyond either side (or give left and right). */
  sideProjectionIn: number;
  sideProjectionLeftIn?: number;
  sideProjectionRightIn?: number;
  rearProjectionIn: number;
  rearProjectionWidthIn: number;
  /** Overall dimensions, for the jurisdiction's sign, corner-flag and lamp rules. */
  widthIn?: number;
  heightIn?: number;
  lengthIn?: number;
  frontOverhangIn?: number;
  grossLb?: number;
};

/**
 * One rule that asks for a marking: its reason, its source, what it asks for there and the states whose assessment
 * lists it. Set by `mergeMarkings` on every merged item; a single rule's item has none (its reason and source say it).
 */
export type MarkingAsk = { reason: string; source: string; asks: string; jurisdictions: string[] };

export type FlagPlacement = { position: string; minSquareIn: number; colors: string; reason: string; source: string; askedBy?: MarkingAsk[] };
export type LampPlacement = { position: string; color: 'red' | 'amber'; count: number; visibleFt?: number; reason: string; source: string; askedBy?: MarkingAsk[] };
export type ReflectorPlacement = { position: string; color: 'red' | 'amber'; count: number; source: string; askedBy?: MarkingAsk[] };
export type SignPlacement = {
  text: string;
  position: string;
  minWidthIn: number;
  minHeightIn: number;
  letterHeightIn: number;
  strokeIn?: number;
  colors: string;
  reason: string;
  source: string;
  askedBy?: MarkingAsk[];
};

/** Night lamps on projecting loads, 49 CFR 393.11 Table 1 (read in a secondary summary). Apply in every jurisdiction. */
export const FEDERAL_LAMP_RULES: LampRule[] = [
  { when: [{ measure: 'rearOverhang', atLeast: 48 }], lamps: [{ position: 'extreme rear of the load', color: 'red', count: 1 }], note: 'at night' },
  {
    when: [{ measure: 'sideProjection', over: 4 }],
    lamps: [
      { position: 'front of the side projection', color: 'amber', count: 1 },
      { position: 'rear of the side projection', color: 'red', count: 1 },
    ],
    note: 'at night, on each projecting side',
  },
];

/** Which of the jurisdiction's marking topics are not on file (federal 393.87 flags and 393.11 lamps still listed). */
export type MarkingsUnknown = { signs: boolean; flags: boolean; lamps: boolean };

export type MarkingsResult = {
  sideFlags: boolean;
  rearFlags: 0 | 1 | 2;
  flags: FlagPlacement[];
  lamps: LampPlacement[];
  reflectors: ReflectorPlacement[];
  signs: SignPlacement[];
  escortSigns: SignPlacement[];
  reasons: Reason[];
  /** Present when a jurisdiction rule was given: its topics not on file. */
  notOnFile?: MarkingsUnknown;
  /** Set by `mergeMarkings`: the states whose markings were merged, in route order. */
  jurisdictions?: string[];
  caution: string;
};

const FLAG_SQUARE_IN = 18;
const FLAG_COLORS = 'red or orange fluorescent';

/**
 * 49 CFR 393.87 (strict thresholds): side projection more than 4 in → flags at the extremities of the projecting
 * side; rear projection more than 4 ft → one flag at the extreme rear if the projecting load is 2 ft wide or less,
 * two (marking the maximum width) if wider. Corner flags, signs and night lamps come from the jurisdiction rule
 * (the federal default rule when none is given).
 */
export function projectingLoadMarkings(input: MarkingsInput, rule?: JurisdictionRule, oversize = false): MarkingsResult {
  const side = checkNumber('sideProjectionIn', input.sideProjectionIn, { min: 0, max: ABSURD.widthIn, unit: 'in' });
  const left = checkNumber('sideProjectionLeftIn', input.sideProjectionLeftIn ?? side, { min: 0, max: ABSURD.widthIn, unit: 'in' });
  const right = checkNumber('sideProjectionRightIn', input.sideProjectionRightIn ?? side, { min: 0, max: ABSURD.widthIn, unit: 'in' });
  const rear = checkNumber('rearProjectionIn', input.rearProjectionIn, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
  const rearWidth = checkNumber('rearProjectionWidthIn', input.rearProjectionWidthIn, { min: 0, max: ABSURD.widthIn, unit: 'in' });
  const flags: FlagPlacement[] = [];
  const reasons: Reason[] = [];
  const src87 = SOURCES.cfr393_87;

  const sideFlags = Math.max(side, left, right) > 4;
  if (sideFlags) {
    const sides: [string, number][] = input.sideProjectionLeftIn !== undefined || input.sideProjectionRightIn !== undefined
      ? [['left', left], ['right', right]]
      : [['projecting side', side]];
    for (const [name, amount] of sides) {
      if (amount <= 4) continue;
      const reason = `load extends ${formatFeetInches(amount, 4)} beyond the ${name === 'projecting side' ? 'side' : `${name} side`} (more than 4 in)`;
      flags.push({ position: `${name}, front extremity of the projection`, minSquareIn: FLAG_SQUARE_IN, colors: FLAG_COLORS, reason, source: src87 });
      flags.push({ position: `${name}, rear extremity of the projection`, minSquareIn: FLAG_SQUARE_IN, colors: FLAG_COLORS, reason, source: src87 });
      reasons.push({ code: 'side-flags', message: reason, value: amount, limit: 4, unit: 'in', source: src87 });
    }
  }
  let rearFlags: 0 | 1 | 2 = 0;
  if (rear > 48) {
    rearFlags = rearWidth > 24 ? 2 : 1;
    const reason = `load extends ${formatFeetInches(rear, 4)} beyond the rear (more than 4 ft); projecting part ${formatFeetInches(rearWidth, 4)} wide`;
    if (rearFlags === 1) {
      flags.push({ position: 'extreme rear of the load', minSquareIn: FLAG_SQUARE_IN, colors: FLAG_COLORS, reason: `${reason}: one flag (2 ft wide or less)`, source: src87 });
    } else {
      for (const s of ['left', 'right']) {
        flags.push({
          position: `extreme rear of the load, ${s} edge (marks the maximum width)`,
          minSquareIn: FLAG_SQUARE_IN,
          colors: FLAG_COLORS,
          reason: `${reason}: two flags (wider than 2 ft)`,
          source: src87,
        });
      }
    }
    reasons.push({ code: 'rear-flags', message: `${reason}: ${rearFlags} flag${rearFlags === 1 ? '' : 's'}`, value: rear, limit: 48, unit: 'in', source: src87 });
  }

  const m: MeasuredLoad = {
    widthIn: input.widthIn ?? 0,
    heightIn: input.heightIn ?? 0,
    lengthIn: input.lengthIn ?? 0,
    frontOverhangIn: input.frontOverhangIn ?? 0,
    rearOverhangIn: rear,
    sideProjectionIn: Math.max(side, left, right),
    grossLb: input.grossLb ?? 0,
  };
  const fires = (when: Trigger[], whenOversize?: boolean): boolean =>
    (whenOversize === true && oversize) || when.some((t) => triggerFires(t, m));
  const name = rule?.name ?? 'federal';

  if (rule && isKnown(rule.flags)) {
    const fsrc = cite(rule.flags);
    for (const fr of rule.flags.value) {
      if (!fires(fr.when, fr.whenOversize)) continue;
      const why = fr.whenOversize && oversize ? 'oversize load' : 'projecting load';
      const positions =
        fr.kind === 'corners'
          ? ['front left corner', 'front right corner', 'rear left corner', 'rear right corner']
          : fr.kind === 'width-extremities'
            ? Array.from({ length: fr.minCount }, (_, i) => `widest extremity, flag ${i + 1}${fr.maxCount ? ` (${fr.minCount}–${fr.maxCount})` : ''}`)
            : Array.from({ length: fr.minCount }, (_, i) => `end of the overhang, flag ${i + 1}`);
      for (const position of positions) flags.push({ position, minSquareIn: fr.minSquareIn, colors: fr.colors, reason: `${name}: ${why}`, source: fsrc });
      reasons.push({ code: `flags-${fr.kind}`, message: `${name}: ${fr.kind} flags (${why})`, source: fsrc });
    }
  }

  const lamps: LampPlacement[] = [];
  const reflectors: MarkingsResult['reflectors'] = [];
  const lampSets: { rules: LampRule[]; source: string }[] = [{ rules: FEDERAL_LAMP_RULES, source: SOURCES.cfr393_11 }];
  if (rule && isKnown(rule.lamps)) lampSets.push({ rules: rule.lamps.value, source: cite(rule.lamps) });
  for (const set of lampSets) {
    for (const lr of set.rules) {
      if (!fires(lr.when)) continue;
      const reason = `${lr.note ?? 'at night'}: ${lr.when.map(triggerWords).join(' or ')}`;
      for (const l of lr.lamps) lamps.push({ ...l, reason, source: set.source });
      for (const rf of lr.reflectors ?? []) reflectors.push({ ...rf, source: set.source });
      reasons.push({ code: 'lamps', message: `lamps ${reason}`, source: set.source });
    }
  }

  const signs: SignPlacement[] = [];
  const escortSigns: SignPlacement[] = [];
  if (rule && isKnown(rule.signs)) {
    const sf = rule.signs;
    for (const sr of sf.value) {
      if (!fires(sr.when, sr.whenOversize)) continue;
      const reason = sr.whenOversize && oversize ? `${name}: oversize load` : `${name}: ${describeSignTrigger(sr)}`;
      for (const position of sr.positions) signs.push(signAt(sr, sf, position, reason));
      if (sr.escortSign) {
        escortSigns.push({ ...sr.escortSign, position: 'each escort vehicle', colors: sr.colors, reason, source: cite(sf) });
      }
      reasons.push({ code: 'signs', message: `${sr.text} signs: ${reason}`, source: cite(sf) });
    }
  }
  const notOnFile = rule ? { signs: !isKnown(rule.signs), flags: !isKnown(rule.flags), lamps: !isKnown(rule.lamps) } : undefined;
  if (notOnFile) {
    for (const [topic, missing] of Object.entries(notOnFile)) {
      if (missing) reasons.push({ code: `not-on-file-${topic}`, message: `${name}: ${topic} rules not on file — check the permit`, source: NOT_ON_FILE_SOURCE });
    }
  }
  return { sideFlags, rearFlags, flags, lamps, reflectors, signs, escortSigns, reasons, ...(notOnFile ? { notOnFile } : {}), caution: PLANNING_CAUTION };
}

function signAt(sr: SignRule, src: KnownFact<SignRule[]>, position: string, reason: string): SignPlacement {
  return {
    text: sr.text,
    position,
    minWidthIn: sr.minWidthIn,
    minHeightIn: sr.minHeightIn,
    letterHeightIn: sr.letterHeightIn,
    ...(sr.strokeIn !== undefined ? { strokeIn: sr.strokeIn } : {}),
    colors: sr.colors,
    reason,
    source: cite(src),
  };
}

/** "side projection over 0'4"", "gross at least 120,000 lb". */
function triggerWords(t: Trigger): string {
  const v = (n: number) => (t.measure === 'gross' ? `${Math.round(n).toLocaleString('en-US')} lb` : formatFeetInches(n));
  return `${MEASURE_LABELS[t.measure]} ${t.over !== undefined ? `over ${v(t.over)}` : `at least ${v(t.atLeast ?? 0)}`}`;
}

function describeSignTrigger(sr: SignRule): string {
  return sr.when.map(triggerWords).join(' or ');
}
