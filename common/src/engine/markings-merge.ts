/**
 * One set of markings for a move: the flags, signs, lamps and reflectors every state's assessment asks for, one
 * item per place, each with every rule that asks for it. The run sheet on screen and its PDF both read their
 * lines from `markingLines`, so they list the same items.
 */
import type { JurisdictionPlanResult, PlanCheckResult } from './plan-check';
import type { FlagPlacement, LampPlacement, MarkingAsk, MarkingsResult, MarkingsUnknown, ReflectorPlacement, SignPlacement } from './markings';
import { PLANNING_CAUTION, type Reason } from './reasons';

/** One state's markings (`jurisdiction` = its code), or markings of no particular state. */
export type MarkingsPart = { jurisdiction?: string; markings: MarkingsResult };

/** Positions are compared without case, surrounding spaces or repeated spaces: "Front left corner" = "front  left corner". */
export const positionKey = (position: string): string => position.trim().replace(/\s+/g, ' ').toLowerCase();

const distinct = (values: string[]): string[] => [...new Set(values.filter((v) => v !== ''))];
const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? '' : 's'}`;

const flagAsks = (f: FlagPlacement): string => `at least ${f.minSquareIn}×${f.minSquareIn} in, ${f.colors}`;
const lampAsks = (l: LampPlacement): string => `${plural(l.count, `${l.color} lamp`)}${l.visibleFt ? `, visible ${l.visibleFt} ft` : ''}`;
const reflectorAsks = (r: ReflectorPlacement): string => plural(r.count, `${r.color} reflector`);
const signAsks = (s: SignPlacement): string =>
  `at least ${s.minWidthIn}×${s.minHeightIn} in, letters ${s.letterHeightIn} in${s.strokeIn !== undefined ? `, stroke ${s.strokeIn} in` : ''}, ${s.colors}`;

type Item = FlagPlacement | LampPlacement | ReflectorPlacement | SignPlacement;
type Entry<T extends Item> = { item: T; asks: MarkingAsk[] };

/** The rules behind an item: those a merge already recorded, else the item's own reason and source. */
function asksOf(item: Item, asks: string, jurisdiction: string | undefined): MarkingAsk[] {
  const own = jurisdiction ? [jurisdiction] : [];
  if (item.askedBy?.length) return item.askedBy.map((a) => ({ ...a, jurisdictions: a.jurisdictions.length ? [...a.jurisdictions] : own }));
  return [{ reason: 'reason' in item ? item.reason : '', source: item.source, asks, jurisdictions: own }];
}

function addAsks(into: MarkingAsk[], more: MarkingAsk[]): void {
  for (const a of more) {
    const same = into.find((x) => x.reason === a.reason && x.source === a.source && x.asks === a.asks);
    if (!same) into.push({ ...a, jurisdictions: [...a.jurisdictions] });
    else for (const j of a.jurisdictions) if (!same.jurisdictions.includes(j)) same.jurisdictions.push(j);
  }
}

/** Collects items by key; an item seen again keeps its first place and gains the stricter requirement and the new rules. */
class Collector<T extends Item> {
  private readonly entries = new Map<string, Entry<T>>();
  constructor(
    private readonly keyOf: (item: T) => string,
    private readonly asksText: (item: T) => string,
    private readonly combine: (kept: T, other: T) => T,
  ) {}

  add(item: T, jurisdiction: string | undefined): void {
    const key = this.keyOf(item);
    const plain = { ...item };
    delete plain.askedBy;
    const found = this.entries.get(key);
    if (found) found.item = this.combine(found.item, plain);
    const entry = found ?? { item: plain, asks: [] };
    if (!found) this.entries.set(key, entry);
    addAsks(entry.asks, asksOf(item, this.asksText(item), jurisdiction));
  }

  items(): T[] {
    return [...this.entries.values()].map(({ item, asks }) => {
      const reasons = distinct(asks.map((a) => a.reason));
      const out = { ...item, source: distinct(asks.map((a) => a.source)).join('; '), askedBy: asks } as T;
      if ('reason' in out) (out as { reason: string }).reason = reasons.join('; ');
      return out;
    });
  }
}

const joinDistinct = (a: string, b: string): string => distinct([...a.split('; '), ...b.split('; ')]).join('; ');
const maxOf = (a: number | undefined, b: number | undefined): number | undefined => (a === undefined ? b : b === undefined ? a : Math.max(a, b));
/** `item` with an optional number set to `value`, or without it when no rule gives one. */
function withOptional<T extends object, K extends keyof T>(item: T, key: K, value: T[K] | undefined): T {
  const copy = { ...item };
  if (value === undefined) delete copy[key];
  else copy[key] = value;
  return copy;
}

/**
 * Merges markings into one set: the same item at the same place (a flag at a position, a lamp or reflector of one
 * color at a position, a sign with one text at a position) becomes one item that keeps every rule asking for it
 * (`askedBy`, with the states it is asked in) and the strictest requirement of them: the largest flag, sign and
 * letters, the most lamps or reflectors, the farthest visibility, every color text asked for. Different places
 * stay different items, so nothing asked for is dropped. Merging a merged set again changes nothing.
 */
export function mergeMarkings(parts: MarkingsPart[]): MarkingsResult {
  const flags = new Collector<FlagPlacement>(
    (f) => positionKey(f.position),
    flagAsks,
    (a, b) => ({ ...a, minSquareIn: Math.max(a.minSquareIn, b.minSquareIn), colors: joinDistinct(a.colors, b.colors) }),
  );
  const lamps = new Collector<LampPlacement>(
    (l) => `${l.color}|${positionKey(l.position)}`,
    lampAsks,
    (a, b) => withOptional({ ...a, count: Math.max(a.count, b.count) }, 'visibleFt', maxOf(a.visibleFt, b.visibleFt)),
  );
  const reflectors = new Collector<ReflectorPlacement>((r) => `${r.color}|${positionKey(r.position)}`, reflectorAsks, (a, b) => ({ ...a, count: Math.max(a.count, b.count) }));
  const signCombine = (a: SignPlacement, b: SignPlacement): SignPlacement =>
    withOptional(
      {
        ...a,
        minWidthIn: Math.max(a.minWidthIn, b.minWidthIn),
        minHeightIn: Math.max(a.minHeightIn, b.minHeightIn),
        letterHeightIn: Math.max(a.letterHeightIn, b.letterHeightIn),
        colors: joinDistinct(a.colors, b.colors),
      },
      'strokeIn',
      maxOf(a.strokeIn, b.strokeIn),
    );
  const signKey = (s: SignPlacement): string => `${s.text.trim().toUpperCase()}|${positionKey(s.position)}`;
  const signs = new Collector<SignPlacement>(signKey, signAsks, signCombine);
  const escortSigns = new Collector<SignPlacement>(signKey, signAsks, signCombine);

  const jurisdictions: string[] = [];
  const reasons: Reason[] = [];
  const seenReasons = new Set<string>();
  let sideFlags = false;
  let rearFlags: 0 | 1 | 2 = 0;
  let notOnFile: MarkingsUnknown | undefined;
  for (const { jurisdiction, markings: m } of parts) {
    const codes = jurisdiction ? [jurisdiction] : (m.jurisdictions ?? []);
    for (const c of codes) if (!jurisdictions.includes(c)) jurisdictions.push(c);
    for (const f of m.flags) flags.add(f, jurisdiction);
    for (const l of m.lamps) lamps.add(l, jurisdiction);
    for (const r of m.reflectors) reflectors.add(r, jurisdiction);
    for (const s of m.signs) signs.add(s, jurisdiction);
    for (const s of m.escortSigns) escortSigns.add(s, jurisdiction);
    sideFlags ||= m.sideFlags;
    if (m.rearFlags > rearFlags) rearFlags = m.rearFlags;
    for (const r of m.reasons) {
      const key = `${r.code}|${r.message}|${r.source}`;
      if (!seenReasons.has(key)) {
        seenReasons.add(key);
        reasons.push(r);
      }
    }
    if (m.notOnFile) {
      notOnFile = {
        signs: (notOnFile?.signs ?? false) || m.notOnFile.signs,
        flags: (notOnFile?.flags ?? false) || m.notOnFile.flags,
        lamps: (notOnFile?.lamps ?? false) || m.notOnFile.lamps,
      };
    }
  }
  return {
    sideFlags,
    rearFlags,
    flags: flags.items(),
    lamps: lamps.items(),
    reflectors: reflectors.items(),
    signs: signs.items(),
    escortSigns: escortSigns.items(),
    reasons,
    ...(notOnFile ? { notOnFile } : {}),
    jurisdictions,
    caution: parts[0]?.markings.caution ?? PLANNING_CAUTION,
  };
}

/**
 * The move's markings: every state's assessed markings (federal 49 CFR 393.87 flags and 393.11 lamps included in
 * each), merged. A plan with no state falls back to the plan's own (federal) markings.
 */
export function assessedMarkings(result: Pick<PlanCheckResult, 'markings'> & { jurisdictions: Pick<JurisdictionPlanResult, 'code' | 'markings'>[] }): MarkingsResult {
  if (result.jurisdictions.length === 0) return mergeMarkings([{ markings: result.markings }]);
  return mergeMarkings(result.jurisdictions.map((j) => ({ jurisdiction: j.code, markings: j.markings })));
}

export type MarkingKind = 'flag' | 'sign' | 'escort-sign' | 'lamp' | 'reflector';

/** One printed line of the markings: an item at a place, with every rule that asks for it. */
export type MarkingLine = {
  kind: MarkingKind;
  /** For lamps and reflectors. */
  color?: 'red' | 'amber';
  /** The place, as the rule words it. */
  where: string;
  /** The item and its strictest requirement, e.g. `Flag, at least 18×18 in, red or orange fluorescent`. */
  what: string;
  /** States whose assessment asks for it (route order); empty when the markings name no state. */
  jurisdictions: string[];
  /** The states, when the item is asked in some of the move's states only (e.g. `WY`); null when in all of them. */
  onlyIn: string | null;
  /** Each rule asking for it, with its reason and source. */
  rules: MarkingLineRule[];
};

export type MarkingLineRule = {
  reason: string;
  source: string;
  /** What this rule asks, when the rules on the line ask different things (else null: the line says it). */
  asks: string | null;
  /** The states, when this rule is asked in fewer of the line's states (e.g. `TX`); else null. */
  onlyIn: string | null;
};

/**
 * The lines of a set of markings, merged first (so an unmerged set prints no duplicates either): flags, signs,
 * escort-vehicle signs, lamps, then reflectors, each in the order first asked.
 */
export function markingLines(markings: MarkingsResult): MarkingLine[] {
  const m = mergeMarkings([{ markings }]);
  const all = m.jurisdictions ?? [];
  const line = (kind: MarkingKind, where: string, what: string, askedBy: MarkingAsk[] = [], color?: 'red' | 'amber'): MarkingLine => {
    const jurisdictions = all.filter((j) => askedBy.some((a) => a.jurisdictions.includes(j)));
    const onlyIn = jurisdictions.length > 0 && jurisdictions.length < all.length ? jurisdictions.join(', ') : null;
    const differ = new Set(askedBy.map((a) => a.asks)).size > 1;
    const rules = askedBy.map((a) => {
      const states = jurisdictions.filter((j) => a.jurisdictions.includes(j));
      return { reason: a.reason, source: a.source, asks: differ ? a.asks : null, onlyIn: states.length > 0 && states.length < jurisdictions.length ? states.join(', ') : null };
    });
    return { kind, ...(color ? { color } : {}), where, what, jurisdictions, onlyIn, rules };
  };
  return [
    ...m.flags.map((f) => line('flag', f.position, `Flag, ${flagAsks(f)}`, f.askedBy)),
    ...m.signs.map((s) => line('sign', s.position, `"${s.text}" sign, ${signAsks(s)}`, s.askedBy)),
    ...m.escortSigns.map((s) => line('escort-sign', s.position, `"${s.text}" sign, ${signAsks(s)}`, s.askedBy)),
    ...m.lamps.map((l) => line('lamp', l.position, lampAsks(l).replace(/^./, (c) => c.toUpperCase()), l.askedBy, l.color)),
    ...m.reflectors.map((r) => line('reflector', r.position, reflectorAsks(r).replace(/^./, (c) => c.toUpperCase()), r.askedBy, r.color)),
  ];
}
