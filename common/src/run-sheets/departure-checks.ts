import { estimateAxleLoadFromGauge, GAUGE_CAUTION, type GaugeCalibrationPoint } from '../engine/air-gauge';
import { formatFeetInches } from '../engine/units';
import {
  DEPARTURE_TOLERANCE_IN, GAUGE_PLAN_DIFF_LIMIT,
  type CheckFinding, type DepartureChecksDto, type DepartureChecksRequest,
} from '../types/run-sheets';

/** What the measured load is checked against: the smallest permitted dimensions, or the plan's when no permit gives them. */
export type DepartureTarget = { heightIn: number; widthIn: number; lengthIn: number; source: 'permit' | 'plan' };

/** The trailer facts the checks need. */
export type DepartureTrailer = { unitNumber: string; hasSlider: boolean; gaugeCalibration: GaugeCalibrationPoint[] };

export type DepartureEvaluation = {
  findings: CheckFinding[];
  gaugeEstimates: DepartureChecksDto['gaugeEstimates'];
  outcome: 'passed' | 'blocked';
};

/** The finding a dispatcher may override with a reason (the weights are known another way); every other blocking finding stays. */
export const OVERRIDABLE_FINDING = 'gauge_differs';

const lbs = (v: number): string => `${Math.round(v).toLocaleString('en-US')} lb`;

/**
 * The driver's departure checks against the run sheet: measured dimensions over the target by more than the
 * tolerance block; far under it asks to check the plan. Unconfirmed pins (on a sliding-axle trailer), tires,
 * markings or permits block. Each gauge reading gives an estimate from the trailer's calibration; one more than
 * GAUGE_PLAN_DIFF_LIMIT off the planned trailer-group weight blocks unless a certified scale weight is recorded
 * for the group. Any blocking finding makes the outcome `blocked`.
 */
export function evaluateDepartureChecks(
  checks: DepartureChecksRequest,
  target: DepartureTarget,
  trailer: DepartureTrailer,
  plannedTrailerLb: number,
): DepartureEvaluation {
  const findings: CheckFinding[] = [];
  const against = target.source === 'permit' ? 'permitted' : 'planned';
  const dims: [string, number, number, number][] = [
    ['height', checks.measuredHeightIn, target.heightIn, DEPARTURE_TOLERANCE_IN.height],
    ['width', checks.measuredWidthIn, target.widthIn, DEPARTURE_TOLERANCE_IN.width],
    ['length', checks.measuredLengthIn, target.lengthIn, DEPARTURE_TOLERANCE_IN.length],
  ];
  for (const [name, measured, planned, tol] of dims) {
    const over = measured - planned;
    if (over > tol) {
      findings.push({
        code: `${name}_over`, blocking: true,
        message: `measured ${name} ${formatFeetInches(measured)} is ${formatFeetInches(over)} over the ${against} ${formatFeetInches(planned)} (tolerance ${tol} in): do not depart; the dispatcher is alerted`,
      });
    } else if (-over > 3 * tol) {
      findings.push({ code: `${name}_under`, blocking: false, message: `measured ${name} ${formatFeetInches(measured)} is well under the ${against} ${formatFeetInches(planned)}: check the plan` });
    }
  }
  if (trailer.hasSlider && !checks.sliderPinsLocked) findings.push({ code: 'pins_unlocked', blocking: true, message: 'sliding-axle pins are not confirmed locked' });
  if (!checks.tiresInflated) findings.push({ code: 'tires', blocking: true, message: 'tires are not confirmed properly inflated' });
  if (!checks.markingsInPlace) findings.push({ code: 'markings', blocking: true, message: 'flags, signs and lamps are not confirmed in place' });
  if (!checks.permitsOnBoard) findings.push({ code: 'permits_on_board', blocking: true, message: 'permits are not confirmed on board' });
  const gaugeEstimates: DepartureChecksDto['gaugeEstimates'] = [];
  for (const g of checks.gaugeReadings) {
    if (trailer.gaugeCalibration.length < 2) {
      findings.push({ code: 'gauge_uncalibrated', blocking: false, message: `trailer ${trailer.unitNumber} has fewer than two calibration readings: no estimate from the gauge` });
      continue;
    }
    const est = estimateAxleLoadFromGauge(g.psi, trailer.gaugeCalibration, { plannedLb: plannedTrailerLb });
    gaugeEstimates.push({ ...est, group: g.group, plannedLb: plannedTrailerLb });
    const diff = est.loadLb - plannedTrailerLb;
    const share = Math.abs(diff) / plannedTrailerLb;
    if (share > GAUGE_PLAN_DIFF_LIMIT) {
      const scale = (checks.scaleWeights ?? []).find((w) => w.group === g.group);
      const what = `gauge estimate ${lbs(est.loadLb)} on the trailer group is ${Math.round(share * 100)} % off the planned ${lbs(plannedTrailerLb)} (limit ${Math.round(GAUGE_PLAN_DIFF_LIMIT * 100)} %, common practice)`;
      findings.push(
        scale
          ? { code: 'gauge_differs_scaled', blocking: false, message: `${what}; certified scale weight recorded: ${lbs(scale.lb)}${scale.ticket ? ` (ticket ${scale.ticket})` : ''}` }
          : { code: OVERRIDABLE_FINDING, blocking: true, message: `${what}: weigh the group on a certified scale and record it, or ask the dispatcher to override with a reason` },
      );
    } else if (share > 0.1) {
      findings.push({ code: 'gauge_note', blocking: false, message: `gauge estimate ${lbs(est.loadLb)} on the trailer group differs from the plan by ${Math.round(diff).toLocaleString('en-US')} lb: ${GAUGE_CAUTION.toLowerCase()}` });
    }
    for (const w of est.warnings) findings.push({ code: 'gauge_warning', blocking: false, message: w });
  }
  return { findings, gaugeEstimates, outcome: findings.some((f) => f.blocking) ? 'blocked' : 'passed' };
}

/** The blocking findings a dispatcher's override cannot clear (anything but a gauge estimate far off the plan). */
export const blockingBeyondOverride = (findings: readonly CheckFinding[]): CheckFinding[] =>
  findings.filter((f) => f.blocking && f.code !== OVERRIDABLE_FINDING);
