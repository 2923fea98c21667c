import fc from 'fast-check';
import { planCheck, type PlanInput } from './plan-check';
import { SAMPLE_PLAN } from './sample-plan';
import { projectingLoadMarkings, type FlagPlacement, type MarkingsResult } from './markings';
import { assessedMarkings, markingLines, mergeMarkings, positionKey } from './markings-merge';
import { fixtureRule, known } from './__fixtures__/facts';

// Marking rules in the shape of state texts (fixtures with fixture citations; the states' own records live in src/rulebook).
const TX_CORNERS = 'fixture: corner flags on an oversize load';
const TX_LAMPS = 'fixture: side-projection lamps';
const TEXAS = fixtureRule('TX', 'Texas', {
  flags: known(
    [
      { kind: 'corners' as const, when: [], whenOversize: true, minCount: 4, minSquareIn: 12, colors: 'red' },
      { kind: 'corners' as const, when: [{ measure: 'width' as const, over: 102 }], minCount: 4, minSquareIn: 18, colors: 'red or orange fluorescent' },
    ],
    TX_CORNERS,
  ),
  lamps: known([{ when: [{ measure: 'sideProjection' as const, over: 4 }], lamps: [{ position: 'front of the side projection', color: 'amber' as const, count: 1 }], note: 'at night' }], TX_LAMPS),
});
const OKLAHOMA = fixtureRule('OK', 'Oklahoma');

/** The sample 11 ft wide move (15 in beyond each side) on a Texas then Oklahoma route. */
const plan: PlanInput = {
  ...SAMPLE_PLAN,
  route: [
    { jurisdiction: 'TX', miles: 200, roadType: 'interstate', lat: 33.6, lon: -97.1, timeZone: 'America/Chicago' },
    { jurisdiction: 'OK', miles: 150, roadType: 'interstate', lat: 34.9, lon: -97.2, timeZone: 'America/Chicago' },
  ],
  rules: [TEXAS, OKLAHOMA],
};
const result = planCheck(plan);
const merged = assessedMarkings(result);
const lines = markingLines(merged);
const CORNERS = ['front left corner', 'front right corner', 'rear left corner', 'rear right corner'];

describe('assessedMarkings: the run sheet lists the assessment of every state', () => {
  it('the state corner flags of the assessment are on the list (the plan-level set holds only the federal 49 CFR 393.87 flags)', () => {
    const tx = result.jurisdictions.find((j) => j.code === 'TX')!;
    expect(tx.markings.flags.filter((f) => f.position.includes('corner'))).toHaveLength(8); // two rules, four corners each
    expect(result.markings.flags.some((f) => f.position.includes('corner'))).toBe(false);
    for (const c of CORNERS) expect(merged.flags.filter((f) => f.position === c)).toHaveLength(1);
  });

  it('every item of every state is on the list, each source on its line', () => {
    for (const j of result.jurisdictions) {
      const m = j.markings;
      const all: { kind: string; position: string; source: string }[] = [
        ...m.flags.map((f) => ({ kind: 'flag', ...f })),
        ...m.signs.map((s) => ({ kind: 'sign', ...s })),
        ...m.escortSigns.map((s) => ({ kind: 'escort-sign', ...s })),
        ...m.lamps.map((l) => ({ kind: 'lamp', ...l })),
        ...m.reflectors.map((r) => ({ kind: 'reflector', ...r })),
      ];
      for (const item of all) {
        const line = lines.find((l) => l.kind === item.kind && positionKey(l.where) === positionKey(item.position) && l.rules.some((a) => a.source === item.source));
        expect(line?.jurisdictions).toContain(j.code);
      }
    }
  });

  it('one line per item and place: no two lines share kind, color and place', () => {
    const keys = lines.map((l) => `${l.kind}|${l.color ?? ''}|${positionKey(l.where)}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('49 CFR 393.87 and a state rule on one corner: one flag line, the larger flag, both sources kept', () => {
    const corner = lines.filter((l) => l.kind === 'flag' && l.where === 'front left corner');
    expect(corner).toHaveLength(1);
    expect(corner[0].what).toBe('Flag, at least 18×18 in, red; red or orange fluorescent');
    expect(corner[0].rules.map((a) => a.asks)).toEqual(['at least 12×12 in, red', 'at least 18×18 in, red or orange fluorescent']);
    expect(corner[0].rules.map((a) => a.source)).toEqual([expect.stringContaining(TX_CORNERS), expect.stringContaining(TX_CORNERS)]);
    expect(corner[0].onlyIn).toBe('TX');
  });

  it('49 CFR 393.11: the federal lamps asked in both states print once, with both states; a state rule asking the same lamp joins the line', () => {
    const front = lines.filter((l) => l.kind === 'lamp' && l.where === 'front of the side projection');
    expect(front).toHaveLength(1);
    expect(front[0]).toMatchObject({ color: 'amber', what: '1 amber lamp', jurisdictions: ['TX', 'OK'], onlyIn: null });
    expect(front[0].rules.map((a) => a.source)).toEqual([expect.stringMatching(/49 CFR 393\.11/), expect.stringContaining(TX_LAMPS)]);
    expect(front[0].rules.map((a) => [a.asks, a.onlyIn])).toEqual([[null, null], [null, 'TX']]);
    const rear = lines.filter((l) => l.kind === 'lamp' && l.where === 'rear of the side projection');
    expect(rear).toHaveLength(1);
  });

  it('49 CFR 393.87: the side flags, asked in every state, are each one line', () => {
    const side = lines.filter((l) => l.kind === 'flag' && /extremity of the projection/.test(l.where));
    expect(side.map((l) => l.where)).toEqual([
      'left, front extremity of the projection',
      'left, rear extremity of the projection',
      'right, front extremity of the projection',
      'right, rear extremity of the projection',
    ]);
    for (const l of side) expect(l).toMatchObject({ jurisdictions: ['TX', 'OK'], onlyIn: null, what: 'Flag, at least 18×18 in, red or orange fluorescent' });
  });

  it('says which states were merged and keeps each state\'s not-on-file topics', () => {
    expect(merged.jurisdictions).toEqual(['TX', 'OK']);
    expect(merged.notOnFile).toEqual({ signs: true, flags: true, lamps: true });
    expect(merged.sideFlags).toBe(true);
  });

  it('merging a merged set changes nothing, so the page and the PDF (which both merge again) print the same lines', () => {
    expect(mergeMarkings([{ markings: merged }])).toEqual(merged);
    expect(markingLines(mergeMarkings([{ markings: merged }]))).toEqual(lines);
    expect(JSON.parse(JSON.stringify(lines))).toEqual(lines);
  });

  it('a plan with no state falls back to the plan markings (49 CFR 393.87 flags)', () => {
    const fed = assessedMarkings({ markings: result.markings, jurisdictions: [] });
    expect(fed.flags.map((f) => f.position)).toEqual(result.markings.flags.map((f) => f.position));
    expect(markingLines(fed).every((l) => l.jurisdictions.length === 0 && l.onlyIn === null)).toBe(true);
  });
});

describe('mergeMarkings', () => {
  const base = (over: Partial<MarkingsResult>): MarkingsResult => ({
    sideFlags: false,
    rearFlags: 0,
    flags: [],
    lamps: [],
    reflectors: [],
    signs: [],
    escortSigns: [],
    reasons: [],
    caution: 'planning only',
    ...over,
  });

  it('49 CFR 393.11 and a state rule: red lamps at one place merge (the most lamps, the farthest visibility); an amber lamp or a reflector there stays its own line', () => {
    const a = base({ lamps: [{ position: 'extreme rear of the load', color: 'red', count: 1, reason: 'at night', source: '49 CFR 393.11' }] });
    const b = base({
      lamps: [
        { position: 'Extreme rear  of the load', color: 'red', count: 2, visibleFt: 500, reason: 'at night', source: 'state fixture' },
        { position: 'extreme rear of the load', color: 'amber', count: 1, reason: 'at night', source: 'state fixture' },
      ],
      reflectors: [{ position: 'extreme rear of the load', color: 'red', count: 2, source: 'state fixture' }],
    });
    const m = mergeMarkings([{ jurisdiction: 'PA', markings: a }, { jurisdiction: 'MD', markings: b }]);
    expect(m.lamps).toHaveLength(2);
    expect(m.lamps[0]).toMatchObject({ position: 'extreme rear of the load', color: 'red', count: 2, visibleFt: 500, source: '49 CFR 393.11; state fixture' });
    expect(m.reflectors).toHaveLength(1);
    expect(markingLines(m).map((l) => `${l.kind} ${l.what} | ${l.onlyIn ?? 'all'}`)).toEqual([
      'lamp 2 red lamps, visible 500 ft | all',
      'lamp 1 amber lamp | MD',
      'reflector 2 red reflectors | MD',
    ]);
  });

  it('signs with the same text at the same place merge to the largest sign, letters and stroke; another text stays apart', () => {
    const sign = (minWidthIn: number, letterHeightIn: number, source: string, text = 'OVERSIZE LOAD') => ({ text, position: 'rear', minWidthIn, minHeightIn: 18, letterHeightIn, colors: 'black on yellow', reason: 'oversize load', source });
    const m = mergeMarkings([
      { jurisdiction: 'WY', markings: base({ signs: [{ ...sign(60, 8, 'sign fixture A'), strokeIn: 1 }] }) },
      { jurisdiction: 'WI', markings: base({ signs: [{ ...sign(84, 10, 'sign fixture B'), strokeIn: 1.4 }, sign(84, 10, 'sign fixture B', 'WIDE LOAD')] }) },
    ]);
    expect(m.signs).toHaveLength(2);
    expect(m.signs[0]).toMatchObject({ text: 'OVERSIZE LOAD', minWidthIn: 84, letterHeightIn: 10, strokeIn: 1.4, source: 'sign fixture A; sign fixture B' });
    expect(m.signs[0].askedBy!.map((a) => a.jurisdictions)).toEqual([['WY'], ['WI']]);
  });

  it('nothing is dropped and nothing is listed twice, whatever the rules ask (property)', () => {
    const positions = ['front left corner', 'Front left corner', 'rear left corner', 'extreme rear of the load', 'widest extremity, flag 1'];
    const flag = fc.record({
      position: fc.constantFrom(...positions),
      minSquareIn: fc.integer({ min: 12, max: 24 }),
      colors: fc.constantFrom('red', 'red or orange fluorescent'),
      reason: fc.constantFrom('oversize load', 'projecting load'),
      source: fc.constantFrom('49 CFR 393.87', 'state fixture A', 'state fixture B'),
    });
    const part = fc.record({ jurisdiction: fc.constantFrom('TX', 'OK', 'NM'), flags: fc.array(flag, { maxLength: 8 }) });
    fc.assert(
      fc.property(fc.array(part, { minLength: 1, maxLength: 4 }), (ps) => {
        const m = mergeMarkings(ps.map((p) => ({ jurisdiction: p.jurisdiction, markings: base({ flags: p.flags as FlagPlacement[] }) })));
        const keys = m.flags.map((f) => positionKey(f.position));
        expect(new Set(keys).size).toBe(keys.length);
        for (const p of ps) {
          for (const f of p.flags) {
            const line = m.flags.find((x) => positionKey(x.position) === positionKey(f.position))!;
            expect(line.minSquareIn).toBeGreaterThanOrEqual(f.minSquareIn);
            expect(line.askedBy!.some((a) => a.source === f.source && a.reason === f.reason && a.jurisdictions.includes(p.jurisdiction))).toBe(true);
          }
        }
        expect(mergeMarkings([{ markings: m }])).toEqual(m);
      }),
    );
  });

  it('49 CFR 393.87: a plain single-state set lists the same items as before, one line each', () => {
    const one = projectingLoadMarkings({ sideProjectionIn: 20, rearProjectionIn: 60, rearProjectionWidthIn: 40, widthIn: 142 });
    const l = markingLines(one);
    expect(l.filter((x) => x.kind === 'flag')).toHaveLength(one.flags.length);
    expect(l.filter((x) => x.kind === 'lamp')).toHaveLength(one.lamps.length);
    expect(l[0]).toMatchObject({ where: 'projecting side, front extremity of the projection', jurisdictions: [], onlyIn: null });
  });

  it('no markings at all → no lines', () => {
    expect(markingLines(mergeMarkings([]))).toEqual([]);
  });
});
