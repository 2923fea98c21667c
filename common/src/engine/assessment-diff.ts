/** What changes between two assessments of the same move (e.g. kept rule versions versus the current ones), in words. */
import { formatUsd } from './units';
import type { PlanCheckResult } from './plan-check';

const escortWords = (e: { front: number; rear: number; known: boolean }): string => (e.known ? `${e.front} front, ${e.rear} rear` : `not on file (at least ${e.front} front, ${e.rear} rear)`);
const feeWords = (f: PlanCheckResult['jurisdictions'][number]['fee']): string => (f === null ? 'no permit' : f.known ? formatUsd(f.totalUsd) : 'not on file');
const windowsWords = (days: PlanCheckResult['jurisdictions'][number]['travel']): string =>
  days.map((d) => `${d.date} ${d.intervals.length ? d.intervals.map((i) => `${i.startLocal}–${i.endLocal}`).join(', ') : 'no travel'}${d.known ? '' : ' (not all on file)'}`).join('; ');

/**
 * One line per difference: a state added or dropped, permit need, superload, escorts, fee, travel windows, open
 * questions, and problems found or gone. Empty when nothing a user acts on changes.
 */
export function assessmentDifferences(before: PlanCheckResult, after: PlanCheckResult): string[] {
  const out: string[] = [];
  const was = new Map(before.jurisdictions.map((j) => [j.code, j]));
  for (const j of after.jurisdictions) {
    const b = was.get(j.code);
    if (!b) {
      out.push(`${j.code}: newly assessed`);
      continue;
    }
    if (b.permitRequired !== j.permitRequired) out.push(`${j.code}: permit ${j.permitRequired ? 'now needed' : 'no longer needed'}`);
    if (b.superload.isSuperload !== j.superload.isSuperload) out.push(`${j.code}: ${j.superload.isSuperload ? 'now a superload' : 'no longer a superload'}`);
    const e0 = escortWords(b.escorts);
    const e1 = escortWords(j.escorts);
    if (e0 !== e1) out.push(`${j.code}: escorts ${e0} → ${e1}`);
    const f0 = feeWords(b.fee);
    const f1 = feeWords(j.fee);
    if (f0 !== f1) out.push(`${j.code}: fee ${f0} → ${f1}`);
    const w0 = windowsWords(b.travel);
    const w1 = windowsWords(j.travel);
    if (w0 !== w1) out.push(`${j.code}: travel windows ${w0} → ${w1}`);
    const q0 = new Set(b.openQuestions.map((q) => q.message));
    const q1 = new Set(j.openQuestions.map((q) => q.message));
    for (const q of q1) if (!q0.has(q)) out.push(`${j.code}: new open question — ${q}`);
    for (const q of q0) if (!q1.has(q)) out.push(`${j.code}: answered — ${q}`);
  }
  const now = new Set(after.jurisdictions.map((j) => j.code));
  for (const j of before.jurisdictions) if (!now.has(j.code)) out.push(`${j.code}: no longer assessed`);
  const p0 = new Set(before.summary.problems);
  const p1 = new Set(after.summary.problems);
  for (const p of p1) if (!p0.has(p)) out.push(`new problem: ${p}`);
  for (const p of p0) if (!p1.has(p)) out.push(`problem gone: ${p}`);
  return out;
}
