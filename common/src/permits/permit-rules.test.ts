import type { AssessmentDto } from '../types/moves';
import type { PermittedFacts } from '../types/permits';
import {
  cents, csvCell, factsFromAssessment, instantToLocal, localToInstant, PermitFieldProblem, permittedDifferences, sanitizeFileName, travelSpan, usd, zoneOf,
} from './permit-rules';

describe('zoneOf', () => {
  it.each([
    // source: IANA tz database zones of the states' capitals (tzdata, America/*)
    { code: 'TX', zone: 'America/Chicago' },
    { code: 'CA', zone: 'America/Los_Angeles' },
    { code: 'NY', zone: 'America/New_York' },
    { code: 'CO', zone: 'America/Denver' },
    // common practice, no published source: an unknown code reads in Central time, the desk's home zone
    { code: 'ZZ', zone: 'America/Chicago' },
  ])('$code → $zone', ({ code, zone }) => expect(zoneOf(code)).toBe(zone));
});

describe('localToInstant / instantToLocal', () => {
  it.each([
    // source: IANA tz database (US Central: UTC-6 in winter, UTC-5 in summer; the change on 8 March 2026 at 02:00)
    { local: '2026-12-01T08:00', zone: 'America/Chicago', utc: '2026-12-01T14:00:00.000Z' },
    { local: '2026-07-01T08:00', zone: 'America/Chicago', utc: '2026-07-01T13:00:00.000Z' },
    { local: '2026-12-01T23:59', zone: 'America/Los_Angeles', utc: '2026-12-02T07:59:00.000Z' },
  ])('$local in $zone is $utc and back', ({ local, zone, utc }) => {
    expect(localToInstant(local, zone, 'validFrom').toISOString()).toBe(utc);
    expect(instantToLocal(new Date(utc), zone)).toBe(local);
  });

  it.each([
    // common practice, no published source: the request's value is refused by name, never guessed
    { local: '2026-12-01 08:00', reason: 'must be a local date and time, YYYY-MM-DDTHH:mm' },
    { local: '2026-02-30T08:00', reason: 'is not a real date and time' },
    { local: '2026-12-01T24:00', reason: 'is not a real date and time' },
  ])('refuses $local', ({ local, reason }) => {
    let thrown: unknown;
    try {
      localToInstant(local, 'America/Chicago', 'validTo');
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(PermitFieldProblem);
    expect(thrown).toMatchObject({ field: 'validTo', reason });
  });
});

describe('travelSpan', () => {
  it('runs from local midnight of the first day to local midnight after the last (IANA tz database, US Central)', () => {
    const s = travelSpan(['2026-12-01', '2026-12-02'], 'America/Chicago');
    expect(s.start.toISOString()).toBe('2026-12-01T06:00:00.000Z');
    expect(s.end.toISOString()).toBe('2026-12-03T06:00:00.000Z');
  });
  it('a span across the autumn change is 25 hours a day longer (IANA tz database: 1 November 2026, US Central)', () => {
    const s = travelSpan(['2026-11-01'], 'America/Chicago');
    expect((s.end.getTime() - s.start.getTime()) / 3_600_000).toBe(25);
  });
});

const facts = (over: Partial<PermittedFacts> = {}): PermittedFacts => ({
  widthIn: 168, heightIn: 170, lengthIn: 900, frontOverhangIn: 0, rearOverhangIn: 60, grossLb: 95000, steerLb: 12000, driveLb: 34000, trailerLb: 49000, miles: 120, planRevision: 1, ...over,
});

describe('permittedDifferences', () => {
  it.each([
    // common practice, no published source: half an inch and 100 lb of rounding between the plan and the permit
    { now: {}, out: [] },
    { now: { widthIn: 168.5 }, out: [] },
    { now: { widthIn: 169 }, out: [`width 14'0" permitted, now 14'1"`] },
    { now: { heightIn: 160, widthIn: 150 }, out: [] },
    { now: { grossLb: 95100 }, out: [] },
    { now: { grossLb: 95200 }, out: ['gross 95,000 lb permitted, now 95,200 lb'] },
    { now: { miles: 120.4 }, out: [] },
    { now: { miles: 131 }, out: ['route in the state 120 mi permitted, now 131 mi'] },
  ])('plan now $now → $out', ({ now, out }) => {
    expect(permittedDifferences(facts(), facts(now))).toEqual(out);
  });
});

describe('factsFromAssessment', () => {
  it('rounds dimensions to a tenth of an inch and weights to the pound, with the state miles (common practice, no published source)', () => {
    const a = {
      result: {
        dimensions: { widthIn: 168.04, heightIn: 170.06, lengthIn: 900, frontOverhangIn: 0, rearOverhangIn: 60.01 },
        axleLoads: { grossLb: 95000.4, steerLb: 12000.6, driveLb: 34000, trailerLb: 49000 },
        jurisdictions: [{ code: 'TX', miles: 120.04 }],
      },
    } as unknown as AssessmentDto;
    expect(factsFromAssessment(a, 'TX', 3)).toEqual(facts({ heightIn: 170.1, grossLb: 95000, steerLb: 12001, miles: 120, planRevision: 3 }));
    expect(factsFromAssessment(a, 'OK', 3).miles).toBe(0);
  });
});

describe('sanitizeFileName', () => {
  it.each([
    // common practice, no published source (OWASP file upload cheat sheet: keep the last path part, a safe set)
    { raw: 'TX permit.pdf', out: 'TX permit.pdf' },
    { raw: '../../etc/passwd', out: 'passwd.pdf' },
    { raw: 'C:\\scans\\OK-123.PDF', out: 'OK-123.PDF' },
    { raw: 'permis d’état.pdf', out: 'permis d_tat.pdf' },
    { raw: `${'a'.repeat(200)}.pdf`, out: `${'a'.repeat(116)}.pdf` },
  ])('$raw → $out', ({ raw, out }) => expect(sanitizeFileName(raw)).toBe(out));

  it.each([{ raw: 'bad\u0000name.pdf' }, { raw: '...' }, { raw: undefined }])('refuses $raw for the field file', ({ raw }) => {
    expect(() => sanitizeFileName(raw)).toThrow(PermitFieldProblem);
  });
});

describe('csvCell, usd, cents', () => {
  it.each([
    // source: RFC 4180 (quotes doubled inside a quoted field); OWASP CSV injection (leading = + - @ neutralised)
    { v: 'plain', out: 'plain' },
    { v: 'a,b', out: '"a,b"' },
    { v: 'say "hi"', out: '"say ""hi"""' },
    { v: '=SUM(A1)', out: "'=SUM(A1)" },
    { v: null, out: '' },
    { v: 12.5, out: '12.5' },
  ])('csvCell($v) → $out', ({ v, out }) => expect(csvCell(v)).toBe(out));

  it('dollars and cents round to the cent (common practice, no published source)', () => {
    expect(cents(12.345)).toBe(1235);
    expect(cents(0.1 + 0.2)).toBe(30);
    expect(usd(1235)).toBe(12.35);
    expect(usd(null)).toBeNull();
  });
});
