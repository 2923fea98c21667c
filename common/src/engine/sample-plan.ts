/** An invented demo move: an excavator with its bucket and a dozer blade on a 5-axle lowboy behind a tri-drive tractor. */
import type { PlanInput } from './plan-check';
import { RULEBOOK_DATA } from '../rulebook/data-index';

const FT = 12;

/** 9 axles (steer, tri-drive, 5-axle trailer), 3 articles, 10 jurisdictions, 5 travel days. Invented scenario. */
export const SAMPLE_PLAN: PlanInput = {
  tractor: {
    steerTareLb: 12_000,
    driveTareLb: 14_000,
    wheelbaseFt: 22,
    fifthWheelAheadOfDriveFt: 1.5,
    bumperToSteerIn: 40,
    widthIn: 102,
    heightIn: 150,
    driveAxleOffsetsFt: [-4.5, 0, 4.5],
  },
  trailer: {
    tareLb: 30_000,
    tareCgFromKingpinFt: 24,
    axleGroupFromKingpinFt: 42,
    axleOffsetsFt: [-9, -4.5, 0, 4.5, 9],
    kingpinFromFrontIn: 36,
    lengthIn: 53 * FT,
    widthIn: 102,
    decks: [
      { name: 'gooseneck', fromFrontIn: 0, toFrontIn: 120, heightIn: 60 },
      { name: 'well', fromFrontIn: 120, toFrontIn: 480, heightIn: 24 },
      { name: 'rear deck', fromFrontIn: 480, toFrontIn: 53 * FT, heightIn: 40 },
    ],
  },
  articles: [
    {
      id: 'excavator',
      description: 'tracked excavator, boom lowered',
      weightLb: 60_000,
      lengthIn: 28 * FT,
      widthIn: 11 * FT,
      heightIn: 10 * FT + 6,
      positionFromTrailerFrontIn: 130,
      blockedForward: false,
      heavyEquipment: true,
      tiedowns: Array.from({ length: 6 }, (_, i) => ({ label: `chain ${i + 1}`, wllLb: 11_300, path: 'direct' as const })),
    },
    {
      id: 'bucket',
      description: 'excavator bucket',
      weightLb: 4_000,
      lengthIn: 8 * FT,
      widthIn: 6 * FT,
      heightIn: 4 * FT,
      positionFromTrailerFrontIn: 540,
      blockedForward: false,
      sharpEdges: true,
      tiedowns: [
        { label: 'strap 1', wllLb: 4_000, path: 'side-to-side', edgeProtection: true },
        { label: 'strap 2', wllLb: 4_000, path: 'side-to-side', edgeProtection: true },
      ],
    },
    {
      id: 'blade',
      description: 'dozer blade',
      weightLb: 2_500,
      lengthIn: 5 * FT,
      widthIn: 8 * FT,
      heightIn: 3 * FT,
      positionFromTrailerFrontIn: 10,
      blockedForward: true,
      sharpEdges: true,
      tiedowns: [{ label: 'chain', wllLb: 6_600, anchorWllLb: 5_000, anchorKind: 'stake pocket', path: 'side-to-side', edgeProtection: true }],
    },
  ],
  route: [
    { jurisdiction: 'TX', miles: 240, roadType: 'multilane', urban: true, lat: 32.8, lon: -96.8, timeZone: 'America/Chicago' },
    { jurisdiction: 'TX', miles: 40, roadType: 'two-lane', lat: 32.5, lon: -94.7, timeZone: 'America/Chicago' },
    { jurisdiction: 'LA', miles: 190, roadType: 'interstate', lat: 32.5, lon: -92.1, timeZone: 'America/Chicago' },
    { jurisdiction: 'MS', miles: 150, roadType: 'interstate', lat: 32.3, lon: -90.2, timeZone: 'America/Chicago' },
    { jurisdiction: 'AL', miles: 210, roadType: 'interstate', lat: 33.5, lon: -86.8, timeZone: 'America/Chicago' },
    { jurisdiction: 'GA', miles: 180, roadType: 'interstate', lat: 33.8, lon: -84.4, timeZone: 'America/New_York' },
    { jurisdiction: 'SC', miles: 110, roadType: 'interstate', lat: 34.9, lon: -82.4, timeZone: 'America/New_York' },
    { jurisdiction: 'NC', miles: 160, roadType: 'interstate', lat: 35.8, lon: -80.3, timeZone: 'America/New_York' },
    { jurisdiction: 'VA', miles: 230, roadType: 'two-lane', urban: true, lat: 37.5, lon: -77.4, timeZone: 'America/New_York' },
    { jurisdiction: 'MD', miles: 60, roadType: 'interstate', lat: 39.3, lon: -76.6, timeZone: 'America/New_York' },
    { jurisdiction: 'PA', miles: 80, roadType: 'multilane', lat: 39.9, lon: -76.7, timeZone: 'America/New_York' },
  ],
  travelDates: ['2027-05-26', '2027-05-27', '2027-05-28', '2027-05-29', '2027-05-31'],
  rules: ['TX', 'VA', 'MD', 'PA'].map((c) => RULEBOOK_DATA[c]),
  registeredGrossLb: 80_000,
};
