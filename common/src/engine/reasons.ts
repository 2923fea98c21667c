/** Shared result vocabulary: every result explains itself with reasons and a source. */

/** Shown beside any result that could hurt someone if taken as final (weights, securement, clearances). */
export const PLANNING_CAUTION =
  'Planning aid only: the permit, a certified scale, local codes and licensed practice govern.';

/** Shown beside rulebook-derived results. */
export const RULEBOOK_CAUTION =
  'Rulebook values name their source and the date they were read; a topic not on file must be answered by the permit. The issued permit governs.';

/** How a topic the rulebook lacks reads, everywhere: never as "none". */
export const NOT_ON_FILE = 'not on file — check the permit';
/** The `source` of a reason about a topic not on file (there is no text to cite). */
export const NOT_ON_FILE_SOURCE = 'not on file';

export type Unit = 'in' | 'ft' | 'lb' | 'usd' | 'min' | 'count' | 'psi';

/** One explanation line: which rule, which numbers, which source. */
export type Reason = {
  /** Machine-readable code, e.g. `bridge-formula`, `width-over-legal`. */
  code: string;
  /** Human sentence for the UI. */
  message: string;
  /** The measured or computed value the rule looked at. */
  value?: number;
  /** The limit or threshold it was compared with. */
  limit?: number;
  unit?: Unit;
  /** Citation, e.g. "23 U.S.C. 127(a)". */
  source: string;
  /** True when the rule comes from sample data rather than a verified source. */
  sample?: boolean;
};

export const SOURCES = {
  usc127: '23 U.S.C. 127(a)',
  cfr658_5: 'FHWA Q&A on 23 CFR 658.5/658.17 (single axle ≤ 40 in, tandem > 40 in and ≤ 96 in)',
  cfr658_15: '23 CFR 658.15',
  bridgeTable: 'Federal bridge formula table (as reproduced in N.C. Gen. Stat. 20-118)',
  cfr393_87: '49 CFR 393.87',
  cfr393_11: '49 CFR 393.11 Table 1 (secondary summary)',
  cfr393_102: '49 CFR 393.102',
  cfr393_106: '49 CFR 393.106(d)',
  cfr393_108: '49 CFR 393.108',
  cfr393_110: '49 CFR 393.110',
  cfr393_130: '49 CFR 393.130',
  edge: '49 CFR 393.104 (edge protection; secondary summary)',
  usc6103: '5 U.S.C. 6103(a)',
  statics: 'Static equilibrium (textbook statics)',
  practice: 'common practice, no published source',
  noaa: 'NOAA/USNO sunrise-sunset convention (sun 50′ below the horizon), computed with suncalc',
} as const;
