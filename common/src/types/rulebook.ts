import type { JurisdictionRule } from '../engine/jurisdiction-rule';

/** A jurisdiction with its current rule record. */
export type JurisdictionSummaryDto = {
  code: string;
  name: string;
  version: number;
  /** True when no value of the record is on file (nothing in it has been read in a text). */
  sample: boolean;
  asOf: string;
  updatedAt: string;
};

export type RuleVersionDto = {
  code: string;
  version: number;
  record: JurisdictionRule;
  note: string | null;
  createdBy: string | null;
  createdAt: string;
};

/** Editing a rule creates a new version; the old ones stay for the assessments that used them. */
export type UpdateRuleRequest = { record: JurisdictionRule; note: string };
