/** Structural validation of a rulebook record (e.g. one edited in the Rulebook screen or read from jsonb). */
import { HOLIDAY_NAMES } from './holidays';
import type { JurisdictionRule, Measure, RoadType, Trigger } from './jurisdiction-rule';
import { ABSURD, checkNumber } from './validate';

const MEASURES: Measure[] = ['width', 'height', 'length', 'frontOverhang', 'rearOverhang', 'sideProjection', 'gross'];
const ROADS: RoadType[] = ['two-lane', 'multilane', 'interstate'];

function fail(field: string, what: string): never {
  throw new RangeError(`${field} ${what}`);
}
function obj(field: string, v: unknown): Record<string, unknown> {
  if (typeof v !== 'object' || v === null || Array.isArray(v)) fail(field, 'must be an object');
  return v as Record<string, unknown>;
}
function arr(field: string, v: unknown): unknown[] {
  if (!Array.isArray(v)) fail(field, 'must be an array');
  return v as unknown[];
}
function str(field: string, v: unknown): string {
  if (typeof v !== 'string' || v.trim() === '') fail(field, 'must be a non-empty string');
  return v as string;
}
function bool(field: string, v: unknown): boolean {
  if (typeof v !== 'boolean') fail(field, 'must be true or false');
  return v as boolean;
}
function date(field: string, v: unknown): void {
  if (typeof v !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(v)) fail(field, `must be a YYYY-MM-DD date; got ${JSON.stringify(v)}`);
}
function source(field: string, v: unknown): void {
  const s = obj(field, v);
  str(`${field}.citation`, s.citation);
  date(`${field}.asOf`, s.asOf);
  if (s.sample !== undefined) bool(`${field}.sample`, s.sample);
}
const inches = (field: string, v: unknown): number => checkNumber(field, v, { min: 0, max: ABSURD.lengthIn, unit: 'in' });
const pounds = (field: string, v: unknown): number => checkNumber(field, v, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
const usd = (field: string, v: unknown): number => checkNumber(field, v, { min: 0, max: 1_000_000, unit: 'usd' });
function trigger(field: string, v: unknown): void {
  const t = obj(field, v) as Partial<Trigger>;
  if (!MEASURES.includes(t.measure as Measure)) fail(`${field}.measure`, `must be one of ${MEASURES.join(', ')}`);
  if (t.over === undefined && t.atLeast === undefined) fail(field, 'must give "over" or "atLeast"');
  const check = t.measure === 'gross' ? pounds : inches;
  if (t.over !== undefined) check(`${field}.over`, t.over);
  if (t.atLeast !== undefined) check(`${field}.atLeast`, t.atLeast);
}
function clock(field: string, v: unknown): void {
  if (typeof v !== 'string' || !/^([01]\d|2[0-4]):[0-5]\d$/.test(v)) fail(field, `must be a HH:MM time; got ${JSON.stringify(v)}`);
}

/** Throws a RangeError naming the first bad field; returns the record typed when it is well formed. */
export function validateJurisdictionRule(value: unknown): JurisdictionRule {
  const r = obj('rule', value);
  str('rule.code', r.code);
  str('rule.name', r.name);
  bool('rule.sample', r.sample);
  date('rule.asOf', r.asOf);

  const l = obj('rule.legal', r.legal);
  inches('rule.legal.widthIn', l.widthIn);
  inches('rule.legal.heightIn', l.heightIn);
  inches('rule.legal.lengthIn', l.lengthIn);
  if (l.frontOverhangIn !== null) inches('rule.legal.frontOverhangIn', l.frontOverhangIn);
  if (l.rearOverhangIn !== null) inches('rule.legal.rearOverhangIn', l.rearOverhangIn);
  pounds('rule.legal.singleAxleLb', l.singleAxleLb);
  pounds('rule.legal.tandemLb', l.tandemLb);
  pounds('rule.legal.grossLb', l.grossLb);
  bool('rule.legal.bridgeFormula', l.bridgeFormula);
  if (l.tandemPairMinFt !== null) checkNumber('rule.legal.tandemPairMinFt', l.tandemPairMinFt, { min: 0, max: ABSURD.lengthFt, unit: 'ft' });
  if (l.bridgeTie !== 'down' && l.bridgeTie !== 'up') fail('rule.legal.bridgeTie', "must be 'down' or 'up'");
  source('rule.legal.source', l.source);
  const ds = obj('rule.legal.dimensionSources', l.dimensionSources);
  for (const k of ['width', 'height', 'length', 'overhangs']) source(`rule.legal.dimensionSources.${k}`, ds[k]);

  const p = obj('rule.permit', r.permit);
  checkNumber('rule.permit.validityDays', p.validityDays, { min: 0, max: 366, integer: true });
  checkNumber('rule.permit.leadTimeDays', p.leadTimeDays, { min: 0, max: 366, integer: true });
  source('rule.permit.source', p.source);

  const e = obj('rule.escorts', r.escorts);
  arr('rule.escorts.rules', e.rules).forEach((x, i) => {
    const f = `rule.escorts.rules[${i}]`;
    const er = obj(f, x);
    trigger(`${f}.when`, er.when);
    const roads = arr(`${f}.roads`, er.roads);
    if (roads.length === 0 || roads.some((rt) => !ROADS.includes(rt as RoadType))) fail(`${f}.roads`, `must list road types from ${ROADS.join(', ')}`);
    checkNumber(`${f}.front`, er.front, { min: 0, max: 10, integer: true });
    checkNumber(`${f}.rear`, er.rear, { min: 0, max: 10, integer: true });
    if (er.heightPole !== undefined) bool(`${f}.heightPole`, er.heightPole);
    source(`${f}.source`, er.source);
  });
  if (e.twoDimensionRule !== null) {
    const t = obj('rule.escorts.twoDimensionRule', e.twoDimensionRule);
    arr('rule.escorts.twoDimensionRule.exceptPairs', t.exceptPairs).forEach((pair, i) => {
      const pr = arr(`rule.escorts.twoDimensionRule.exceptPairs[${i}]`, pair);
      if (pr.length !== 2 || pr.some((x) => !MEASURES.includes(x as Measure))) fail(`rule.escorts.twoDimensionRule.exceptPairs[${i}]`, 'must be a pair of measures');
    });
    source('rule.escorts.twoDimensionRule.source', t.source);
  }
  if (e.heightPole !== null) {
    const hp = obj('rule.escorts.heightPole', e.heightPole);
    checkNumber('rule.escorts.heightPole.marginIn', hp.marginIn, { min: 0, max: 60, unit: 'in' });
    source('rule.escorts.heightPole.source', hp.source);
  }

  arr('rule.signs', r.signs).forEach((x, i) => {
    const f = `rule.signs[${i}]`;
    const s = obj(f, x);
    arr(`${f}.when`, s.when).forEach((t, j) => trigger(`${f}.when[${j}]`, t));
    str(`${f}.text`, s.text);
    inches(`${f}.minWidthIn`, s.minWidthIn);
    inches(`${f}.minHeightIn`, s.minHeightIn);
    inches(`${f}.letterHeightIn`, s.letterHeightIn);
    arr(`${f}.positions`, s.positions).forEach((pos, j) => str(`${f}.positions[${j}]`, pos));
    source(`${f}.source`, s.source);
  });
  arr('rule.flags', r.flags).forEach((x, i) => {
    const f = `rule.flags[${i}]`;
    const fl = obj(f, x);
    if (!['corners', 'width-extremities', 'overhang'].includes(fl.kind as string)) fail(`${f}.kind`, "must be 'corners', 'width-extremities' or 'overhang'");
    arr(`${f}.when`, fl.when).forEach((t, j) => trigger(`${f}.when[${j}]`, t));
    checkNumber(`${f}.minCount`, fl.minCount, { min: 0, max: 20, integer: true });
    inches(`${f}.minSquareIn`, fl.minSquareIn);
    source(`${f}.source`, fl.source);
  });
  arr('rule.lamps', r.lamps).forEach((x, i) => {
    const f = `rule.lamps[${i}]`;
    const lr = obj(f, x);
    arr(`${f}.when`, lr.when).forEach((t, j) => trigger(`${f}.when[${j}]`, t));
    arr(`${f}.lamps`, lr.lamps).forEach((lamp, j) => {
      const lp = obj(`${f}.lamps[${j}]`, lamp);
      if (lp.color !== 'red' && lp.color !== 'amber') fail(`${f}.lamps[${j}].color`, "must be 'red' or 'amber'");
      checkNumber(`${f}.lamps[${j}].count`, lp.count, { min: 0, max: 20, integer: true });
    });
    source(`${f}.source`, lr.source);
  });

  const t = obj('rule.travel', r.travel);
  if (t.daylight !== null) {
    const d = obj('rule.travel.daylight', t.daylight);
    checkNumber('rule.travel.daylight.startOffsetMin', d.startOffsetMin, { min: -240, max: 240, unit: 'min' });
    checkNumber('rule.travel.daylight.endOffsetMin', d.endOffsetMin, { min: -240, max: 240, unit: 'min' });
    source('rule.travel.daylight.source', d.source);
  }
  const w = obj('rule.travel.weekends', t.weekends);
  bool('rule.travel.weekends.allowed', w.allowed);
  source('rule.travel.weekends.source', w.source);
  const h = obj('rule.travel.holidays', t.holidays);
  arr('rule.travel.holidays.names', h.names).forEach((n, i) => {
    if (!(typeof n === 'string' && n in HOLIDAY_NAMES)) fail(`rule.travel.holidays.names[${i}]`, `must be one of ${Object.keys(HOLIDAY_NAMES).join(', ')}`);
  });
  if (!['noon-weekday-before', 'noon-day-before', 'day-only'].includes(h.from as string)) fail('rule.travel.holidays.from', "must be 'noon-weekday-before', 'noon-day-before' or 'day-only'");
  if (!['actual', 'observed', 'both'].includes(h.observance as string)) fail('rule.travel.holidays.observance', "must be 'actual', 'observed' or 'both'");
  source('rule.travel.holidays.source', h.source);
  arr('rule.travel.curfews', t.curfews).forEach((x, i) => {
    const f = `rule.travel.curfews[${i}]`;
    const c = obj(f, x);
    clock(`${f}.start`, c.start);
    clock(`${f}.end`, c.end);
    if ((c.start as string) >= (c.end as string)) fail(`${f}.end`, 'must be after the start');
    if (c.days !== undefined) arr(`${f}.days`, c.days).forEach((d, j) => checkNumber(`${f}.days[${j}]`, d, { min: 0, max: 6, integer: true }));
    if (c.appliesIn !== 'urban' && c.appliesIn !== 'everywhere') fail(`${f}.appliesIn`, "must be 'urban' or 'everywhere'");
    source(`${f}.source`, c.source);
  });

  const fee = obj('rule.fee', r.fee);
  usd('rule.fee.baseUsd', fee.baseUsd);
  if (fee.widthTiers !== undefined) arr('rule.fee.widthTiers', fee.widthTiers).forEach((x, i) => usd(`rule.fee.widthTiers[${i}].feeUsd`, obj(`rule.fee.widthTiers[${i}]`, x).feeUsd));
  if (fee.dimensionTiers !== undefined) arr('rule.fee.dimensionTiers', fee.dimensionTiers).forEach((x, i) => usd(`rule.fee.dimensionTiers[${i}].feeUsd`, obj(`rule.fee.dimensionTiers[${i}]`, x).feeUsd));
  if (fee.weightBrackets !== undefined) {
    arr('rule.fee.weightBrackets', fee.weightBrackets).forEach((x, i) => {
      const b = obj(`rule.fee.weightBrackets[${i}]`, x);
      pounds(`rule.fee.weightBrackets[${i}].overLb`, b.overLb);
      if (b.upToLb !== undefined) pounds(`rule.fee.weightBrackets[${i}].upToLb`, b.upToLb);
      usd(`rule.fee.weightBrackets[${i}].feeUsd`, b.feeUsd);
    });
  }
  if (fee.tonMile !== undefined) usd('rule.fee.tonMile.usdPerTonMile', obj('rule.fee.tonMile', fee.tonMile).usdPerTonMile);
  source('rule.fee.source', fee.source);

  const s = obj('rule.superload', r.superload);
  for (const k of ['widthOverIn', 'heightOverIn', 'lengthOverIn']) if (s[k] !== undefined) inches(`rule.superload.${k}`, s[k]);
  if (s.grossOverLb !== undefined) pounds('rule.superload.grossOverLb', s.grossOverLb);
  source('rule.superload.source', s.source);
  return value as JurisdictionRule;
}
