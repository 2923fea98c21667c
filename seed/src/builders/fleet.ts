import type { TractorInput, TrailerInput } from '@amberline/common';
import type { Db } from '../db';

let counter = 0;
const unique = () => `${Date.now().toString(36).slice(-4)}${process.pid.toString(36)}${(counter++).toString(36)}`.toUpperCase();

/** A conventional tandem-drive tractor (figures typical of the trade, not of any one model). */
export const TRACTOR_DEFAULTS: Omit<TractorInput, 'unitNumber' | 'plate'> = {
  steerTareLb: 10_800,
  driveTareLb: 8_700,
  wheelbaseFt: 20,
  fifthWheelAheadOfDriveFt: 1,
  fifthWheelRangeFt: { min: 0, max: 2 },
  bumperToSteerIn: 42,
  widthIn: 102,
  heightIn: 162,
  driveAxleOffsetsFt: [-2.125, 2.125],
};

/** A 48 ft step deck with a sliding tandem: 60 in upper deck, 36 in lower deck (a low-profile deck; common practice, no published source). */
export const STEP_DECK_DEFAULTS: Omit<TrailerInput, 'unitNumber'> = {
  type: 'step_deck',
  lengthIn: 576,
  widthIn: 102,
  heightIn: null,
  decks: [
    { name: 'upper deck', fromFrontIn: 0, toFrontIn: 132, heightIn: 60 },
    { name: 'lower deck', fromFrontIn: 132, toFrontIn: 576, heightIn: 36 },
  ],
  tareLb: 14_500,
  tareCgFromKingpinFt: 22,
  kingpinFromFrontIn: 36,
  axleOffsetsFt: [-2.05, 2.05],
  axleGroupFromKingpinFt: 39,
  slider: { minFromKingpinFt: 33, maxFromKingpinFt: 41, holeSpacingIn: 6 },
  anchorPoints: [
    { kind: 'stake_pocket', countPerSide: 12, wllLb: 5_000 },
    { kind: 'winch_track', countPerSide: 12, wllLb: 6_600 },
    { kind: 'pipe_spool', countPerSide: 4, wllLb: 6_600 },
  ],
  gaugeCalibration: [
    { psi: 12, loadLb: 9_800 },
    { psi: 62, loadLb: 33_900 },
  ],
  tireSize: '255/70R22.5',
};

export async function seedTractor(db: Db, input: Partial<TractorInput> = {}): Promise<{ id: string; unitNumber: string }> {
  const { unitNumber = `T-${unique()}`, plate = `AM${unique().slice(-5)}`, ...rest } = input;
  const spec = { ...TRACTOR_DEFAULTS, ...rest };
  const [row] = await db.query(`INSERT INTO tractors (unit_number, plate, spec) VALUES ($1, $2, $3) RETURNING id`, [unitNumber, plate, JSON.stringify(spec)]);
  return { id: row.id, unitNumber };
}

export async function seedTrailer(db: Db, input: Partial<TrailerInput> = {}): Promise<{ id: string; unitNumber: string }> {
  const { unitNumber = `S-${unique()}`, type = STEP_DECK_DEFAULTS.type, ...rest } = input;
  const { type: _t, ...defaults } = STEP_DECK_DEFAULTS;
  void _t;
  const spec = { ...defaults, ...rest };
  const [row] = await db.query(`INSERT INTO trailers (unit_number, type, spec) VALUES ($1, $2, $3) RETURNING id`, [unitNumber, type, JSON.stringify(spec)]);
  return { id: row.id, unitNumber };
}
