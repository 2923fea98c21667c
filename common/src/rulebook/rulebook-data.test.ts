/**
 * The shipped rulebook: one record per jurisdiction, each well formed, each value with its own source, and each
 * state's check values (read from the texts its record cites, `checks/<CODE>.json`) holding against the engine.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import { JURISDICTIONS } from '../geo/jurisdictions';
import { validateJurisdictionRule } from '../engine/validate-rule';
import { RULEBOOK_DATA } from './data-index';
import { factsOf, rulebookCoverage } from './coverage';
import { runRuleCheck, type RuleChecksFile } from './rule-checks';

const CHECKS_DIR = path.join(__dirname, 'checks');
const checksOf = (code: string): RuleChecksFile | null => {
  const f = path.join(CHECKS_DIR, `${code}.json`);
  return fs.existsSync(f) ? (JSON.parse(fs.readFileSync(f, 'utf8')) as RuleChecksFile) : null;
};
const FEDERAL_CITATION = /\b(U\.?\s?S\.?\s?C\.?|C\.?\s?F\.?\s?R\.?|FHWA|FMCSA)\b/i;

describe('the shipped rulebook', () => {
  it('has one record per jurisdiction (48 contiguous states and DC), each a data file', () => {
    expect(Object.keys(RULEBOOK_DATA).sort()).toEqual(JURISDICTIONS.map((j) => j.code).sort());
    for (const j of JURISDICTIONS) expect(fs.existsSync(path.join(__dirname, 'data', `${j.code}.json`))).toBe(true);
  });

  it('no jurisdiction silently takes federal or another state’s values', () => {
    const byUrl = new Map<string, Set<string>>();
    for (const [code, r] of Object.entries(RULEBOOK_DATA)) {
      for (const [p, f] of factsOf(r)) {
        if (f.status === 'unknown') continue;
        // a federal text is at most a secondary source for a state's value, and says so
        if (f.status === 'sourced') expect({ code, path: p, federal: FEDERAL_CITATION.test(f.citation) }).toEqual({ code, path: p, federal: false });
        if (f.status === 'sourced') {
          const set = byUrl.get(f.url) ?? new Set<string>();
          set.add(code);
          byUrl.set(f.url, set);
        }
      }
    }
    // a state's own text is that state's: no URL read as `sourced` serves two jurisdictions
    const shared = [...byUrl].filter(([, codes]) => codes.size > 1).map(([url, codes]) => `${url}: ${[...codes].join(', ')}`);
    expect(shared).toEqual([]);
  });

  it('coverage counts add up: every fact of every record is sourced, secondary or not on file', () => {
    const c = rulebookCoverage(Object.values(RULEBOOK_DATA).map((record) => ({ record })));
    const facts = Object.values(RULEBOOK_DATA).reduce((s, r) => s + factsOf(r).length, 0);
    expect(c.totals.jurisdictions).toBe(49);
    expect(c.totals.sourced + c.totals.secondary + c.totals.unknown).toBe(facts);
    expect(c.totals.facts).toBe(facts);
  });
});

describe.each(JURISDICTIONS.map((j) => j.code))('%s', (code) => {
  const record = RULEBOOK_DATA[code];
  const file = checksOf(code);

  it(`${code}: the record is well formed and every known value names its source`, () => {
    expect(() => validateJurisdictionRule(JSON.parse(JSON.stringify(record)))).not.toThrow();
    expect(record.code).toBe(code);
  });

  const knownCount = factsOf(record).filter(([, f]) => f.status !== 'unknown').length;
  if (knownCount > 0) {
    it(`${code}: a record with values on file has at least five check values from its texts`, () => {
      expect(file?.code).toBe(code);
      expect(file!.checks.length).toBeGreaterThanOrEqual(5);
      for (const c of file!.checks) expect(c.citation).toBeTruthy();
    });
  }

  if (file) {
    it.each(file.checks.map((c) => [c.name, c] as const))(`${code}: %s`, (_name, c) => {
      const out = runRuleCheck(record, c);
      expect({ check: c.name, citation: c.citation, actual: out.actual, ok: out.ok }).toMatchObject({ ok: true });
    });
  }
});
