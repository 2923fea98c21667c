/** A record with every topic not on file: the starting point of a jurisdiction nobody has researched yet. */
import type { JurisdictionRule, UnknownFact } from '../engine/jurisdiction-rule';

export function blankRecord(code: string, name: string, asOf: string, note = 'not yet researched'): JurisdictionRule {
  const u = (): UnknownFact => ({ status: 'unknown', note });
  return {
    code,
    name,
    schema: 2,
    asOf,
    legal: {
      widthIn: u(),
      heightIn: u(),
      overallLengthIn: u(),
      semitrailerLengthIn: u(),
      frontOverhangIn: u(),
      rearOverhangIn: u(),
      singleAxleLb: u(),
      tandemLb: u(),
      tridemLb: u(),
      grossLb: u(),
      bridge: u(),
      tireLbPerInch: u(),
    },
    permit: { validityDays: u(), leadTimeDays: u(), classes: u(), routineMaxima: u() },
    superload: u(),
    escorts: {
      width: u(),
      height: u(),
      length: u(),
      frontOverhang: u(),
      rearOverhang: u(),
      sideProjection: u(),
      twoDimensionRule: u(),
      heightPoleMarginIn: u(),
      certification: u(),
    },
    signs: u(),
    flags: u(),
    lamps: u(),
    travel: { daylight: u(), weekends: u(), holidays: u(), curfews: u(), minVisibilityFt: u() },
    fee: u(),
    speed: u(),
  };
}
