import { fixtureRule, known } from './__fixtures__/facts';
import { assessmentDifferences } from './assessment-diff';
import { planCheck } from './plan-check';
import { SAMPLE_PLAN } from './sample-plan';

describe('assessmentDifferences', () => {
  it('is empty for the same rules, and names a state whose escorts and travel hours came on file', () => {
    const blank = fixtureRule('GA', 'Georgia');
    const a = planCheck({ ...SAMPLE_PLAN, rules: [...SAMPLE_PLAN.rules, blank] });
    expect(assessmentDifferences(a, planCheck({ ...SAMPLE_PLAN, rules: [...SAMPLE_PLAN.rules, blank] }))).toEqual([]);
    const filled = fixtureRule('GA', 'Georgia', {
      escorts: { width: known([{ when: { measure: 'width', over: 120 }, roads: ['two-lane', 'multilane', 'interstate'], front: 1, rear: 0 }]), length: known([]) },
      travel: { daylight: known({ startOffsetMin: 0, endOffsetMin: 0 }) },
    });
    const b = planCheck({ ...SAMPLE_PLAN, rules: [...SAMPLE_PLAN.rules, filled] });
    const d = assessmentDifferences(a, b);
    expect(d.some((x) => /^GA: escorts not on file \(at least 0 front, 0 rear\) → 1 front, 0 rear$/.test(x))).toBe(true);
    expect(d.some((x) => x.startsWith('GA: travel windows '))).toBe(true);
    expect(d.some((x) => x.startsWith('GA: answered — Georgia: travel hours not on file'))).toBe(true);
    expect(d.every((x) => x.startsWith('GA:'))).toBe(true);
  });
});
