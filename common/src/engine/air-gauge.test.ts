import { estimateAxleLoadFromGauge } from './air-gauge';

// Calibration per trailer against a certified scale: an empty tandem near 10,000 lb (secondary source), and
// about 20,000 lb per axle at 60 psi (common practice, no published source).
const cal = [
  { psi: 8, loadLb: 10_000 },
  { psi: 60, loadLb: 40_000 },
];

describe('estimateAxleLoadFromGauge (affine fit, never pressure × constant)', () => {
  it.each([
    [8, 10_000, true],
    [34, 25_000, true],
    [60, 40_000, true],
    [70, 45_769.23, false],
  ])('air-suspension calibration (secondary source): %f psi → about %f lb (in range %p)', (psi, load, inRange) => {
    const r = estimateAxleLoadFromGauge(psi, cal);
    expect(r.loadLb).toBeCloseTo(load, 1);
    expect(r.inCalibratedRange).toBe(inRange);
    expect(r.caution).toMatch(/verify on a certified scale/);
  });

  it('the empty intercept matters: 34 psi is not 34/60 × 40,000', () => {
    const r = estimateAxleLoadFromGauge(34, cal);
    expect(Math.abs(r.loadLb - (34 / 60) * 40_000)).toBeGreaterThan(2_000);
    expect(r.interceptLb).toBeGreaterThan(0);
  });

  it('least squares over three readings; warns when extrapolating; compares with the plan', () => {
    const r = estimateAxleLoadFromGauge(80, [...cal, { psi: 34, loadLb: 25_300 }], { plannedLb: 50_000 });
    expect(r.maxResidualLb).toBeGreaterThan(0);
    expect(r.warnings[0]).toMatch(/outside the calibrated range 8–60 psi/);
    expect(r.differenceFromPlanLb).toBeCloseTo(50_000 - r.loadLb, 6);
  });

  it.each([
    [40, [{ psi: 8, loadLb: 10_000 }], /at least two/],
    [40, [{ psi: 30, loadLb: 10_000 }, { psi: 30, loadLb: 20_000 }], /different pressures/],
    [40, [{ psi: 10, loadLb: 30_000 }, { psi: 50, loadLb: 20_000 }], /rise with pressure/],
    [-5, cal, /psi must be at least 0/],
    [Number.NaN, cal, /psi must be a finite number/],
    [40, [{ psi: 8, loadLb: -1 }, { psi: 60, loadLb: 40_000 }], /calibration\[0\].loadLb/],
  ])('bad input (%p psi) → RangeError', (psi, c, msg) => {
    expect(() => estimateAxleLoadFromGauge(psi, c)).toThrow(RangeError);
    expect(() => estimateAxleLoadFromGauge(psi, c)).toThrow(msg);
  });
});
