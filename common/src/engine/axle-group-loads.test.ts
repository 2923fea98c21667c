import fc from 'fast-check';
import { axleGroupLoads, combinationAxleList, combinationAxles, suggestCombinationSettings, suggestSliderPosition, type AxleGroupLoadsInput } from './axle-group-loads';

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

describe('axleGroupLoads: jeep + trailer + booster (textbook statics, hand-worked)', () => {
  // One combination, positions in ft behind the steer axle.
  // Tractor: steer tare 12,000 at 0; drive tare 18,000, tandem 4.5 ft apart centered at the 20 ft wheelbase;
  //   fifth wheel 1 ft ahead of the drive center → 19 ft.
  // Jeep: pin in the tractor's fifth wheel (19 ft); tare 8,000 at 6 ft behind the pin; its fifth wheel 8 ft behind the
  //   pin (kingpin at 27 ft); tandem 4.5 ft apart centered 10 ft behind the pin (29 ft).
  // Trailer: tare 40,000 at 25 ft behind the kingpin; load 100,000 at 30 ft; tridem 5 ft apart centered 50 ft behind
  //   the kingpin (axles 45, 50, 55 ft behind it).
  // Booster: pin 60 ft behind the kingpin; tare 10,000 at 8 ft behind the pin (68 ft behind the kingpin); tandem 5 ft
  //   apart centered 15 ft behind the pin (axles 72.5, 77.5 ft behind the kingpin).
  const tractor = {
    steerTareLb: 12_000,
    driveTareLb: 18_000,
    wheelbaseFt: 20,
    fifthWheelAheadOfDriveFt: 1,
    steerGroup: { axleCount: 1, tires: { size: '11R22.5', count: 2 } },
    driveGroup: { axleCount: 2, spacingFt: 4.5, tires: { size: '11R22.5', count: 4 } },
  };
  const jeep = { tareLb: 8_000, tareCgBehindPinFt: 6, fifthWheelBehindPinFt: 8, axleGroupBehindPinFt: 10, group: { axleCount: 2, spacingFt: 4.5 } };
  const trailer = { tareLb: 40_000, tareCgFromKingpinFt: 25, axleGroupFromKingpinFt: 50, group: { axleCount: 3, spacingFt: 5 } };
  const booster = { tareLb: 10_000, pinFromKingpinFt: 60, tareCgBehindPinFt: 8, axleGroupBehindPinFt: 15, group: { axleCount: 2, spacingFt: 5 } };
  const loads = [{ weightLb: 100_000, cgFromKingpinFt: 30 }];
  const group = (r: ReturnType<typeof axleGroupLoads>, key: string) => r.groups.find((g) => g.key === key)!;

  it('textbook statics: booster set to equalize — every trailer and booster axle carries the same load', () => {
    // Trailer + booster, moments about the kingpin: 40,000 × 25 + 100,000 × 30 + 10,000 × 68 = 4,680,000 lb·ft.
    // The five equalized axles (45, 50, 55, 72.5, 77.5 ft behind the kingpin) have their center at 300 / 5 = 60 ft:
    //   they carry 4,680,000 / 60 = 78,000, i.e. 15,600 per axle → trailer tridem 46,800, booster 31,200.
    // Kingpin: 40,000 + 100,000 + 10,000 − 78,000 = 72,000.
    // Booster pin: 31,200 − 10,000 (its tare) = 21,200 from the trailer; moment 31,200 × 15 − 10,000 × 8 = 388,000 lb·ft.
    // Jeep, moments about its pin: axles × 10 = 72,000 × 8 + 8,000 × 6 = 624,000 → 62,400; pin 72,000 + 8,000 − 62,400 = 17,600.
    // Tractor, moments about the steer axle: drive × 20 = 18,000 × 20 + 17,600 × 19 = 694,400 → 34,720;
    //   steer 12,000 + 18,000 + 17,600 − 34,720 = 12,880.
    // Total 12,000 + 18,000 + 8,000 + 40,000 + 10,000 + 100,000 = 188,000 = 12,880 + 34,720 + 62,400 + 46,800 + 31,200.
    const r = axleGroupLoads({ tractor, jeep, trailer, booster, loads });
    expect(r.kingpinLb).toBeCloseTo(72_000, 6);
    expect(r.trailerLb).toBeCloseTo(46_800, 6);
    expect(r.boosterLb).toBeCloseTo(31_200, 6);
    expect(r.boosterPinLb).toBeCloseTo(21_200, 6);
    expect(r.boosterPinMomentLbFt).toBeCloseTo(388_000, 6);
    expect(r.jeepLb).toBeCloseTo(62_400, 6);
    expect(r.jeepPinLb).toBeCloseTo(17_600, 6);
    expect(r.fifthWheelLb).toBeCloseTo(17_600, 6);
    expect(r.driveLb).toBeCloseTo(34_720, 6);
    expect(r.steerLb).toBeCloseTo(12_880, 6);
    expect(r.grossLb).toBe(188_000);
    expect(r.balance.ok).toBe(true);
    expect(r.balance.sumOfGroupsLb).toBeCloseTo(188_000, 6);
    expect(r.groups.map((g) => g.key)).toEqual(['steer', 'drive', 'jeep', 'trailer', 'booster']);
    expect(group(r, 'trailer').axles.map((a) => a.weightLb)).toEqual([15_600, 15_600, 15_600].map((x) => expect.closeTo(x, 6)));
    expect(group(r, 'booster').axles.map((a) => a.positionFt)).toEqual([99.5, 104.5]);
    expect(group(r, 'jeep').axles.map((a) => a.weightLb)).toEqual([31_200, 31_200].map((x) => expect.closeTo(x, 6)));
    expect(r.warnings).toEqual([]);
  });

  it('textbook statics: booster set to a 15,000 lb pin load', () => {
    // Booster axles: 15,000 + 10,000 tare = 25,000 at 75 ft behind the kingpin.
    // Trailer, moments about the kingpin: tridem × 50 + 25,000 × 75 = 4,680,000 → tridem 2,805,000 / 50 = 56,100.
    // Kingpin 150,000 − 56,100 − 25,000 = 68,900. Booster pin moment 25,000 × 15 − 10,000 × 8 = 295,000 lb·ft.
    // Jeep: axles × 10 = 68,900 × 8 + 48,000 = 599,200 → 59,920; pin 68,900 + 8,000 − 59,920 = 16,980.
    // Tractor: drive × 20 = 360,000 + 16,980 × 19 = 682,620 → 34,131; steer 30,000 + 16,980 − 34,131 = 12,849.
    // Sum 12,849 + 34,131 + 59,920 + 56,100 + 25,000 = 188,000.
    const r = axleGroupLoads({ tractor, jeep, trailer, booster: { ...booster, pinLoadLb: 15_000 }, loads });
    expect(r.boosterLb).toBeCloseTo(25_000, 6);
    expect(r.boosterPinLb).toBeCloseTo(15_000, 6);
    expect(r.boosterPinMomentLbFt).toBeCloseTo(295_000, 6);
    expect(r.trailerLb).toBeCloseTo(56_100, 6);
    expect(r.kingpinLb).toBeCloseTo(68_900, 6);
    expect(r.jeepLb).toBeCloseTo(59_920, 6);
    expect(r.jeepPinLb).toBeCloseTo(16_980, 6);
    expect(r.driveLb).toBeCloseTo(34_131, 6);
    expect(r.steerLb).toBeCloseTo(12_849, 6);
    expect(r.balance.ok).toBe(true);
  });

  it('textbook statics: a lift axle that is up carries nothing and moves its group center', () => {
    // No jeep or booster. Trailer tare 40,000 at 25 ft, load 65,000 at 25 ft: moments 2,625,000 lb·ft.
    // Tridem 45 / 50 / 55 ft behind the kingpin with the front axle up: the two axles down center at 52.5 ft →
    //   2,625,000 / 52.5 = 50,000 (25,000 each, 0 on the lift axle); kingpin 105,000 − 50,000 = 55,000.
    // Tractor: drive × 20 = 360,000 + 55,000 × 19 = 1,405,000 → 70,250; steer 30,000 + 55,000 − 70,250 = 14,750.
    // All three down: center 50 ft → 52,500 on the tridem, 52,500 on the kingpin.
    const lift = { ...trailer, group: { axleCount: 3, spacingFt: 5, liftAxles: [{ index: 0, up: true }] } };
    const r = axleGroupLoads({ tractor, trailer: lift, loads: [{ weightLb: 65_000, cgFromKingpinFt: 25 }] });
    expect(r.trailerLb).toBeCloseTo(50_000, 6);
    expect(r.kingpinLb).toBeCloseTo(55_000, 6);
    expect(r.driveLb).toBeCloseTo(70_250, 6);
    expect(r.steerLb).toBeCloseTo(14_750, 6);
    const t = group(r, 'trailer');
    expect(t.axleCount).toBe(2);
    expect(t.liftedCount).toBe(1);
    expect(t.spreadFt).toBe(5);
    expect(t.axles.map((a) => [a.weightLb, a.lifted])).toEqual([
      [0, true],
      [25_000, false],
      [25_000, false],
    ]);
    const down = axleGroupLoads({ tractor, trailer, loads: [{ weightLb: 65_000, cgFromKingpinFt: 25 }] });
    expect(down.trailerLb).toBeCloseTo(52_500, 6);
    expect(down.kingpinLb).toBeCloseTo(52_500, 6);
  });

  it('textbook statics: two trailer groups share the load per axle down (one interconnected suspension)', () => {
    // Trailer tare 40,000 at 25 ft, load 100,000 at 30 ft → 4,000,000 lb·ft about the kingpin.
    // Tandem centered 40 ft (38, 42) and tridem centered 55 ft (50, 55, 60): five axles, center 245 / 5 = 49 ft →
    //   4,000,000 / 49 = 81,632.65 on the trailer's axles, 16,326.53 each → tandem 32,653.06, tridem 48,979.59.
    const r = axleGroupLoads({
      tractor,
      trailer: { ...trailer, axleGroupFromKingpinFt: 40, group: { axleCount: 2, spacingFt: 4 }, moreGroups: [{ centerFromKingpinFt: 55, axleCount: 3, spacingFt: 5 }] },
      loads,
    });
    expect(r.trailerLb).toBeCloseTo(4_000_000 / 49, 6);
    expect(group(r, 'trailer').loadLb).toBeCloseTo((2 * 4_000_000) / 49 / 5, 6);
    expect(group(r, 'trailer-2').loadLb).toBeCloseTo((3 * 4_000_000) / 49 / 5, 6);
    expect(r.balance.ok).toBe(true);
  });

  it('textbook statics: a jeep fifth wheel set behind its axles would lift the tractor (negative pin load, warned)', () => {
    const r = axleGroupLoads({ tractor, jeep: { ...jeep, fifthWheelBehindPinFt: 12 }, trailer, booster, loads });
    expect(r.jeepPinLb!).toBeLessThan(0);
    expect(r.warnings.join(' ')).toMatch(/jeep pin load is negative/);
  });

  it('steer share (common practice, no published source): warns below the stated share of the unloaded steer', () => {
    // Unloaded steer 12,000; a fifth wheel 1 ft behind the drive center takes load off the steer axle.
    const behind = { ...tractor, fifthWheelAheadOfDriveFt: -1 };
    const r = axleGroupLoads({ tractor: behind, trailer, loads, steerMinShareOfUnloaded: 0.8 });
    // Kingpin 140,000 − 4,000,000 / 50 = 60,000; steer 12,000 − 60,000 × 1 / 20 = 9,000 = 75 % of 12,000 < 80 %.
    expect(r.steerLb).toBeCloseTo(9_000, 6);
    expect(r.steerShare).toMatchObject({ unloadedLb: 12_000, minShare: 0.8, ok: false, source: 'common practice, no published source' });
    expect(r.warnings.join(' ')).toMatch(/75 % of its unloaded 12,000 lb, below the 80 %.*common practice, no published source/);
    expect(axleGroupLoads({ tractor, trailer, loads, steerMinShareOfUnloaded: 0.8 }).steerShare!.ok).toBe(true);
  });

  it('today\'s input shape gives today\'s answer through the new solver (textbook statics)', () => {
    const base = { tractor: { steerTareLb: 10_000, driveTareLb: 9_000, wheelbaseFt: 20, fifthWheelAheadOfDriveFt: 1 }, trailer: { tareLb: 14_000, tareCgFromKingpinFt: 20, axleGroupFromKingpinFt: 40 }, loads: [{ weightLb: 30_000, cgFromKingpinFt: 25 }] };
    const r = axleGroupLoads(base);
    expect(r.groups.map((g) => [g.key, g.axleCount])).toEqual([
      ['steer', null],
      ['drive', null],
      ['trailer', null],
    ]);
    expect(r.jeepLb).toBeNull();
    expect(r.boosterLb).toBeNull();
    expect(r.fifthWheelLb).toBeCloseTo(18_250, 6);
    expect(() => combinationAxleList(r)).toThrow(/describe its axles/);
  });

  const comboArb = fc.record({
    jeepFw: fc.double({ min: 4, max: 9, noNaN: true }),
    hasBooster: fc.boolean(),
    pinLoad: fc.option(fc.integer({ min: 0, max: 40_000 }), { nil: undefined }),
    boosterBehind: fc.double({ min: 10, max: 25, noNaN: true }),
    tare: fc.integer({ min: 20_000, max: 80_000 }),
    loads: fc.array(fc.record({ weightLb: fc.integer({ min: 1, max: 200_000 }), cgFromKingpinFt: fc.double({ min: 0, max: 60, noNaN: true }) }), { minLength: 1, maxLength: 4 }),
  });
  type Combo = typeof comboArb extends fc.Arbitrary<infer T> ? T : never;
  const comboInput = (v: Combo): AxleGroupLoadsInput => ({
    tractor,
    jeep: { ...jeep, fifthWheelBehindPinFt: v.jeepFw },
    trailer: { ...trailer, tareLb: v.tare },
    ...(v.hasBooster ? { booster: { ...booster, axleGroupBehindPinFt: v.boosterBehind, ...(v.pinLoad !== undefined ? { pinLoadLb: v.pinLoad } : {}) } } : {}),
    loads: v.loads,
  });

  it('property (textbook statics): the group loads add up to the total weight with a jeep and a booster', () => {
    fc.assert(
      fc.property(comboArb, (v) => {
        const input = comboInput(v);
        const r = axleGroupLoads(input);
        const total = 30_000 + 8_000 + v.tare + (v.hasBooster ? 10_000 : 0) + v.loads.reduce((s, l) => s + l.weightLb, 0);
        expect(r.grossLb).toBe(total);
        expect(r.groups.reduce((s, g) => s + g.loadLb, 0)).toBeCloseTo(total, 4);
        expect(r.balance.ok).toBe(true);
        for (const g of r.groups) if (g.axles.length) expect(g.axles.reduce((s, a) => s + a.weightLb, 0)).toBeCloseTo(g.loadLb, 6);
      }),
    );
  });

  it('property (textbook statics): moving the load rearward never lowers the rearmost group (a sweep of positions)', () => {
    fc.assert(
      fc.property(comboArb, (v) => {
        const input = comboInput(v);
        let last = -Infinity;
        for (let cg = -5; cg <= 70; cg += 2.5) {
          const r = axleGroupLoads({ ...input, loads: [...input.loads, { weightLb: 50_000, cgFromKingpinFt: cg }] });
          const rear = r.groups[r.groups.length - 1].loadLb;
          expect(rear).toBeGreaterThanOrEqual(last - 1e-6);
          last = rear;
        }
      }),
      { numRuns: 60 },
    );
  });

  it.each([
    [{ tractor, trailer, loads, jeep: { ...jeep, axleGroupBehindPinFt: 0 } }, /jeep.axleGroupBehindPinFt must be greater than 0/],
    [{ tractor, trailer: { ...trailer, group: { axleCount: 3 } }, loads }, /trailer.group.spacingFt must be a finite number/],
    [{ tractor, trailer: { ...trailer, group: { axleCount: 2, spacingFt: 4, liftAxles: [{ index: 0, up: true }, { index: 1, up: true }] } }, loads }, /at least one axle must be down/],
    [{ tractor, trailer: { ...trailer, group: { axleCount: 2, offsetsFt: [2, -2] } }, loads }, /offsetsFt must run front to rear/],
    [{ tractor, trailer, loads, booster: { ...booster, pinLoadLb: -1 } }, /booster.pinLoadLb must be at least 0/],
    [{ tractor, trailer: { ...trailer, group: { axleCount: 2, spacingFt: 4, tires: { size: 'big', count: 4 } } }, loads }, /tire size "big"/],
  ])('bad combination input → RangeError (%#)', (input, msg) => {
    expect(() => axleGroupLoads(input as AxleGroupLoadsInput)).toThrow(msg);
  });
});

describe('suggestSliderPosition and suggestCombinationSettings: each group against its own limit', () => {
  const tractor = { steerTareLb: 11_000, driveTareLb: 8_000, wheelbaseFt: 20, fifthWheelAheadOfDriveFt: 1 };
  const trailerTare = { tareLb: 12_000, tareCgFromKingpinFt: 22, axleGroupFromKingpinFt: 38 };

  it('23 U.S.C. 127 bridge table (9 ft, 3 axles: 42,500): a tridem is held to its own limit, not 34,000', () => {
    // Tridem 4.5 ft apart: spread 9 ft (over 96 in) → bridge formula, L = 9, N = 3 → 42,500 (references §1 cell (9, 3)).
    const input = {
      tractor,
      trailer: { ...trailerTare, group: { axleCount: 3, spacingFt: 4.5 } },
      loads: [{ weightLb: 52_000, cgFromKingpinFt: 30 }],
      slider: { minFromKingpinFt: 30, maxFromKingpinFt: 48, holeSpacingIn: 12 },
      groupLimits: { driveLb: 60_000 },
    };
    const r = suggestSliderPosition(input);
    const at40 = r.candidates.find((c) => c.axleGroupFromKingpinFt === 40)!;
    // At 40 ft: moments 12,000 × 22 + 52,000 × 30 = 1,824,000 → 45,600 on the tridem, over 42,500.
    expect(at40.trailerLb).toBeCloseTo(45_600, 6);
    expect(at40.violations.join(' ')).toMatch(/trailer group 45,600 lb over 42,500 lb/);
    // Under the old 34,000 assumption no hole would pass (it needs 1,824,000 / 34,000 = 53.6 ft); with the tridem's own
    // limit the holes from 43 ft on do (1,824,000 / 43 = 42,419).
    expect(r.found).toBe(true);
    expect(r.best!.trailerLb).toBeLessThanOrEqual(42_500);
    expect(r.candidates.filter((c) => c.ok).map((c) => c.axleGroupFromKingpinFt)).toEqual([43, 44, 45, 46, 47, 48]);
  });

  it('a group whose axles are not described is taken as a tandem, and the answer says so (FHWA Q&A on 23 CFR 658.17)', () => {
    const r = suggestSliderPosition({ tractor, trailer: trailerTare, loads: [{ weightLb: 30_000, cgFromKingpinFt: 20 }], slider: { minFromKingpinFt: 30, maxFromKingpinFt: 40, holeSpacingIn: 12 } });
    expect(r.reasons.map((x) => x.message).join(' ')).toMatch(/trailer group: axles not described, taken as a tandem \(34,000 lb\)/);
  });

  it('statics with permit limits: searches the jeep fifth wheel and the booster extension for a legal setting', () => {
    // Permit limits given for the test (a route's permit maxima in practice): 30,000 single, 60,000 per group.
    const r = suggestCombinationSettings({
      tractor: { steerTareLb: 12_000, driveTareLb: 18_000, wheelbaseFt: 20, fifthWheelAheadOfDriveFt: 1, steerGroup: { axleCount: 1 }, driveGroup: { axleCount: 2, spacingFt: 4.5 } },
      jeep: { tareLb: 8_000, tareCgBehindPinFt: 6, fifthWheelBehindPinFt: 8, axleGroupBehindPinFt: 10, group: { axleCount: 2, spacingFt: 4.5 } },
      trailer: { tareLb: 40_000, tareCgFromKingpinFt: 25, axleGroupFromKingpinFt: 50, group: { axleCount: 3, spacingFt: 5 } },
      booster: { tareLb: 10_000, pinFromKingpinFt: 60, tareCgBehindPinFt: 8, axleGroupBehindPinFt: 15, group: { axleCount: 2, spacingFt: 5 } },
      loads: [{ weightLb: 100_000, cgFromKingpinFt: 30 }],
      jeepFifthWheelRange: { minFt: 4, maxFt: 9, stepIn: 12 },
      boosterRange: { minFt: 12, maxFt: 20, stepIn: 24 },
      limits: { singleAxleLb: 30_000, tandemLb: 60_000, tridemLb: 60_000, grossLb: 250_000, bridgeFormula: false, source: 'test permit limits' },
      groupLimits: { jeep: 60_000 },
    });
    expect(r.tried).toBe(6 * 5);
    // Jeep axles × 10 = 72,000 × fifth wheel + 48,000 ≤ 60,000 × 10 needs the fifth wheel at most 7.67 ft behind the pin.
    // Hand-worked at the input's own settings (8 ft, 15 ft): jeep 62,400 > 60,000 — not legal.
    expect(r.legal.some((c) => c.jeepFifthWheelBehindPinFt === 8 && c.boosterAxleGroupBehindPinFt === 15)).toBe(false);
    expect(r.found).toBe(true);
    for (const c of r.legal) for (const g of c.groups) if (g.limitLb !== null) expect(g.loadLb).toBeLessThanOrEqual(g.limitLb + 1e-6);
    for (const c of r.legal) expect(c.jeepFifthWheelBehindPinFt!).toBeLessThanOrEqual(7.67);
    expect(r.legal[0]).toBe(r.best);
    expect(r.message).toMatch(/jeep fifth wheel .* behind its pin/);
  });
});
