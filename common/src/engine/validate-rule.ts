/** Structural validation of a rulebook record (edited in the Rulebook screen, read from jsonb or a data file). */
import { HOLIDAY_NAMES } from './holidays';
import { ESCORT_MEASURES, MEASURES, ROAD_TYPES } from './jurisdiction-rule';
import type { JurisdictionRule, Measure, RoadType } from './jurisdiction-rule';
import { ABSURD, checkNumber, parseIsoDate } from './validate';

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
function str(field: string, v: unknown, max = 2000): string {
  if (typeof v !== 'string' || v.trim() === '') fail(field, 'must be a non-empty string');
  if ((v as string).length > max) fail(field, `must be at most ${max} characters`);
  return v as string;
}
function optStr(field: string, v: unknown, max = 2000): void {
  if (v !== undefined) str(field, v, max);
}
function bool(field: string, v: unknown): boolean {
  if (typeof v !== 'boolean') fail(field, 'must be true or false');
  return v as boolean;
}
function date(field: string, v: unknown): void {
  parseIsoDate(field, v);
}
function int(field: string, v: unknown, min: number, max: number): number {
  return checkNumber(field, v, { min, max, integer: true });
}
const inches = (field: string, v: unknown, min = 0, max: number = ABSURD.lengthIn): number => checkNumber(field, v, { min, max, unit: 'in' });
const pounds = (field: string, v: unknown, min = 0, max: number = ABSURD.weightLb): number => checkNumber(field, v, { min, max, unit: 'lb' });
const usd = (field: string, v: unknown): number => {
  const n = checkNumber(field, v, { min: 0, max: 1_000_000, unit: 'usd' });
  if (Math.abs(Math.round(n * 1e6) - n * 1e6) > 1e-6) fail(field, 'must have at most six decimal places');
  return n;
};
function clock(field: string, v: unknown): number {
  const m = typeof v === 'string' ? /^([01]\d|2[0-4]):([0-5]\d)$/.exec(v) : null;
  if (!m || (m[1] === '24' && m[2] !== '00')) fail(field, `must be a HH:MM time; got ${JSON.stringify(v)}`);
  return Number(m[1]) * 60 + Number(m[2]);
}
function trigger(field: string, v: unknown, measure?: Measure): Measure {
  const t = obj(field, v);
  if (!MEASURES.includes(t.measure as Measure)) fail(`${field}.measure`, `must be one of ${MEASURES.join(', ')}`);
  if (measure && t.measure !== measure) fail(`${field}.measure`, `must be ${measure} in the ${measure} escort rules`);
  if (t.over === undefined && t.atLeast === undefined) fail(field, 'must give "over" or "atLeast"');
  if (t.over !== undefined && t.atLeast !== undefined) fail(field, 'must give only one of "over" and "atLeast"');
  const check = t.measure === 'gross' ? pounds : inches;
  if (t.over !== undefined) check(`${field}.over`, t.over);
  if (t.atLeast !== undefined) check(`${field}.atLeast`, t.atLeast);
  return t.measure as Measure;
}
function triggers(field: string, v: unknown): void {
  arr(field, v).forEach((t, j) => trigger(`${field}[${j}]`, t));
}
function appliesAbove(field: string, v: unknown): void {
  if (v === undefined) return;
  const a = obj(field, v);
  let any = false;
  for (const k of ['widthOverIn', 'heightOverIn', 'lengthOverIn']) {
    if (a[k] === undefined) continue;
    inches(`${field}.${k}`, a[k]);
    any = true;
  }
  if (a.grossOverLb !== undefined) {
    pounds(`${field}.grossOverLb`, a.grossOverLb);
    any = true;
  }
  if (!any) fail(field, 'must give at least one of widthOverIn, heightOverIn, lengthOverIn, grossOverLb');
}

const STATUSES = ['sourced', 'secondary', 'unknown'];

/**
 * One fact: a known one needs a value and its whole source (citation, URL, edition, as-of date); an unknown one
 * has no value and a note of what was searched. `check` validates the value (null may be allowed).
 */
function fact(field: string, v: unknown, check: (f: string, value: unknown) => void, opts: { nullable?: boolean } = {}): boolean {
  const f = obj(field, v);
  if (!STATUSES.includes(f.status as string)) fail(`${field}.status`, "must be 'sourced', 'secondary' or 'unknown'");
  if (f.status === 'unknown') {
    if ('value' in f) fail(`${field}.value`, 'must be absent when the status is unknown (a value needs a source)');
    str(`${field}.note`, f.note);
    return false;
  }
  if (!('value' in f) || f.value === undefined) fail(`${field}.value`, `is required when the status is ${String(f.status)}`);
  str(`${field}.citation`, f.citation, 500);
  str(`${field}.url`, f.url, 1000);
  if (!/^https?:\/\/\S+$/.test(f.url as string)) fail(`${field}.url`, 'must be an http(s) URL');
  str(`${field}.edition`, f.edition, 200);
  date(`${field}.asOf`, f.asOf);
  optStr(`${field}.quote`, f.quote, 4000);
  optStr(`${field}.note`, f.note, 4000);
  if (f.value === null) {
    if (!opts.nullable) fail(`${field}.value`, 'must not be null');
    return true;
  }
  check(`${field}.value`, f.value);
  return true;
}

function escortRules(field: string, v: unknown, measure: Measure): void {
  arr(field, v).forEach((x, i) => {
    const f = `${field}[${i}]`;
    const er = obj(f, x);
    trigger(`${f}.when`, er.when, measure);
    const roads = arr(`${f}.roads`, er.roads);
    if (roads.length === 0 || roads.some((rt) => !ROAD_TYPES.includes(rt as RoadType))) fail(`${f}.roads`, `must list road types from ${ROAD_TYPES.join(', ')}`);
    int(`${f}.front`, er.front, 0, 10);
    int(`${f}.rear`, er.rear, 0, 10);
    if (er.heightPole !== undefined) bool(`${f}.heightPole`, er.heightPole);
    if (er.police !== undefined) bool(`${f}.police`, er.police);
    optStr(`${f}.alternative`, er.alternative);
  });
}

/** Throws a RangeError naming the first bad field; returns the record typed when it is well formed. */
export function validateJurisdictionRule(value: unknown): JurisdictionRule {
  const r = obj('rule', value);
  str('rule.code', r.code, 4);
  if (!/^[A-Z]{2}$/.test(r.code as string)) fail('rule.code', 'must be a two-letter postal code');
  str('rule.name', r.name, 100);
  if (r.schema !== 2) fail('rule.schema', 'must be 2');
  date('rule.asOf', r.asOf);
  optStr('rule.researchNotes', r.researchNotes, 20000);

  const l = obj('rule.legal', r.legal);
  fact('rule.legal.widthIn', l.widthIn, (f, x) => inches(f, x, 72, 216));
  fact('rule.legal.heightIn', l.heightIn, (f, x) => inches(f, x, 120, 240));
  fact('rule.legal.overallLengthIn', l.overallLengthIn, (f, x) => inches(f, x, 240, 2400), { nullable: true });
  fact('rule.legal.semitrailerLengthIn', l.semitrailerLengthIn, (f, x) => inches(f, x, 240, 1200), { nullable: true });
  fact('rule.legal.frontOverhangIn', l.frontOverhangIn, (f, x) => inches(f, x, 0, 600), { nullable: true });
  fact('rule.legal.rearOverhangIn', l.rearOverhangIn, (f, x) => inches(f, x, 0, 600), { nullable: true });
  fact('rule.legal.singleAxleLb', l.singleAxleLb, (f, x) => pounds(f, x, 10_000, 40_000));
  fact('rule.legal.tandemLb', l.tandemLb, (f, x) => pounds(f, x, 20_000, 60_000));
  fact('rule.legal.tridemLb', l.tridemLb, (f, x) => pounds(f, x, 25_000, 80_000), { nullable: true });
  fact('rule.legal.grossLb', l.grossLb, (f, x) => pounds(f, x, 50_000, 200_000));
  fact('rule.legal.bridge', l.bridge, (f, x) => {
    const b = obj(f, x);
    bool(`${f}.formula`, b.formula);
    if (b.tandemPairMinFt !== null) checkNumber(`${f}.tandemPairMinFt`, b.tandemPairMinFt, { min: 0, max: 100, unit: 'ft' });
    if (b.tie !== 'down' && b.tie !== 'up') fail(`${f}.tie`, "must be 'down' or 'up'");
  });
  fact('rule.legal.tireLbPerInch', l.tireLbPerInch, (f, x) => pounds(f, x, 100, 2000), { nullable: true });

  const p = obj('rule.permit', r.permit);
  fact('rule.permit.validityDays', p.validityDays, (f, x) => int(f, x, 1, 366));
  fact('rule.permit.leadTimeDays', p.leadTimeDays, (f, x) => int(f, x, 0, 366));
  fact('rule.permit.classes', p.classes, (f, x) => arr(f, x).forEach((c, i) => str(`${f}[${i}]`, c, 200)));
  fact('rule.permit.routineMaxima', p.routineMaxima, (f, x) => {
    const mx = obj(f, x);
    for (const k of ['widthIn', 'heightIn', 'lengthIn']) if (mx[k] !== undefined) inches(`${f}.${k}`, mx[k], 0, ABSURD.lengthIn);
    for (const k of ['singleAxleLb', 'tandemLb', 'tridemLb', 'quadLb', 'grossLb', 'tireLbPerInch']) if (mx[k] !== undefined) pounds(`${f}.${k}`, mx[k]);
    optStr(`${f}.note`, mx.note);
  });
  fact('rule.superload', r.superload, (f, x) => {
    const s = obj(f, x);
    for (const k of ['widthOverIn', 'heightOverIn', 'lengthOverIn']) if (s[k] !== undefined) inches(`${f}.${k}`, s[k], 96);
    if (s.grossOverLb !== undefined) pounds(`${f}.grossOverLb`, s.grossOverLb, 80_000);
  });

  const e = obj('rule.escorts', r.escorts);
  for (const m of ESCORT_MEASURES) fact(`rule.escorts.${m}`, e[m], (f, x) => escortRules(f, x, m));
  fact(
    'rule.escorts.twoDimensionRule',
    e.twoDimensionRule,
    (f, x) => {
      const t = obj(f, x);
      arr(`${f}.exceptPairs`, t.exceptPairs).forEach((pair, i) => {
        const pr = arr(`${f}.exceptPairs[${i}]`, pair);
        if (pr.length !== 2 || pr.some((y) => !MEASURES.includes(y as Measure))) fail(`${f}.exceptPairs[${i}]`, 'must be a pair of measures');
      });
    },
    { nullable: true },
  );
  fact('rule.escorts.heightPoleMarginIn', e.heightPoleMarginIn, (f, x) => inches(f, x, 0, 60));
  fact('rule.escorts.certification', e.certification, (f, x) => str(f, x), { nullable: true });

  fact('rule.signs', r.signs, (field, x) =>
    arr(field, x).forEach((y, i) => {
      const f = `${field}[${i}]`;
      const s = obj(f, y);
      triggers(`${f}.when`, s.when);
      if (s.whenOversize !== undefined) bool(`${f}.whenOversize`, s.whenOversize);
      str(`${f}.text`, s.text, 200);
      inches(`${f}.minWidthIn`, s.minWidthIn, 0, 240);
      inches(`${f}.minHeightIn`, s.minHeightIn, 0, 120);
      inches(`${f}.letterHeightIn`, s.letterHeightIn, 0, 60);
      if (s.strokeIn !== undefined) inches(`${f}.strokeIn`, s.strokeIn, 0, 12);
      str(`${f}.colors`, s.colors, 200);
      arr(`${f}.positions`, s.positions).forEach((pos, j) => str(`${f}.positions[${j}]`, pos, 200));
    }),
  );
  fact('rule.flags', r.flags, (field, x) =>
    arr(field, x).forEach((y, i) => {
      const f = `${field}[${i}]`;
      const fl = obj(f, y);
      if (!['corners', 'width-extremities', 'overhang'].includes(fl.kind as string)) fail(`${f}.kind`, "must be 'corners', 'width-extremities' or 'overhang'");
      triggers(`${f}.when`, fl.when);
      if (fl.whenOversize !== undefined) bool(`${f}.whenOversize`, fl.whenOversize);
      int(`${f}.minCount`, fl.minCount, 0, 20);
      if (fl.maxCount !== undefined) int(`${f}.maxCount`, fl.maxCount, fl.minCount as number, 20);
      inches(`${f}.minSquareIn`, fl.minSquareIn, 0, 2000);
      str(`${f}.colors`, fl.colors, 200);
    }),
  );
  fact('rule.lamps', r.lamps, (field, x) =>
    arr(field, x).forEach((y, i) => {
      const f = `${field}[${i}]`;
      const lr = obj(f, y);
      triggers(`${f}.when`, lr.when);
      arr(`${f}.lamps`, lr.lamps).forEach((lamp, j) => {
        const lp = obj(`${f}.lamps[${j}]`, lamp);
        str(`${f}.lamps[${j}].position`, lp.position, 200);
        if (lp.color !== 'red' && lp.color !== 'amber') fail(`${f}.lamps[${j}].color`, "must be 'red' or 'amber'");
        int(`${f}.lamps[${j}].count`, lp.count, 0, 20);
      });
      optStr(`${f}.note`, lr.note);
    }),
  );

  const t = obj('rule.travel', r.travel);
  fact(
    'rule.travel.daylight',
    t.daylight,
    (f, x) => {
      const d = obj(f, x);
      checkNumber(`${f}.startOffsetMin`, d.startOffsetMin, { min: -240, max: 240, integer: true, unit: 'min' });
      checkNumber(`${f}.endOffsetMin`, d.endOffsetMin, { min: -240, max: 240, integer: true, unit: 'min' });
      appliesAbove(`${f}.appliesAbove`, d.appliesAbove);
    },
    { nullable: true },
  );
  fact('rule.travel.weekends', t.weekends, (f, x) => {
    const w = obj(f, x);
    arr(`${f}.bans`, w.bans).forEach((b, i) => {
      const bf = `${f}.bans[${i}]`;
      const ban = obj(bf, b);
      int(`${bf}.day`, ban.day, 0, 6);
      const from = ban.from !== undefined ? clock(`${bf}.from`, ban.from) : 0;
      const to = ban.to !== undefined ? clock(`${bf}.to`, ban.to) : 24 * 60;
      if (to <= from) fail(`${bf}.to`, 'must be after the start');
    });
    appliesAbove(`${f}.appliesAbove`, w.appliesAbove);
  });
  fact('rule.travel.holidays', t.holidays, (f, x) => {
    const h = obj(f, x);
    arr(`${f}.names`, h.names).forEach((n, i) => {
      if (!(typeof n === 'string' && Object.prototype.hasOwnProperty.call(HOLIDAY_NAMES, n))) fail(`${f}.names[${i}]`, `must be one of ${Object.keys(HOLIDAY_NAMES).join(', ')}; got ${JSON.stringify(n)}`);
    });
    if (!['noon-weekday-before', 'noon-day-before', 'day-only'].includes(h.from as string)) fail(`${f}.from`, "must be 'noon-weekday-before', 'noon-day-before' or 'day-only'");
    if (!['actual', 'observed', 'both'].includes(h.observance as string)) fail(`${f}.observance`, "must be 'actual', 'observed' or 'both'");
    if (h.until !== undefined) clock(`${f}.until`, h.until);
    appliesAbove(`${f}.appliesAbove`, h.appliesAbove);
  });
  fact('rule.travel.curfews', t.curfews, (field, x) =>
    arr(field, x).forEach((y, i) => {
      const f = `${field}[${i}]`;
      const c = obj(f, y);
      str(`${f}.area`, c.area, 200);
      const a = clock(`${f}.start`, c.start);
      const b = clock(`${f}.end`, c.end);
      if (a === b) fail(`${f}.end`, 'must differ from the start');
      if (c.days !== undefined) arr(`${f}.days`, c.days).forEach((d, j) => int(`${f}.days[${j}]`, d, 0, 6));
      if (c.appliesIn !== 'urban' && c.appliesIn !== 'everywhere') fail(`${f}.appliesIn`, "must be 'urban' or 'everywhere'");
      if (c.exempt !== undefined) {
        const ex = obj(`${f}.exempt`, c.exempt);
        if (ex.overweightOnly !== undefined) bool(`${f}.exempt.overweightOnly`, ex.overweightOnly);
        if (ex.overlengthOnlyMaxIn !== undefined) inches(`${f}.exempt.overlengthOnlyMaxIn`, ex.overlengthOnlyMaxIn);
      }
      appliesAbove(`${f}.appliesAbove`, c.appliesAbove);
    }),
  );
  fact('rule.travel.minVisibilityFt', t.minVisibilityFt, (f, x) => checkNumber(f, x, { min: 1, max: 10_000, unit: 'ft' }), { nullable: true });

  fact('rule.fee', r.fee, (field, x) => {
    const fee = obj(field, x);
    usd(`${field}.baseUsd`, fee.baseUsd);
    if (fee.widthTiers !== undefined)
      arr(`${field}.widthTiers`, fee.widthTiers).forEach((y, i) => {
        const w = obj(`${field}.widthTiers[${i}]`, y);
        if (w.upToIn !== undefined) inches(`${field}.widthTiers[${i}].upToIn`, w.upToIn);
        usd(`${field}.widthTiers[${i}].feeUsd`, w.feeUsd);
      });
    if (fee.dimensionTiers !== undefined)
      arr(`${field}.dimensionTiers`, fee.dimensionTiers).forEach((y, i) => {
        const d = obj(`${field}.dimensionTiers[${i}]`, y);
        for (const k of ['maxWidthIn', 'maxHeightIn', 'maxLengthIn']) if (d[k] !== undefined) inches(`${field}.dimensionTiers[${i}].${k}`, d[k]);
        usd(`${field}.dimensionTiers[${i}].feeUsd`, d.feeUsd);
      });
    if (fee.weightBrackets !== undefined)
      arr(`${field}.weightBrackets`, fee.weightBrackets).forEach((y, i) => {
        const b = obj(`${field}.weightBrackets[${i}]`, y);
        pounds(`${field}.weightBrackets[${i}].overLb`, b.overLb);
        if (b.upToLb !== undefined) pounds(`${field}.weightBrackets[${i}].upToLb`, b.upToLb, b.overLb as number);
        usd(`${field}.weightBrackets[${i}].feeUsd`, b.feeUsd);
      });
    if (fee.tonMile !== undefined) {
      const tm = obj(`${field}.tonMile`, fee.tonMile);
      usd(`${field}.tonMile.usdPerTonMile`, tm.usdPerTonMile);
      if (tm.overLb !== undefined) pounds(`${field}.tonMile.overLb`, tm.overLb);
      if (tm.appliesAboveLb !== undefined) pounds(`${field}.tonMile.appliesAboveLb`, tm.appliesAboveLb);
      if (tm.overRegisteredGross !== undefined) bool(`${field}.tonMile.overRegisteredGross`, tm.overRegisteredGross);
    }
    if (fee.perMile !== undefined) {
      const pm = obj(`${field}.perMile`, fee.perMile);
      usd(`${field}.perMile.usdPerMile`, pm.usdPerMile);
      if (pm.when !== undefined && !['always', 'oversize', 'overweight'].includes(pm.when as string)) fail(`${field}.perMile.when`, "must be 'always', 'oversize' or 'overweight'");
    }
    if (fee.combined !== undefined && fee.combined !== 'sum' && fee.combined !== 'weight-only') fail(`${field}.combined`, "must be 'sum' or 'weight-only'");
    if (fee.addOns !== undefined)
      arr(`${field}.addOns`, fee.addOns).forEach((y, i) => {
        const a = obj(`${field}.addOns[${i}]`, y);
        str(`${field}.addOns[${i}].label`, a.label, 200);
        usd(`${field}.addOns[${i}].feeUsd`, a.feeUsd);
        if (a.when !== undefined && !['always', 'oversize', 'overweight'].includes(a.when as string)) fail(`${field}.addOns[${i}].when`, "must be 'always', 'oversize' or 'overweight'");
      });
    if (fee.refundable !== undefined) bool(`${field}.refundable`, fee.refundable);
  });
  fact('rule.speed', r.speed, (f, x) => {
    const s = obj(f, x);
    if (s.maxMph !== null) checkNumber(`${f}.maxMph`, s.maxMph, { min: 5, max: 85, unit: 'mph' });
    optStr(`${f}.note`, s.note);
  });
  return value as JurisdictionRule;
}
