/** Test fixtures: facts with a named citation, for engine tests that exercise a rule's shape (not a state's data). */
import { blankRecord } from '../../rulebook/blank-record';
import type { JurisdictionRule, KnownFact, TravelRules, UnknownFact } from '../jurisdiction-rule';

export const known = <T>(value: T, citation = 'test fixture', status: 'sourced' | 'secondary' = 'sourced'): KnownFact<T> => ({
  status,
  value,
  citation,
  url: 'https://example.org/test-fixture',
  edition: 'test fixture',
  asOf: '2026-12-02',
});
export const unknown = (note = 'test fixture: not on file'): UnknownFact => ({ status: 'unknown', note });

/** Travel rules with no limit at all (every topic known and open). */
export const openTravel = (): TravelRules => ({
  daylight: known(null),
  weekends: known({ bans: [] }),
  holidays: known({ names: [], from: 'day-only', observance: 'both' }),
  curfews: known([]),
  minVisibilityFt: known(null),
});

type Patch = { [K in keyof JurisdictionRule]?: JurisdictionRule[K] extends object ? Partial<JurisdictionRule[K]> : JurisdictionRule[K] };

/** A record with every topic not on file, patched with the given facts. */
export function fixtureRule(code: string, name: string, patch: Patch = {}): JurisdictionRule {
  const b = blankRecord(code, name, '2026-12-02', 'test fixture: not on file');
  return {
    ...b,
    ...patch,
    legal: { ...b.legal, ...(patch.legal ?? {}) },
    permit: { ...b.permit, ...(patch.permit ?? {}) },
    escorts: { ...b.escorts, ...(patch.escorts ?? {}) },
    travel: { ...b.travel, ...(patch.travel ?? {}) },
  } as JurisdictionRule;
}

/** Federal Interstate weights and the 102 in width as known facts (23 U.S.C. 127(a), 23 CFR 658.15). */
export const federalLegal = () => ({
  widthIn: known(102, '23 CFR 658.15'),
  heightIn: known(162, 'test fixture'),
  overallLengthIn: known<number | null>(null, 'test fixture'),
  frontOverhangIn: known<number | null>(36, 'test fixture'),
  rearOverhangIn: known<number | null>(48, 'test fixture'),
  singleAxleLb: known(20_000, '23 U.S.C. 127(a)'),
  tandemLb: known(34_000, '23 U.S.C. 127(a)'),
  grossLb: known(80_000, '23 U.S.C. 127(a)'),
  bridge: known({ formula: true, tandemPairMinFt: 36, tie: 'down' as const }, '23 U.S.C. 127(a)'),
});
