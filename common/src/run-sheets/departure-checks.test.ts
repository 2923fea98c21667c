import type { DepartureChecksRequest } from '../types/run-sheets';
import { blockingBeyondOverride, evaluateDepartureChecks, type DepartureTarget, type DepartureTrailer } from './departure-checks';

// A two-point calibration of 500 lb/psi through zero, and a 30,000 lb planned trailer group: invented figures; the
// limits are DEPARTURE_TOLERANCE_IN (1 in height and width, 6 in length) and GAUGE_PLAN_DIFF_LIMIT (15 %), both
// "common practice, no published source" where they are defined.
const TARGET: DepartureTarget = { heightIn: 162, widthIn: 144, lengthIn: 900, source: 'plan' };
const TRAILER: DepartureTrailer = { unitNumber: 'T-9', hasSlider: true, gaugeCalibration: [{ psi: 20, loadLb: 10_000 }, { psi: 80, loadLb: 40_000 }] };
const PLANNED_LB = 30_000;
const ALL_CONFIRMED: DepartureChecksRequest = {
  measuredHeightIn: 162, measuredWidthIn: 144, measuredLengthIn: 900,
  sliderPinsLocked: true, tiresInflated: true, markingsInPlace: true, permitsOnBoard: true, gaugeReadings: [],
};
const codes = (c: Partial<DepartureChecksRequest>, trailer = TRAILER, target = TARGET) => {
  const r = evaluateDepartureChecks({ ...ALL_CONFIRMED, ...c }, target, trailer, PLANNED_LB);
  return { outcome: r.outcome, findings: r.findings.map((f) => `${f.code}${f.blocking ? '!' : ''}`) };
};

describe('evaluateDepartureChecks', () => {
  it.each<[string, Partial<DepartureChecksRequest>, string[]]>([
    ['everything confirmed, measured as planned', {}, []],
    ['height exactly at the 1 in tolerance passes', { measuredHeightIn: 163 }, []],
    ['height past the tolerance blocks', { measuredHeightIn: 163.5 }, ['height_over!']],
    ['width past the tolerance blocks', { measuredWidthIn: 146 }, ['width_over!']],
    ['length within its 6 in tolerance passes', { measuredLengthIn: 906 }, []],
    ['length past its tolerance blocks', { measuredLengthIn: 907 }, ['length_over!']],
    ['far under the plan (more than three tolerances) only asks to check the plan', { measuredHeightIn: 158 }, ['height_under']],
    ['unlocked pins block on a sliding-axle trailer', { sliderPinsLocked: false }, ['pins_unlocked!']],
    ['tires, markings and permits unconfirmed each block', { tiresInflated: false, markingsInPlace: false, permitsOnBoard: false }, ['tires!', 'markings!', 'permits_on_board!']],
    ['a gauge estimate on the plan adds nothing', { gaugeReadings: [{ group: 'trailer', psi: 60 }] }, []],
    ['a gauge estimate 10–15 % off is a note', { gaugeReadings: [{ group: 'trailer', psi: 67 }] }, ['gauge_note']],
    ['a gauge estimate over 15 % off blocks', { gaugeReadings: [{ group: 'trailer', psi: 70 }] }, ['gauge_differs!']],
    ['… unless a certified scale weight is recorded for the group', { gaugeReadings: [{ group: 'trailer', psi: 70 }], scaleWeights: [{ group: 'trailer', lb: 34_800, ticket: 'CAT 118' }] }, ['gauge_differs_scaled']],
    ['a reading outside the calibrated range carries the estimate\'s warning', { gaugeReadings: [{ group: 'trailer', psi: 61 }, { group: 'trailer', psi: 85 }] }, ['gauge_differs!', 'gauge_warning']],
  ])('%s', (_name, input, expected) => {
    const r = codes(input);
    expect(r.findings).toEqual(expected);
    expect(r.outcome).toBe(expected.some((c) => c.endsWith('!')) ? 'blocked' : 'passed');
  });

  it('pins are not asked of a trailer without a sliding axle', () => {
    expect(codes({ sliderPinsLocked: false }, { ...TRAILER, hasSlider: false }).findings).toEqual([]);
  });

  it('a trailer with fewer than two calibration readings gives no estimate, only a note naming it', () => {
    const r = evaluateDepartureChecks({ ...ALL_CONFIRMED, gaugeReadings: [{ group: 'trailer', psi: 70 }] }, TARGET, { ...TRAILER, gaugeCalibration: [] }, PLANNED_LB);
    expect(r.gaugeEstimates).toEqual([]);
    expect(r.findings).toEqual([{ code: 'gauge_uncalibrated', blocking: false, message: 'trailer T-9 has fewer than two calibration readings: no estimate from the gauge' }]);
    expect(r.outcome).toBe('passed');
  });

  it('keeps each estimate with its group and the planned weight, and names permitted dimensions when a permit gives them', () => {
    const r = evaluateDepartureChecks({ ...ALL_CONFIRMED, measuredHeightIn: 170, gaugeReadings: [{ group: 'trailer', psi: 70 }] }, { ...TARGET, source: 'permit' }, TRAILER, PLANNED_LB);
    expect(r.gaugeEstimates).toHaveLength(1);
    expect(r.gaugeEstimates[0]).toMatchObject({ group: 'trailer', plannedLb: PLANNED_LB });
    expect(r.gaugeEstimates[0].loadLb).toBeCloseTo(35_000, 6);
    expect(r.findings[0].message).toMatch(/^measured height .* over the permitted .*tolerance 1 in/);
    expect(r.findings[1].message).toMatch(/17 % off the planned 30,000 lb \(limit 15 %, common practice\)/);
  });
});

describe('blockingBeyondOverride', () => {
  it('leaves only blocking findings other than the gauge estimate (common practice, no published source)', () => {
    const findings = [
      { code: 'gauge_differs', blocking: true, message: 'gauge' },
      { code: 'gauge_note', blocking: false, message: 'note' },
      { code: 'tires', blocking: true, message: 'tires' },
    ];
    expect(blockingBeyondOverride(findings).map((f) => f.code)).toEqual(['tires']);
    expect(blockingBeyondOverride(findings.slice(0, 2))).toEqual([]);
  });
});
