import type { FeeRule } from './jurisdiction-rule';
import { estimatePermitFee, type FeeMove } from './permit-fee';

// Fee formulas in the shape of the cited texts (fixtures; the states' own records and checks live in src/rulebook).
const OH_FEE: FeeRule = {
  baseUsd: 20,
  weightBrackets: [
    { overLb: 80_000, upToLb: 120_000, feeUsd: 125 },
    { overLb: 120_000, feeUsd: 125 },
  ],
  tonMile: { usdPerTonMile: 0.04, overLb: 120_000, appliesAboveLb: 120_000 },
  dimensionTiers: [{ maxWidthIn: 14 * 12, maxHeightIn: 14 * 12 + 6, feeUsd: 55 }, { feeUsd: 125 }],
  combined: 'weight-only',
};
const PA_FEE: FeeRule = { baseUsd: 0, widthTiers: [{ upToIn: 14 * 12, feeUsd: 25 }, { feeUsd: 50 }], tonMile: { usdPerTonMile: 0.03, overRegisteredGross: true } };
const TX_FEE: FeeRule = {
  baseUsd: 60,
  weightBrackets: [
    { overLb: 80_000, upToLb: 120_000, feeUsd: 150 },
    { overLb: 120_000, upToLb: 160_000, feeUsd: 225 },
    { overLb: 160_000, upToLb: 200_000, feeUsd: 300 },
    { overLb: 200_000, feeUsd: 375 },
  ],
  refundable: false,
};
const SAMPLE_RULE_OH = { fee: OH_FEE };
const SAMPLE_RULE_PA = { fee: PA_FEE };
const SAMPLE_RULE_TX = { fee: TX_FEE };

const legalDims = { widthIn: 102, heightIn: 160, lengthIn: 900 };
const move = (p: Partial<FeeMove>): FeeMove => ({ grossLb: 80_000, ...legalDims, miles: 100, oversize: false, overweight: false, ...p });

describe('estimatePermitFee', () => {
  it('OAC 5501:2-1-05 worked example: 150,000 lb over 200 miles → $20 + $125 + 0.04 × 15 × 200 = $265', () => {
    const r = estimatePermitFee(SAMPLE_RULE_OH.fee, move({ grossLb: 150_000, miles: 200, overweight: true }), 'fixture');
    expect(r.totalUsd).toBe(265);
    expect(r.lines.map((l) => l.amountUsd)).toEqual([20, 125, 120]);
    expect(r.lines[0].source).toBe('fixture');
  });

  it('combined "weight-only": a load both oversize and overweight pays the base and the weight part, not the dimension part', () => {
    const both = estimatePermitFee(OH_FEE, move({ grossLb: 100_000, widthIn: 150, oversize: true, overweight: true }), 'fixture');
    expect(both.totalUsd).toBe(145);
    const sum = estimatePermitFee({ ...OH_FEE, combined: 'sum' }, move({ grossLb: 100_000, widthIn: 150, oversize: true, overweight: true }), 'fixture');
    expect(sum.totalUsd).toBe(200);
  });

  it('per-mile fee: miles × rate', () => {
    expect(estimatePermitFee({ baseUsd: 10, perMile: { usdPerMile: 0.5 } }, move({ miles: 120, oversize: true }), 'fixture').totalUsd).toBe(70);
  });

  it.each([
    [100_000, 102, 160, false, 145, 'OAC 5501:2-1-05: overweight up to 120,000 → $20 + $125'],
    [120_000, 102, 160, false, 145, 'OAC 5501:2-1-05: exactly 120,000 → no ton-mile fee'],
    [80_000, 14 * 12, 14 * 12 + 6, true, 75, 'OAC 5501:2-1-05: width up to 14 ft / height up to 14\'6" → $55'],
    [80_000, 14 * 12 + 1, 160, true, 145, 'OAC 5501:2-1-05: wider than 14 ft → $125'],
    [80_000, 150, 14 * 12 + 7, true, 145, 'OAC 5501:2-1-05: higher than 14\'6" → $125'],
  ])('Ohio: %i lb, %i in wide, %i in high (oversize %p) → $%i (%s)', (grossLb, widthIn, heightIn, oversize, total) => {
    const r = estimatePermitFee(SAMPLE_RULE_OH.fee, move({ grossLb, widthIn, heightIn, oversize, overweight: grossLb > 80_000 }), 'fixture');
    expect(r.totalUsd).toBe(total);
  });

  it.each([
    [14 * 12, 80_000, 25, '75 Pa.C.S. 1942: up to 14 ft wide → $25'],
    [14 * 12 + 1, 80_000, 50, '75 Pa.C.S. 1942: above 14 ft → $50'],
    [120, 100_000, 55, '75 Pa.C.S. 1942: 10 tons over registered gross × 100 mi × $0.03 = $30, plus $25'],
  ])('Pennsylvania: %i in wide, %i lb → $%i (%s)', (widthIn, grossLb, total) => {
    const r = estimatePermitFee(SAMPLE_RULE_PA.fee, move({ widthIn, grossLb, oversize: widthIn > 102, overweight: grossLb > 80_000, registeredGrossLb: 80_000 }), 'fixture');
    expect(r.totalUsd).toBe(total);
  });

  it.each([
    [80_000, 60],
    [80_001, 210],
    [120_000, 210],
    [120_001, 285],
    [160_000, 285],
    [160_001, 360],
    [200_000, 360],
    [200_001, 435],
  ])('43 TAC 219.13: Texas single trip, gross %i lb → $%i', (grossLb, total) => {
    const r = estimatePermitFee(SAMPLE_RULE_TX.fee, move({ grossLb, oversize: true, overweight: grossLb > 80_000 }), 'fixture');
    expect(r.totalUsd).toBe(total);
    expect(r.refundable).toBe(false);
  });

  it('North Dakota oversize-only (references §7): $20 plus a $10 routing fee', () => {
    const nd: FeeRule = {
      baseUsd: 20,
      addOns: [{ label: 'routing fee', feeUsd: 10, when: 'oversize' }],
    };
    expect(estimatePermitFee(nd, move({ widthIn: 150, oversize: true }), 'fixture').totalUsd).toBe(30);
  });

  it.each([
    [{ grossLb: -1 }, /grossLb must be at least 0/],
    [{ miles: Number.NaN }, /miles must be a finite number/],
    [{ widthIn: 1e7 }, /widthIn must be at most/],
  ])('bad input %j → RangeError', (patch, msg) => {
    expect(() => estimatePermitFee(SAMPLE_RULE_OH.fee, move(patch), 'fixture')).toThrow(msg);
  });
});
