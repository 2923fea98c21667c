/** The rulebook data files, one per jurisdiction (see README.md). Loaded as rule version 1. */
import type { JurisdictionRule } from '../engine/jurisdiction-rule';
import AL from './data/AL.json';
import AZ from './data/AZ.json';
import AR from './data/AR.json';
import CA from './data/CA.json';
import CO from './data/CO.json';
import CT from './data/CT.json';
import DE from './data/DE.json';
import DC from './data/DC.json';
import FL from './data/FL.json';
import GA from './data/GA.json';
import ID from './data/ID.json';
import IL from './data/IL.json';
import IN from './data/IN.json';
import IA from './data/IA.json';
import KS from './data/KS.json';
import KY from './data/KY.json';
import LA from './data/LA.json';
import ME from './data/ME.json';
import MD from './data/MD.json';
import MA from './data/MA.json';
import MI from './data/MI.json';
import MN from './data/MN.json';
import MS from './data/MS.json';
import MO from './data/MO.json';
import MT from './data/MT.json';
import NE from './data/NE.json';
import NV from './data/NV.json';
import NH from './data/NH.json';
import NJ from './data/NJ.json';
import NM from './data/NM.json';
import NY from './data/NY.json';
import NC from './data/NC.json';
import ND from './data/ND.json';
import OH from './data/OH.json';
import OK from './data/OK.json';
import OR from './data/OR.json';
import PA from './data/PA.json';
import RI from './data/RI.json';
import SC from './data/SC.json';
import SD from './data/SD.json';
import TN from './data/TN.json';
import TX from './data/TX.json';
import UT from './data/UT.json';
import VT from './data/VT.json';
import VA from './data/VA.json';
import WA from './data/WA.json';
import WV from './data/WV.json';
import WI from './data/WI.json';
import WY from './data/WY.json';

/** Rulebook records by postal code, as shipped. */
export const RULEBOOK_DATA: Readonly<Record<string, JurisdictionRule>> = {
  AL: AL as unknown as JurisdictionRule,
  AZ: AZ as unknown as JurisdictionRule,
  AR: AR as unknown as JurisdictionRule,
  CA: CA as unknown as JurisdictionRule,
  CO: CO as unknown as JurisdictionRule,
  CT: CT as unknown as JurisdictionRule,
  DE: DE as unknown as JurisdictionRule,
  DC: DC as unknown as JurisdictionRule,
  FL: FL as unknown as JurisdictionRule,
  GA: GA as unknown as JurisdictionRule,
  ID: ID as unknown as JurisdictionRule,
  IL: IL as unknown as JurisdictionRule,
  IN: IN as unknown as JurisdictionRule,
  IA: IA as unknown as JurisdictionRule,
  KS: KS as unknown as JurisdictionRule,
  KY: KY as unknown as JurisdictionRule,
  LA: LA as unknown as JurisdictionRule,
  ME: ME as unknown as JurisdictionRule,
  MD: MD as unknown as JurisdictionRule,
  MA: MA as unknown as JurisdictionRule,
  MI: MI as unknown as JurisdictionRule,
  MN: MN as unknown as JurisdictionRule,
  MS: MS as unknown as JurisdictionRule,
  MO: MO as unknown as JurisdictionRule,
  MT: MT as unknown as JurisdictionRule,
  NE: NE as unknown as JurisdictionRule,
  NV: NV as unknown as JurisdictionRule,
  NH: NH as unknown as JurisdictionRule,
  NJ: NJ as unknown as JurisdictionRule,
  NM: NM as unknown as JurisdictionRule,
  NY: NY as unknown as JurisdictionRule,
  NC: NC as unknown as JurisdictionRule,
  ND: ND as unknown as JurisdictionRule,
  OH: OH as unknown as JurisdictionRule,
  OK: OK as unknown as JurisdictionRule,
  OR: OR as unknown as JurisdictionRule,
  PA: PA as unknown as JurisdictionRule,
  RI: RI as unknown as JurisdictionRule,
  SC: SC as unknown as JurisdictionRule,
  SD: SD as unknown as JurisdictionRule,
  TN: TN as unknown as JurisdictionRule,
  TX: TX as unknown as JurisdictionRule,
  UT: UT as unknown as JurisdictionRule,
  VT: VT as unknown as JurisdictionRule,
  VA: VA as unknown as JurisdictionRule,
  WA: WA as unknown as JurisdictionRule,
  WV: WV as unknown as JurisdictionRule,
  WI: WI as unknown as JurisdictionRule,
  WY: WY as unknown as JurisdictionRule,
};
