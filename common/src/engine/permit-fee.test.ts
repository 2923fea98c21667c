import type { FeeRule } from './jurisdiction-rule';
import { estimatePermitFee, type FeeMove } from './permit-fee';
import { SAMPLE_RULE_OH, SAMPLE_RULE_PA, SAMPLE_RULE_TX } from './rulebook-samples';

const legalDims = { widthIn: 102, heightIn: 160, lengthIn: 900 };
const move = (p: Partial<FeeMove>): FeeMove => ({ grossLb: 80_000, ...legalDims, miles: 100, oversize: false, overweight: false, ...p });

describe('estimatePermitFee', () => {
  it('OAC 5501:2-1-05 worked example: 150,000 lb over 200 miles → $20 + $125 + 0.04 × 15 × 200 = $265', () => {
    const r = estimatePermitFee(SAMPLE_RULE_OH.fee, move({ grossLb: 150_000, miles: 200, overweight: true }));
    expect(r.totalUsd).toBe(265);
    expect(r.lines.map((l) => l.amountUsd)).toEqual([20, 125, 120]);
    expect(r.lines[0].source).toMatch(/OAC 5501:2-1-05/);
  });

  it.each([
    [100_000, 102, 160, false, 145, 'OAC 5501:2-1-05: overweight up to 120,000 → $20 + $125'],
    [120_000, 102, 160, false, 145, 'OAC 5501:2-1-05: exactly 120,000 → no ton-mile fee'],
    [80_000, 14 * 12, 14 * 12 + 6, true, 75, 'OAC 5501:2-1-05: width up to 14 ft / height up to 14\'6" → $55'],
    [80_000, 14 * 12 + 1, 160, true, 145, 'OAC 5501:2-1-05: wider than 14 ft → $125'],
    [80_000, 150, 14 * 12 + 7, true, 145, 'OAC 5501:2-1-05: higher than 14\'6" → $125'],
  ])('Ohio: %i lb, %i in wide, %i in high (oversize %p) → $%i (%s)', (grossLb, widthIn, heightIn, oversize, total) => {
    const r = estimatePermitFee(SAMPLE_RULE_OH.fee, move({ grossLb, widthIn, heightIn, oversize, overweight: grossLb > 80_000 }));
    expect(r.totalUsd).toBe(total);
  });

  it.each([
    [14 * 12, 80_000, 25, '75 Pa.C.S. 1942: up to 14 ft wide → $25'],
    [14 * 12 + 1, 80_000, 50, '75 Pa.C.S. 1942: above 14 ft → $50'],
    [120, 100_000, 55, '75 Pa.C.S. 1942: 10 tons over registered gross × 100 mi × $0.03 = $30, plus $25'],
  ])('Pennsylvania: %i in wide, %i lb → $%i (%s)', (widthIn, grossLb, total) => {
    const r = estimatePermitFee(SAMPLE_RULE_PA.fee, move({ widthIn, grossLb, oversize: widthIn > 102, overweight: grossLb > 80_000, registeredGrossLb: 80_000 }));
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
    const r = estimatePermitFee(SAMPLE_RULE_TX.fee, move({ grossLb, oversize: true, overweight: grossLb > 80_000 }));
    expect(r.totalUsd).toBe(total);
    expect(r.refundable).toBe(false);
  });

  it('North Dakota oversize-only (references §7): $20 plus a $10 routing fee', () => {
    const nd: FeeRule = {
      baseUsd: 20,
      addOns: [{ label: 'routing fee', feeUsd: 10, when: 'oversize' }],
      source: { citation: 'North Dakota oversize permit fee', asOf: '2026-12-01' },
    };
    expect(estimatePermitFee(nd, move({ widthIn: 150, oversize: true })).totalUsd).toBe(30);
  });

  it.each([
    [{ grossLb: -1 }, /grossLb must be at least 0/],
    [{ miles: Number.NaN }, /miles must be a finite number/],
    [{ widthIn: 1e7 }, /widthIn must be at most/],
  ])('bad input %j → RangeError', (patch, msg) => {
    expect(() => estimatePermitFee(SAMPLE_RULE_OH.fee, move(patch))).toThrow(msg);
  });
});
