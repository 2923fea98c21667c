import fc from 'fast-check';
import { axleGroupLoads, combinationAxles, suggestSliderPosition, type AxleGroupLoadsInput } from './axle-group-loads';

const tractor = { steerTareLb: 10_000, driveTareLb: 9_000, wheelbaseFt: 20, fifthWheelAheadOfDriveFt: 1 };
const trailer = { tareLb: 14_000, tareCgFromKingpinFt: 20, axleGroupFromKingpinFt: 40 };

describe('axleGroupLoads (static equilibrium, textbook statics)', () => {
  it('textbook statics: hand-worked example', () => {
    // Trailer moments about the kingpin: 14,000 × 20 + 30,000 × 25 = 1,030,000 → trailer group 25,750;
    // kingpin 44,000 − 25,750 = 18,250; steer share 1/20 → 912.5; drive 17,337.5.
    const r = axleGroupLoads({ tractor, trailer, loads: [{ weightLb: 30_000, cgFromKingpinFt: 25 }] });
    expect(r.trailerLb).toBeCloseTo(25_750, 6);
    expect(r.kingpinLb).toBeCloseTo(18_250, 6);
    expect(r.steerLb).toBeCloseTo(10_912.5, 6);
    expect(r.driveLb).toBeCloseTo(26_337.5, 6);
    expect(r.grossLb).toBe(63_000);
    expect(r.warnings).toEqual([]);
    expect(r.caution).toMatch(/planning aid/i);
  });

  it('textbook statics: a load behind the axle group lifts the kingpin (warning)', () => {
    const r = axleGroupLoads({ tractor, trailer, loads: [{ weightLb: 60_000, cgFromKingpinFt: 55 }] });
    expect(r.kingpinLb).toBeLessThan(0);
    expect(r.warnings[0]).toMatch(/kingpin load is negative/);
  });

  const inputArb = fc.record({
    steer: fc.integer({ min: 6_000, max: 14_000 }),
    drive: fc.integer({ min: 6_000, max: 20_000 }),
    wb: fc.double({ min: 12, max: 30, noNaN: true }),
    fw: fc.double({ min: -1, max: 3, noNaN: true }),
    tare: fc.integer({ min: 8_000, max: 60_000 }),
    tareCg: fc.double({ min: 5, max: 40, noNaN: true }),
    axle: fc.double({ min: 20, max: 60, noNaN: true }),
    loads: fc.array(fc.record({ weightLb: fc.integer({ min: 1, max: 150_000 }), cgFromKingpinFt: fc.double({ min: -5, max: 70, noNaN: true }) }), {
      minLength: 1,
      maxLength: 5,
    }),
  });
  it('property (textbook statics): the group loads always add up to the total weight', () => {
    fc.assert(
      fc.property(inputArb, (v) => {
        const input: AxleGroupLoadsInput = {
          tractor: { steerTareLb: v.steer, driveTareLb: v.drive, wheelbaseFt: v.wb, fifthWheelAheadOfDriveFt: v.fw },
          trailer: { tareLb: v.tare, tareCgFromKingpinFt: v.tareCg, axleGroupFromKingpinFt: v.axle },
          loads: v.loads,
        };
        const r = axleGroupLoads(input);
        const total = v.steer + v.drive + v.tare + v.loads.reduce((s, l) => s + l.weightLb, 0);
        expect(r.grossLb).toBe(total);
        expect(r.steerLb + r.driveLb + r.trailerLb).toBeCloseTo(total, 4);
      }),
    );
  });

  it('property (textbook statics): moving the load rearward never lowers the trailer group', () => {
    fc.assert(
      fc.property(inputArb, fc.double({ min: 0, max: 20, noNaN: true }), fc.nat({ max: 4 }), (v, shift, which) => {
        const base: AxleGroupLoadsInput = {
          tractor: { steerTareLb: v.steer, driveTareLb: v.drive, wheelbaseFt: v.wb, fifthWheelAheadOfDriveFt: v.fw },
          trailer: { tareLb: v.tare, tareCgFromKingpinFt: v.tareCg, axleGroupFromKingpinFt: v.axle },
          loads: v.loads,
        };
        const i = which % v.loads.length;
        const moved = { ...base, loads: base.loads.map((l, j) => (j === i ? { ...l, cgFromKingpinFt: l.cgFromKingpinFt + shift } : l)) };
        expect(axleGroupLoads(moved).trailerLb).toBeGreaterThanOrEqual(axleGroupLoads(base).trailerLb - 1e-6);
      }),
    );
  });

  it.each([
    [{ tractor: { ...tractor, wheelbaseFt: 0 }, trailer, loads: [] }, /tractor.wheelbaseFt must be greater than 0/],
    [{ tractor, trailer: { ...trailer, axleGroupFromKingpinFt: -3 }, loads: [] }, /trailer.axleGroupFromKingpinFt/],
    [{ tractor, trailer, loads: [{ weightLb: -10, cgFromKingpinFt: 3 }] }, /loads\[0\].weightLb must be at least 0/],
    [{ tractor, trailer, loads: [{ weightLb: 10, cgFromKingpinFt: Number.NaN }] }, /loads\[0\].cgFromKingpinFt must be a finite number/],
    [{ tractor: { ...tractor, steerTareLb: 1e9 }, trailer, loads: [] }, /absurd/],
  ])('bad input → RangeError (%#)', (input, msg) => {
    expect(() => axleGroupLoads(input as AxleGroupLoadsInput)).toThrow(RangeError);
    expect(() => axleGroupLoads(input as AxleGroupLoadsInput)).toThrow(msg);
  });
});

describe('combinationAxles and suggestSliderPosition', () => {
  const layout = { driveAxleOffsetsFt: [-2.25, 2.25], trailerAxleOffsetsFt: [-2.25, 2.25] };

  it('textbook statics: axles placed from the steer axle, group load shared equally', () => {
    const axles = combinationAxles({ steerLb: 12_000, driveLb: 34_000, trailerLb: 34_000 }, tractor, trailer, layout);
    expect(axles.map((a) => a.positionFt)).toEqual([0, 17.75, 22.25, 56.75, 61.25]);
    expect(axles.map((a) => a.weightLb)).toEqual([12_000, 17_000, 17_000, 17_000, 17_000]);
  });

  it('23 U.S.C. 127 with statics: finds the most balanced legal slider hole', () => {
    const r = suggestSliderPosition({
      tractor: { ...tractor, steerTareLb: 11_000, driveTareLb: 8_000 },
      trailer: { tareLb: 12_000, tareCgFromKingpinFt: 22, axleGroupFromKingpinFt: 38 },
      loads: [{ weightLb: 44_000, cgFromKingpinFt: 22 }],
      slider: { minFromKingpinFt: 30, maxFromKingpinFt: 40, holeSpacingIn: 6 },
      layout,
    });
    expect(r.candidates).toHaveLength(21);
    expect(r.found).toBe(true);
    expect(r.best!.ok).toBe(true);
    for (const c of r.candidates.filter((x) => x.ok)) expect(c.utilisation).toBeGreaterThanOrEqual(r.best!.utilisation);
    expect(r.message).toMatch(/behind the kingpin/);
  });

  it('23 U.S.C. 127 with statics: says so when no setting is legal', () => {
    const r = suggestSliderPosition({
      tractor,
      trailer,
      loads: [{ weightLb: 90_000, cgFromKingpinFt: 20 }],
      slider: { minFromKingpinFt: 30, maxFromKingpinFt: 40, holeSpacingIn: 12 },
    });
    expect(r.found).toBe(false);
    expect(r.best).toBeNull();
    expect(r.message).toMatch(/no slider setting/);
  });

  it('bad slider range → RangeError', () => {
    expect(() =>
      suggestSliderPosition({ tractor, trailer, loads: [], slider: { minFromKingpinFt: 40, maxFromKingpinFt: 30, holeSpacingIn: 6 } }),
    ).toThrow(/slider.maxFromKingpinFt must be at least 40/);
  });
});
