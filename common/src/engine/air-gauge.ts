/** Axle-group load from an air-suspension gauge reading, by an affine fit to certified-scale readings. */
import { Reason } from './reasons';
import { formatPounds } from './units';
import { ABSURD, checkNumber } from './validate';

export type GaugeCalibrationPoint = { psi: number; loadLb: number };

export type GaugeEstimate = {
  loadLb: number;
  slopeLbPerPsi: number;
  interceptLb: number;
  /** Largest difference between a calibration reading and the fitted line. */
  maxResidualLb: number;
  inCalibratedRange: boolean;
  /** Planned minus estimated, when a planned load is given. */
  differenceFromPlanLb?: number;
  warnings: string[];
  reasons: Reason[];
  caution: string;
};

export const GAUGE_CAUTION = 'Estimate only: verify on a certified scale.';
const SOURCE = 'Air-suspension load ≈ pressure × effective area, calibrated per trailer against a certified scale (secondary source)';

/**
 * Least-squares line load = intercept + slope × psi through this trailer's scale readings (at least two distinct
 * pressures), never "pressure × constant": an empty group has a non-zero load at its empty pressure.
 */
export function estimateAxleLoadFromGauge(
  psi: number,
  calibration: GaugeCalibrationPoint[],
  options: { plannedLb?: number } = {},
): GaugeEstimate {
  checkNumber('psi', psi, { min: 0, max: ABSURD.psi, unit: 'psi' });
  if (!Array.isArray(calibration) || calibration.length < 2) {
    throw new RangeError('calibration must hold at least two certified-scale readings (psi and load)');
  }
  calibration.forEach((p, i) => {
    checkNumber(`calibration[${i}].psi`, p.psi, { min: 0, max: ABSURD.psi, unit: 'psi' });
    checkNumber(`calibration[${i}].loadLb`, p.loadLb, { min: 0, max: ABSURD.axleWeightLb, unit: 'lb' });
  });
  const n = calibration.length;
  const mx = calibration.reduce((s, p) => s + p.psi, 0) / n;
  const my = calibration.reduce((s, p) => s + p.loadLb, 0) / n;
  let sxx = 0;
  let sxy = 0;
  for (const p of calibration) {
    sxx += (p.psi - mx) ** 2;
    sxy += (p.psi - mx) * (p.loadLb - my);
  }
  if (sxx < 1e-9) throw new RangeError('calibration readings must be taken at two or more different pressures');
  const slope = sxy / sxx;
  if (slope <= 0) throw new RangeError('calibration: the load must rise with pressure; check the readings');
  const intercept = my - slope * mx;
  const maxResidualLb = Math.max(...calibration.map((p) => Math.abs(p.loadLb - (intercept + slope * p.psi))));
  const loadLb = Math.max(0, intercept + slope * psi);
  const lo = Math.min(...calibration.map((p) => p.psi));
  const hi = Math.max(...calibration.map((p) => p.psi));
  const inCalibratedRange = psi >= lo && psi <= hi;
  const warnings: string[] = [];
  if (!inCalibratedRange) {
    warnings.push(`${psi} psi is outside the calibrated range ${lo}–${hi} psi: the estimate is an extrapolation`);
  }
  if (maxResidualLb > 1_000) {
    warnings.push(`calibration readings scatter up to ${formatPounds(maxResidualLb)} from the line: recalibrate on a certified scale`);
  }
  const reasons: Reason[] = [
    {
      code: 'gauge-fit',
      message: `load ≈ ${formatPounds(Math.round(intercept))} + ${Math.round(slope * 10) / 10} lb/psi × ${psi} psi = ${formatPounds(loadLb)} (from ${n} scale readings)`,
      value: loadLb,
      unit: 'lb',
      source: SOURCE,
    },
  ];
  let differenceFromPlanLb: number | undefined;
  if (options.plannedLb !== undefined) {
    const planned = checkNumber('plannedLb', options.plannedLb, { min: 0, max: ABSURD.weightLb, unit: 'lb' });
    differenceFromPlanLb = planned - loadLb;
    reasons.push({
      code: 'gauge-vs-plan',
      message: `plan ${formatPounds(planned)}, gauge estimate ${formatPounds(loadLb)}`,
      value: loadLb,
      limit: planned,
      unit: 'lb',
      source: SOURCE,
    });
  }
  return {
    loadLb,
    slopeLbPerPsi: slope,
    interceptLb: intercept,
    maxResidualLb,
    inCalibratedRange,
    ...(differenceFromPlanLb !== undefined ? { differenceFromPlanLb } : {}),
    warnings,
    reasons,
    caution: GAUGE_CAUTION,
  };
}
