import type { MoveArticle, MoveInput, MoveStage, Role, TractorInput, TrailerInput, VendorInput } from '@amberline/common';
import type { Db } from '../db';
import { seedUser } from '../builders/user';
import { STEP_DECK_DEFAULTS, TRACTOR_DEFAULTS } from '../builders/fleet';

/**
 * The demo scenario: Tamarack Ridge Heavy Haul, an invented carrier, and its invented customers, people and
 * loads. Nothing here describes a real company or person. Dates are relative to the day the demo is loaded.
 */
export const DEMO_PASSWORD = 'amberline-demo';
export const DEMO_CARRIER = 'Tamarack Ridge Heavy Haul';

export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: 'admin@amberline.example', name: 'Rowan Vale', role: 'admin' },
  { email: 'dispatcher@amberline.example', name: 'Dana Okafor-Pell', role: 'dispatcher' },
  { email: 'clerk@amberline.example', name: 'Imogen Strand', role: 'permit_clerk' },
  { email: 'driver@amberline.example', name: 'Cal Brennick', role: 'driver' },
  { email: 'driver2@amberline.example', name: 'Marisol Tavener', role: 'driver' },
  { email: 'dispatcher2@amberline.example', name: 'Ezra Quillfeather', role: 'dispatcher' },
];

export async function seedDemoUsers(db: Db): Promise<number> {
  for (const u of DEMO_USERS) await seedUser(db, { ...u, password: DEMO_PASSWORD });
  return DEMO_USERS.length;
}

/** Kept for callers that only need the demo accounts (the browser tests). */
export const seedDemo = async (db: Db): Promise<{ users: number }> => ({ users: await seedDemoUsers(db) });

export const DEMO_TRACTORS: TractorInput[] = [
  { unitNumber: 'TR-101', plate: 'TRH 4101', ...TRACTOR_DEFAULTS },
  { unitNumber: 'TR-102', plate: 'TRH 4102', ...TRACTOR_DEFAULTS, steerTareLb: 11_200, driveTareLb: 9_100, wheelbaseFt: 21.5 },
  { unitNumber: 'TR-205', plate: 'TRH 4205', ...TRACTOR_DEFAULTS, steerTareLb: 12_400, driveTareLb: 10_300, wheelbaseFt: 23, driveAxleOffsetsFt: [-4.25, 0, 4.25] },
];

export const DEMO_TRAILERS: TrailerInput[] = [
  { unitNumber: 'SD-48A', ...STEP_DECK_DEFAULTS },
  { unitNumber: 'SD-53B', ...STEP_DECK_DEFAULTS, lengthIn: 636, decks: [{ name: 'upper deck', fromFrontIn: 0, toFrontIn: 132, heightIn: 60 }, { name: 'lower deck', fromFrontIn: 132, toFrontIn: 636, heightIn: 38 }], tareLb: 15_800, tareCgFromKingpinFt: 24, axleGroupFromKingpinFt: 44, slider: { minFromKingpinFt: 38, maxFromKingpinFt: 46, holeSpacingIn: 6 } },
  {
    unitNumber: 'DD-29',
    ...STEP_DECK_DEFAULTS,
    type: 'double_drop',
    lengthIn: 636,
    decks: [
      { name: 'front deck', fromFrontIn: 0, toFrontIn: 120, heightIn: 60 },
      { name: 'well', fromFrontIn: 120, toFrontIn: 468, heightIn: 22 },
      { name: 'rear deck', fromFrontIn: 468, toFrontIn: 636, heightIn: 48 },
    ],
    tareLb: 21_000,
    tareCgFromKingpinFt: 26,
    axleOffsetsFt: [-4.1, 0, 4.1],
    axleGroupFromKingpinFt: 45,
    slider: null,
    anchorPoints: [
      { kind: 'd_ring', countPerSide: 8, wllLb: 15_000 },
      { kind: 'stake_pocket', countPerSide: 10, wllLb: 5_000 },
    ],
    gaugeCalibration: [
      { psi: 10, loadLb: 15_200 },
      { psi: 40, loadLb: 36_800 },
      { psi: 70, loadLb: 58_900 },
    ],
  },
];

const chains = (count: number, over: Partial<MoveArticle['tiedowns'][number]> = {}): MoveArticle['tiedowns'] =>
  Array.from({ length: count }, (_, i) => ({ label: `chain ${i + 1}`, kind: 'chain', chainSize: '3/8', chainGrade: 70, anchorKind: 'winch_track', path: 'side-to-side', edgeProtection: true, ...over }));

/** One demo move: its plan (equipment by unit number, driver by e-mail) and the stage the demo shows it at. */
export type DemoMove = Omit<MoveInput, 'tractorId' | 'trailerId' | 'driverId' | 'requestedDeparture'> & {
  key: string;
  tractor: string;
  trailer: string;
  driver?: string;
  /** Departure relative to load day; `nextSaturday` / `christmasEve` pick those dates. */
  departure: number | 'nextSaturday' | 'christmasEve';
  stage: MoveStage;
  stageReason?: string;
  /** What the move shows off in the demo. */
  purpose: string;
};

export const DEMO_MOVES: DemoMove[] = [
  {
    key: 'excavator-tx',
    purpose: '15 ft wide excavator on Texas two-lane roads: a front escort (TxDMV, width over 14 ft)',
    customer: 'Cedar Flats Aggregate Co.',
    customerRef: 'CF-22817',
    commodity: 'Tracked excavator',
    articles: [{ id: 'EX1', description: 'Tracked excavator, boom folded', lengthIn: 372, widthIn: 180, heightIn: 124, weightLb: 44_000, weightSource: 'spec_sheet', positionFromTrailerFrontIn: 170, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: false, heavyEquipment: true, sharpEdges: true, tiedowns: chains(6, { chainSize: '1/2' }) }],
    tractor: 'TR-101',
    trailer: 'SD-48A',
    sliderSettingFt: 39,
    route: [
      { order: 1, jurisdiction: 'TX', roads: 'FM 529, FM 362', miles: 38, roadType: 'two-lane', zip: '77493' },
      { order: 2, jurisdiction: 'TX', roads: 'I-10 W, US 87', miles: 171, roadType: 'interstate', zip: '78028' },
    ],
    origin: 'Katy, TX (Cedar Flats yard)',
    destination: 'Kerrville, TX',
    departure: 6,
    travelDays: 1,
    driver: 'driver@amberline.example',
    stage: 'requested',
  },
  {
    key: 'transformer-va',
    purpose: 'A tall transformer in Virginia: front car with a height pole (24VAC20-81-180, over 14 ft 5 in)',
    customer: 'Blue Hollow Electric Cooperative',
    customerRef: 'BH-4410',
    commodity: 'Pad-mount transformer',
    articles: [{ id: 'TF1', description: 'Pad-mount transformer on skid', lengthIn: 168, widthIn: 110, heightIn: 142, weightLb: 31_000, weightSource: 'scale_ticket', positionFromTrailerFrontIn: 260, lateralOffsetIn: 0, dunnageIn: 4, blockedForward: false, sharpEdges: true, tiedowns: chains(4) }],
    tractor: 'TR-102',
    trailer: 'SD-48A',
    sliderSettingFt: 39,
    route: [
      { order: 1, jurisdiction: 'VA', roads: 'US 29 N', miles: 64, roadType: 'multilane', zip: '24540' },
      { order: 2, jurisdiction: 'VA', roads: 'VA 151, VA 6', miles: 41, roadType: 'two-lane', zip: '22920' },
    ],
    origin: 'Danville, VA',
    destination: 'Afton, VA',
    departure: 'christmasEve',
    travelDays: 2,
    driver: 'driver2@amberline.example',
    stage: 'requested',
  },
  {
    key: 'press-oh-pa',
    purpose: 'A heavy press through Ohio and Pennsylvania: over 80,000 lb gross and a bridge-formula finding; weight fees by the ton-mile',
    customer: 'Ridgeback Stamping Works',
    customerRef: 'RS-0093',
    commodity: 'Stamping press frame',
    articles: [{ id: 'PR1', description: 'Press crown and frame', lengthIn: 240, widthIn: 132, heightIn: 118, weightLb: 64_000, weightSource: 'spec_sheet', positionFromTrailerFrontIn: 300, lateralOffsetIn: 0, dunnageIn: 4, blockedForward: true, sharpEdges: true, tiedowns: chains(6, { chainSize: '1/2' }) }],
    tractor: 'TR-205',
    trailer: 'SD-53B',
    sliderSettingFt: 44,
    route: [
      { order: 1, jurisdiction: 'OH', roads: 'I-71 N, I-76 E', miles: 118, roadType: 'interstate', zip: '44805' },
      { order: 2, jurisdiction: 'PA', roads: 'I-76 E (turnpike)', miles: 162, roadType: 'interstate', zip: '15601' },
    ],
    origin: 'Ashland, OH',
    destination: 'Greensburg, PA',
    departure: 9,
    travelDays: 2,
    driver: 'driver@amberline.example',
    stage: 'permits_received',
  },
  {
    key: 'beams-md',
    purpose: 'Steel beams in Maryland with too few tiedowns: the securement shortfall stops the move before it runs',
    customer: 'Larkspur Bridge & Iron',
    customerRef: 'LBI-771',
    commodity: 'Plate girders (2)',
    articles: [{ id: 'GB1', description: 'Plate girder pair, banded', lengthIn: 564, widthIn: 96, heightIn: 72, weightLb: 38_000, weightSource: 'estimate', positionFromTrailerFrontIn: 40, lateralOffsetIn: 0, dunnageIn: 6, blockedForward: false, sharpEdges: true, tiedowns: chains(3, { anchorKind: 'stake_pocket', path: 'direct' }) }],
    tractor: 'TR-102',
    trailer: 'SD-53B',
    sliderSettingFt: 42,
    route: [{ order: 1, jurisdiction: 'MD', roads: 'I-95 S, I-695', miles: 74, roadType: 'interstate', zip: '21901' }],
    origin: 'North East, MD',
    destination: 'Sparrows Point, MD',
    departure: 4,
    travelDays: 1,
    driver: 'driver2@amberline.example',
    stage: 'escorts_booked',
  },
  {
    key: 'tank-fl',
    purpose: 'A 13 ft wide process tank in Florida, on the road now',
    customer: 'Saltmarsh Fermentation LLC',
    customerRef: 'SF-3002',
    commodity: 'Stainless process tank',
    articles: [{ id: 'TK1', description: 'Horizontal process tank on saddles', lengthIn: 420, widthIn: 156, heightIn: 140, weightLb: 18_500, weightSource: 'spec_sheet', positionFromTrailerFrontIn: 140, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: false, tiedowns: Array.from({ length: 5 }, (_, i) => ({ label: `strap ${i + 1}`, kind: 'webbing' as const, webbingWidth: '4', anchorKind: 'winch_track' as const, path: 'side-to-side' as const })) }],
    tractor: 'TR-101',
    trailer: 'SD-48A',
    sliderSettingFt: 37,
    route: [
      { order: 1, jurisdiction: 'FL', roads: 'I-4 E', miles: 84, roadType: 'interstate', zip: '33801' },
      { order: 2, jurisdiction: 'FL', roads: 'SR 528', miles: 47, roadType: 'multilane', zip: '32920' },
    ],
    origin: 'Lakeland, FL',
    destination: 'Cape Canaveral, FL',
    departure: 0,
    travelDays: 1,
    driver: 'driver2@amberline.example',
    stage: 'running',
  },
  {
    key: 'boiler-wa',
    purpose: 'A delivered boiler in Washington',
    customer: 'Fernhollow Paper Mill',
    customerRef: 'FPM-118',
    commodity: 'Package boiler',
    articles: [{ id: 'BL1', description: 'Package boiler, skid mounted', lengthIn: 300, widthIn: 138, heightIn: 130, weightLb: 41_000, weightSource: 'scale_ticket', positionFromTrailerFrontIn: 200, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: true, sharpEdges: false, tiedowns: chains(4) }],
    tractor: 'TR-102',
    trailer: 'SD-48A',
    sliderSettingFt: 39,
    route: [{ order: 1, jurisdiction: 'WA', roads: 'I-5 N, SR 20', miles: 96, roadType: 'interstate', zip: '98421' }],
    origin: 'Tacoma, WA',
    destination: 'Anacortes, WA',
    departure: 1,
    travelDays: 1,
    driver: 'driver@amberline.example',
    stage: 'delivered',
  },
  {
    key: 'vessel-pa-superload',
    purpose: 'A 17 ft wide vessel section on a three-axle double drop: a superload in Pennsylvania (sample thresholds) with bridge-formula findings',
    customer: 'Ironweed Process Systems',
    customerRef: 'IPS-6021',
    commodity: 'Pressure vessel section',
    articles: [{ id: 'VS1', description: 'Vessel shell section on cradles', lengthIn: 360, widthIn: 204, heightIn: 150, weightLb: 58_000, weightSource: 'estimate', positionFromTrailerFrontIn: 130, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: false, sharpEdges: true, tiedowns: chains(6, { anchorKind: 'd_ring', chainSize: '1/2', path: 'same-side' }) }],
    tractor: 'TR-205',
    trailer: 'DD-29',
    route: [
      { order: 1, jurisdiction: 'PA', roads: 'US 422, PA 61', miles: 58, roadType: 'two-lane', zip: '19601' },
      { order: 2, jurisdiction: 'PA', roads: 'I-81 N', miles: 64, roadType: 'interstate', zip: '18201' },
    ],
    origin: 'Reading, PA',
    destination: 'Hazleton, PA',
    departure: 18,
    travelDays: 2,
    stage: 'requested',
  },
  {
    key: 'loader-tx-weekend',
    purpose: 'A wheel loader booked for a Saturday in Texas: weekend travel rules show on the windows',
    customer: 'Mesquite Bend Ranch Supply',
    commodity: 'Wheel loader',
    articles: [{ id: 'WL1', description: 'Wheel loader, bucket on the deck', lengthIn: 330, widthIn: 126, heightIn: 128, weightLb: 36_500, weightSource: 'spec_sheet', positionFromTrailerFrontIn: 180, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: false, heavyEquipment: true, tiedowns: chains(4) }],
    tractor: 'TR-101',
    trailer: 'SD-48A',
    sliderSettingFt: 38,
    route: [{ order: 1, jurisdiction: 'TX', roads: 'US 281 N', miles: 112, roadType: 'multilane', zip: '78201' }],
    origin: 'San Antonio, TX',
    destination: 'Lampasas, TX',
    departure: 'nextSaturday',
    travelDays: 1,
    stage: 'requested',
  },
  {
    key: 'crusher-cancelled',
    purpose: 'A cancelled move, with its reason in the history',
    customer: 'Cedar Flats Aggregate Co.',
    commodity: 'Cone crusher',
    articles: [{ id: 'CC1', description: 'Cone crusher, portable', lengthIn: 400, widthIn: 120, heightIn: 132, weightLb: 44_000, weightSource: 'estimate', positionFromTrailerFrontIn: 150, lateralOffsetIn: 0, dunnageIn: 0, blockedForward: false, heavyEquipment: true, tiedowns: chains(5) }],
    tractor: 'TR-205',
    trailer: 'SD-53B',
    sliderSettingFt: 42,
    route: [{ order: 1, jurisdiction: 'TX', roads: 'I-45 N', miles: 90, roadType: 'interstate', zip: '77301' }],
    origin: 'Conroe, TX',
    destination: 'Centerville, TX',
    departure: 12,
    travelDays: 1,
    stage: 'cancelled',
    stageReason: 'Customer postponed the job to spring',
  },
];

/** The departure date of a demo move, counted from `today` (`YYYY-MM-DD`). */
export function demoDeparture(d: DemoMove['departure'], today: string): string {
  const t = Date.parse(`${today}T00:00:00Z`);
  const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  if (typeof d === 'number') return iso(t + d * 86_400_000);
  if (d === 'nextSaturday') {
    const dow = new Date(t).getUTCDay();
    return iso(t + (((6 - dow + 7) % 7) || 7) * 86_400_000);
  }
  const year = Number(today.slice(0, 4));
  const eve = `${year}-12-24`;
  return eve >= iso(t + 86_400_000) ? eve : `${year + 1}-12-24`;
}

const vendor = (company: string, contactName: string, slug: string, phone: string, states: string[], certState: string | null): VendorInput => ({
  company,
  contactName,
  email: `dispatch@${slug}.vendor.amberline.example`,
  phone,
  states,
  operators: [
    { name: contactName, phone, certifications: certState ? [{ state: certState, number: `${certState}-PE-${slug.slice(0, 4).toUpperCase()}71`, expires: '2028-06-30' }] : [] },
    { name: `${contactName.split(' ')[0] === 'Odessa' ? 'Lyle' : 'Odessa'} Marchetti`, certifications: [] },
  ],
  insurance: { carrier: 'Bluestem Mutual', policyNumber: `BM-${slug.slice(0, 6).toUpperCase()}`, liabilityLimitUsd: 1_000_000, autoLimitUsd: 1_000_000, expires: '2027-12-31' },
  vehicles: [
    { label: 'Pickup with height pole', plate: `${slug.slice(0, 3).toUpperCase()}-401`, equipment: { heightPole: true, amberLights: true, signs: true, flags: true } },
    { label: 'Lead car', plate: `${slug.slice(0, 3).toUpperCase()}-402`, equipment: { heightPole: false, amberLights: true, signs: true, flags: true } },
  ],
  rates: { basis: 'per_mile', perMileUsd: 1.85, minimumUsd: 400, noGoUsd: 275, layoverUsd: 325 },
  notes: 'Invented escort vendor of the demo scenario.',
  active: true,
});

/** Invented escort (pilot car) vendors covering the demo routes. */
export const DEMO_VENDORS: VendorInput[] = [
  vendor('Mesquite Flag Escorts', 'Rosalind Quade', 'mesquiteflag', '+1 512 555 0142', ['TX', 'OK', 'NM'], 'OK'),
  vendor('Tidewater Pilot Cars', 'Odessa Vireo', 'tidewaterpilot', '+1 804 555 0187', ['VA', 'MD', 'PA', 'DE'], 'VA'),
  vendor('Gulfbreeze Lead & Chase', 'Harlan Pruett', 'gulfbreeze', '+1 863 555 0119', ['FL', 'GA', 'AL'], 'FL'),
  vendor('Cascade Ridge Escorts', 'Wren Talbot', 'cascaderidge', '+1 253 555 0164', ['WA', 'OR', 'ID'], 'WA'),
];
