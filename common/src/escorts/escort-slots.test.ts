import { answerWarnings, bookingWarnings, escortCoverage, requiredEscortSlots, vendorWarnings, type BookingCover, type EscortNeed, type VendorFacts } from './escort-slots';

const src = { code: 'escort-width', message: 'width 15 ft over 14 ft → 1 front', source: 'TxDMV "Escort and Equipment Requirements"' };
const need = (code: string, front: number, rear: number, heightPole = false): EscortNeed => ({
  code,
  name: code,
  escorts: { front, rear, heightPole, heightPoleSetIn: heightPole ? 200 : null, reasons: [src] },
});

describe('requiredEscortSlots', () => {
  // positions follow the rulebook counts; TxDMV: height over 17 ft → 1 front with height pole (references.md §4)
  it.each([
    ['no escort anywhere', [need('TX', 0, 0)], []],
    ['one front in one state', [need('TX', 1, 0)], ['lead:1=TX']],
    ['front with pole and a rear', [need('TX', 1, 1, true)], ['height_pole:1=TX', 'chase:1=TX']],
    ['two front, pole on the first', [need('VA', 2, 1, true)], ['height_pole:1=VA', 'lead:1=VA', 'chase:1=VA']],
    ['same seat across states merges', [need('TX', 1, 0), need('OK', 2, 1)], ['lead:1=TX,OK', 'lead:2=OK', 'chase:1=OK']],
  ])('%s', (_l, needs, expected) => {
    const slots = requiredEscortSlots(needs);
    expect(slots.map((s) => `${s.position}:${s.seat}=${s.jurisdictions.map((j) => j.code).join(',')}`)).toEqual(expected);
  });

  it('keeps the highest height-pole setting', () => {
    const a = need('TX', 1, 0, true);
    const b = { ...need('OK', 1, 0, true), escorts: { ...need('OK', 1, 0, true).escorts, heightPoleSetIn: 215 } };
    expect(requiredEscortSlots([a, b])[0].heightPoleSetIn).toBe(215);
  });
});

describe('escortCoverage', () => {
  const slots = requiredEscortSlots([need('TX', 1, 0), need('OK', 1, 0)]);
  const b = (over: Partial<BookingCover>): BookingCover => ({
    id: 'b1', position: 'lead', seat: 1, jurisdictions: ['TX', 'OK'], status: 'confirmed', startDate: '2027-03-01', endDate: '2027-03-02', vendor: 'V', ...over,
  });
  const days = ['2027-03-01', '2027-03-02'];

  it('a confirmed booking over all travel days satisfies the slot', () => {
    expect(escortCoverage(slots, [b({})], days)[0].satisfied).toBe(true);
  });
  it('a declined booking leaves the slot open', () => {
    const c = escortCoverage(slots, [b({ status: 'declined' })], days)[0];
    expect(c.satisfied).toBe(false);
    expect(c.jurisdictions.map((j) => j.status)).toEqual(['open', 'open']);
  });
  it('a booking for TX only leaves OK open', () => {
    const c = escortCoverage(slots, [b({ jurisdictions: ['TX'] })], days)[0];
    expect(c.jurisdictions.map((j) => j.status)).toEqual(['confirmed', 'open']);
  });
  it('a confirmation for other dates does not count', () => {
    expect(escortCoverage(slots, [b({ startDate: '2027-02-20', endDate: '2027-02-20' })], days)[0].satisfied).toBe(false);
  });
  it('prefers confirmed over requested', () => {
    const c = escortCoverage(slots, [b({ id: 'r', status: 'requested' }), b({ id: 'c' })], days)[0];
    expect(c.jurisdictions[0]).toMatchObject({ status: 'confirmed', bookingId: 'c' });
  });
});

describe('bookingWarnings (certification list is sample data)', () => {
  const vendor = (over: Partial<VendorFacts> = {}): VendorFacts => ({
    company: 'Prairie Lantern Escorts',
    states: ['TX', 'OK'],
    operators: [{ name: 'Dana Ruel', certifications: [{ state: 'OK', number: 'OK-1', expires: '2027-12-31' }] }],
    vehicles: [{ label: 'Pickup 1', equipment: { heightPole: false, amberLights: true, signs: true, flags: true } }],
    insurance: { liabilityLimitUsd: 1_000_000, expires: '2027-12-31' },
    ...over,
  });
  it('no warning when the certificate is held and valid', () => {
    expect(bookingWarnings(vendor(), 'lead', ['TX', 'OK'], '2027-03-02')).toEqual([]);
  });
  it('warns when a state that asks for a certificate has none', () => {
    expect(bookingWarnings(vendor(), 'lead', ['OK', 'UT'], '2027-03-02')).toEqual([expect.stringMatching(/Utah asks for an escort certificate/)]);
  });
  it('warns when the certificate lapses before the run ends', () => {
    const v = vendor({ operators: [{ name: 'Dana Ruel', certifications: [{ state: 'OK', number: 'OK-1', expires: '2027-03-01' }] }] });
    expect(bookingWarnings(v, 'lead', ['OK'], '2027-03-02')).toEqual([expect.stringMatching(/Oklahoma escort certificate of Dana Ruel \(OK-1\) expires 2027-03-01/)]);
  });
  it('warns about insurance, a missing pole and missing markings', () => {
    const v = vendor({ insurance: { liabilityLimitUsd: 1, expires: '2027-01-01' }, vehicles: [] });
    expect(bookingWarnings(v, 'height_pole', ['TX'], '2027-03-02')).toEqual([
      expect.stringMatching(/insurance .* expires 2027-01-01/),
      expect.stringMatching(/no vehicle with a height pole/),
      expect.stringMatching(/no vehicle with amber lights/),
    ]);
  });
  it('answerWarnings names states whose certificate number is missing', () => {
    expect(answerWarnings(['TX', 'OK', 'UT'], [{ state: 'OK', number: 'OK-1' }])).toEqual([expect.stringMatching(/Utah/)]);
  });
  it('vendorWarnings lists lapsed papers', () => {
    expect(vendorWarnings(vendor(), '2028-01-01')).toEqual(['insurance expired 2027-12-31', 'Dana Ruel: Oklahoma certificate expired 2027-12-31']);
  });
});
