import { fixtureRule, known } from './__fixtures__/facts';
import { validateJurisdictionRule } from './validate-rule';

const good = () =>
  JSON.parse(
    JSON.stringify(
      fixtureRule('VA', 'Virginia', {
        legal: { widthIn: known(102) },
        escorts: { width: known([{ when: { measure: 'width', over: 144 }, roads: ['two-lane'], front: 1, rear: 1 }]) },
        travel: {
          curfews: known([{ area: 'Richmond', start: '07:00', end: '09:00', appliesIn: 'urban' }]),
          holidays: known({ names: ['memorial-day'], from: 'noon-weekday-before', observance: 'observed' }),
        },
        fee: known({ baseUsd: 20 }),
      }),
    ),
  );

describe('validateJurisdictionRule', () => {
  it('a well-formed record (after a JSON round trip) passes', () => {
    expect(() => validateJurisdictionRule(good())).not.toThrow();
  });

  it('a curfew that crosses midnight (22:00–05:00) is valid; one that starts and ends at the same time is not', () => {
    const r = good();
    r.travel.curfews.value[0] = { area: 'Richmond', start: '22:00', end: '05:00', appliesIn: 'urban', days: [5, 6] };
    expect(() => validateJurisdictionRule(r)).not.toThrow();
    r.travel.curfews.value[0].end = '22:00';
    expect(() => validateJurisdictionRule(r)).toThrow(/rule.travel.curfews.value\[0\].end must differ from the start/);
  });

  it.each([
    // a value with no source
    [(r: any) => delete r.legal.widthIn.citation, /rule.legal.widthIn.citation must be a non-empty string/],
    [(r: any) => delete r.legal.widthIn.url, /rule.legal.widthIn.url must be a non-empty string/],
    [(r: any) => (r.legal.widthIn.url = 'not a url'), /rule.legal.widthIn.url must be an http\(s\) URL/],
    [(r: any) => delete r.fee.edition, /rule.fee.edition must be a non-empty string/],
    // an unknown status with a value
    [(r: any) => (r.legal.heightIn = { status: 'unknown', note: 'x', value: 162 }), /rule.legal.heightIn.value must be absent when the status is unknown/],
    [(r: any) => (r.legal.heightIn = { status: 'unknown' }), /rule.legal.heightIn.note must be a non-empty string/],
    [(r: any) => (r.legal.heightIn.status = 'guessed'), /rule.legal.heightIn.status must be/],
    // negative or absurd limits
    [(r: any) => (r.legal.widthIn.value = -1), /rule.legal.widthIn.value must be at least 72/],
    [(r: any) => (r.legal.widthIn.value = 1e9), /absurd/],
    [(r: any) => (r.fee.value.baseUsd = 'ten'), /rule.fee.value.baseUsd must be a finite number/],
    // a curfew with no area
    [(r: any) => delete r.travel.curfews.value[0].area, /rule.travel.curfews.value\[0\].area must be a non-empty string/],
    [(r: any) => (r.travel.curfews.value[0].start = '7am'), /rule.travel.curfews.value\[0\].start must be a HH:MM time/],
    // an unknown holiday name
    [(r: any) => (r.travel.holidays.value.names = ['arbor-day']), /rule.travel.holidays.value.names\[0\] must be one of/],
    // impossible calendar dates
    [(r: any) => (r.fee.asOf = '2026-02-30'), /rule.fee.asOf is not a real calendar date/],
    [(r: any) => (r.asOf = '2026-W49-3'), /rule.asOf must be a YYYY-MM-DD date/],
    [(r: any) => (r.escorts.width.value[0].roads = ['gravel']), /rule.escorts.width.value\[0\].roads must list road types/],
    [(r: any) => delete r.escorts.width.value[0].when.over, /rule.escorts.width.value\[0\].when must give "over" or "atLeast"/],
    [(r: any) => (r.escorts.width.value[0].when.measure = 'height'), /rule.escorts.width.value\[0\].when.measure must be width/],
    [(r: any) => delete r.travel.daylight, /rule.travel.daylight must be an object/],
  ])('bad record → RangeError naming the field (%#)', (mutate, msg) => {
    const r = good();
    mutate(r);
    expect(() => validateJurisdictionRule(r)).toThrow(RangeError);
    expect(() => validateJurisdictionRule(r)).toThrow(msg);
  });
});
