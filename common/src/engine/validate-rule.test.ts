import { SAMPLE_RULES, SAMPLE_RULE_TX } from './rulebook-samples';
import { validateJurisdictionRule } from './validate-rule';

const clone = () => JSON.parse(JSON.stringify(SAMPLE_RULE_TX));

describe('validateJurisdictionRule', () => {
  it.each(Object.keys(SAMPLE_RULES))('the %s record (after a JSON round trip) is well formed', (code) => {
    expect(() => validateJurisdictionRule(JSON.parse(JSON.stringify(SAMPLE_RULES[code])))).not.toThrow();
  });

  it.each([
    [(r: any) => (r.legal.widthIn = -1), /rule.legal.widthIn must be at least 0/],
    [(r: any) => (r.legal.grossLb = 'heavy'), /rule.legal.grossLb must be a finite number/],
    [(r: any) => (r.escorts.rules[0].roads = ['gravel']), /rule.escorts.rules\[0\].roads must list road types/],
    [(r: any) => delete r.escorts.rules[2].when.over, /rule.escorts.rules\[2\].when must give "over" or "atLeast"/],
    [(r: any) => (r.travel.curfews[0].start = '7am'), /rule.travel.curfews\[0\].start must be a HH:MM time/],
    [(r: any) => (r.travel.holidays.names = ['arbor-day']), /rule.travel.holidays.names\[0\] must be one of/],
    [(r: any) => delete r.fee.source.asOf, /rule.fee.source.asOf must be a YYYY-MM-DD date/],
    [(r: any) => (r.legal.widthIn = 1e9), /absurd/],
  ])('bad record → RangeError naming the field (%#)', (mutate, msg) => {
    const r = clone();
    mutate(r);
    expect(() => validateJurisdictionRule(r)).toThrow(RangeError);
    expect(() => validateJurisdictionRule(r)).toThrow(msg);
  });
});
