/**
 * Times one full plan check: a 9-axle combination with all its bridge groups, securement of 3 articles,
 * markings, and travel windows for 10 jurisdictions × 5 days. Prints p50 and p95.
 */
import { clearTimeZoneCache } from '../engine/time-zone';
import { planCheck } from '../engine/plan-check';
import { SAMPLE_PLAN } from '../engine/sample-plan';

function percentile(sorted: number[], p: number): number {
  const i = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[i];
}

function run(label: string, iterations: number, before?: () => void): void {
  const times: number[] = [];
  for (let i = 0; i < iterations; i++) {
    before?.();
    const t0 = performance.now();
    planCheck(SAMPLE_PLAN);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  console.log(`${label}: p50 ${percentile(times, 50).toFixed(3)} ms, p95 ${percentile(times, 95).toFixed(3)} ms (${iterations} runs)`);
}

const check = planCheck(SAMPLE_PLAN);
const groups = check.federal.groups.filter((g) => g.rule !== 'single' && g.rule !== 'gross').length;
const windows = check.jurisdictions.reduce((s, j) => s + j.travel.length, 0);
console.log(
  `plan check: ${check.axles.length} axles, ${groups} axle groups, ${check.securement.length} articles, ` +
    `${check.jurisdictions.length} jurisdictions, ${windows} travel windows`,
);
for (let i = 0; i < 300; i++) planCheck(SAMPLE_PLAN); // warm-up (JIT)
run('full plan check', 2000);
run('full plan check, cold time-zone offset cache', 1000, clearTimeZoneCache);
