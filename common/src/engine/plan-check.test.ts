import { planCheck, type PlanInput } from './plan-check';
import { SAMPLE_PLAN } from './sample-plan';

describe('planCheck', () => {
  const r = planCheck(SAMPLE_PLAN);

  it('runs the full plan: 9 axles with all bridge groups, 3 articles, 10 jurisdictions × 5 days', () => {
    expect(r.axles).toHaveLength(9);
    expect(r.federal.groups.filter((g) => g.rule !== 'gross').length).toBeGreaterThanOrEqual(9 + 30);
    expect(r.securement.map((s) => s.articleId)).toEqual(['excavator', 'bucket', 'blade']);
    expect(r.jurisdictions).toHaveLength(10);
    for (const j of r.jurisdictions) expect(j.travel).toHaveLength(5);
  });

  it('textbook statics: the axles carry the whole gross', () => {
    expect(r.axles.reduce((s, a) => s + a.weightLb, 0)).toBeCloseTo(r.axleLoads.grossLb, 6);
    expect(r.axleLoads.grossLb).toBe(12_000 + 14_000 + 30_000 + 60_000 + 4_000 + 2_500);
  });

  it('23 U.S.C. 127 / 23 CFR 658.15: an 11 ft wide 122,500 lb move needs a permit in every jurisdiction', () => {
    expect(r.summary.permitsNeeded).toHaveLength(10);
    for (const j of r.jurisdictions) expect(j.permitReasons.some((x) => x.code === 'over-legal-width')).toBe(true);
  });

  it('fees: the total adds the fees on file; a fee not on file is listed, never counted as $0', () => {
    const onFile = r.jurisdictions.filter((j) => j.fee?.known);
    const cents = onFile.reduce((s, j) => s + Math.round((j.fee as { totalUsd: number }).totalUsd * 100), 0);
    expect(r.summary.estimatedFeesUsd).toBe(cents / 100);
    expect(r.summary.feesNotOnFile).toEqual(r.jurisdictions.filter((j) => j.fee && !j.fee.known).map((j) => j.code));
    expect(r.summary.feesNotOnFile).toContain('LA');
  });

  it('a jurisdiction without a rulebook record reads as every topic not on file, never as "none"', () => {
    const la = r.jurisdictions.find((j) => j.code === 'LA')!;
    expect(la.ruleFound).toBe(false);
    expect(r.summary.problems).toContain('LA: no rulebook record; every topic not on file');
    expect(la.escorts.known).toBe(false);
    expect(la.fee).toMatchObject({ known: false, totalUsd: null });
    expect(la.travel.every((t) => t.known === false && t.unknownTopics.includes('daylight'))).toBe(true);
    expect(r.summary.escortsNotOnFile).toContain('LA');
    const laQuestions = r.summary.openQuestions.filter((q) => q.jurisdiction === 'LA').map((q) => q.topic);
    expect(laQuestions).toEqual(expect.arrayContaining(['escorts', 'fee', 'travel.daylight', 'travel.holidays']));
  });

  it('earliest departure is the first legal moment in the origin jurisdiction, and says whether its travel rules are on file', () => {
    const origin = r.jurisdictions[0];
    const starts = origin.travel.flatMap((t) => t.intervals.map((i) => i.start)).sort();
    expect(r.summary.earliestDeparture).toBe(starts[0] ?? null);
    expect(r.summary.earliestDepartureKnown).toBe(origin.travel.every((t) => t.known));
  });

  it('49 CFR 393.87: 15 in side projection each side → side flags; securement passes (393.106, 393.110, 393.130)', () => {
    expect(r.markings.sideFlags).toBe(true);
    expect(r.securement.every((s) => s.ok)).toBe(true);
  });

  it('is deterministic and JSON-serialisable', () => {
    const again = planCheck(SAMPLE_PLAN);
    expect(again).toEqual(r);
    expect(JSON.parse(JSON.stringify(r))).toEqual(r);
  });

  it('a legal load needs no permit and no flags', () => {
    const legal: PlanInput = {
      ...SAMPLE_PLAN,
      articles: [{ ...SAMPLE_PLAN.articles[1], id: 'crate', positionFromTrailerFrontIn: 200, widthIn: 96 }],
      route: [SAMPLE_PLAN.route[0]],
    };
    const x = planCheck(legal);
    expect(x.summary.permitsNeeded).toEqual([]);
    expect(x.markings.flags).toEqual([]);
  });

  it.each([
    [{ route: [] }, /route must list at least one segment/],
    [{ travelDates: ['2027-02-30'] }, /date/],
    [{ tractor: { ...SAMPLE_PLAN.tractor, bumperToSteerIn: -1 } }, /tractor.bumperToSteerIn must be at least 0/],
    [{ articles: [{ ...SAMPLE_PLAN.articles[0], weightLb: Number.NaN }] }, /weightLb must be a finite number/],
  ])('bad input → RangeError (%#)', (patch, msg) => {
    expect(() => planCheck({ ...SAMPLE_PLAN, ...patch } as PlanInput)).toThrow(RangeError);
    expect(() => planCheck({ ...SAMPLE_PLAN, ...patch } as PlanInput)).toThrow(msg);
  });
});
