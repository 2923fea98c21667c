/** What the move form's steps share: option lists, the step order, and small helpers. */
import type { CSSProperties } from 'react';
import { parseFeetInches, type MoveDto, type MoveInput, type RoadType, type WeightSource } from '@amberline/common';
import type { articleFromDraft, instantAxles } from '../../draft';

export const STEPS = ['Customer', 'Load pieces', 'Equipment', 'Tiedowns', 'Route and dates'];

export const WEIGHT_SOURCE_LABELS: Record<WeightSource, string> = { spec_sheet: 'Spec sheet', scale_ticket: 'Scale ticket', estimate: 'Estimate' };
export const ROAD_TYPES: { value: RoadType; label: string }[] = [
  { value: 'two-lane', label: 'Two-lane' },
  { value: 'multilane', label: 'Multilane / divided' },
  { value: 'interstate', label: 'Interstate' },
];
export const PATHS = [
  { value: 'direct', label: 'Direct (half credited)' },
  { value: 'same-side', label: 'Returns to the same side (half credited)' },
  { value: 'side-to-side', label: 'Side to side, over the load (full credit)' },
];
export const CHAIN_SIZES = ['5/16', '3/8', '1/2', '5/8'].map((v) => ({ value: v, label: `${v} in` }));
export const CHAIN_GRADES = [30, 43, 70, 80, 100].map((v) => ({ value: v, label: `grade ${v}` }));
export const WEBBING_WIDTHS = ['1 3/4', '2', '3', '4'].map((v) => ({ value: v, label: `${v} in` }));

/** A list the form picks from (tractors, trailers, drivers) as its query gives it. */
export type FleetList<T> = { data?: T[]; isPending: boolean };
export type DraftPiece = NonNullable<ReturnType<typeof articleFromDraft>['article']>;
export type InstantAxles = ReturnType<typeof instantAxles>;

/** Every step stays mounted (its fields keep their values and rules); only the current one is shown. */
export const stepStyle = (hidden: boolean): CSSProperties => (hidden ? { display: 'none' } : {});

/** Inches from a feet-and-inches text, or nothing while the text does not read as one. */
export const inches = (text: string | undefined): number | undefined => {
  try {
    return text ? parseFeetInches(text) : undefined;
  } catch {
    return undefined;
  }
};

/**
 * What an edit sends: only the fields that differ from the move as loaded, so an unchanged plan is not taken for a
 * new one; a reference or notes cleared in the form are sent as empty.
 */
export function changedFields(move: MoveDto, baseline: MoveInput | null, input: MoveInput): Partial<MoveInput> {
  const changes: Partial<MoveInput> = {};
  for (const k of Object.keys(input) as (keyof MoveInput)[]) {
    if (!baseline || JSON.stringify(input[k]) !== JSON.stringify(baseline[k])) (changes as Record<string, unknown>)[k] = input[k];
  }
  if (move.customerRef && !input.customerRef) changes.customerRef = '';
  if (move.notes && !input.notes) changes.notes = '';
  return changes;
}
