import type { MoveInput } from '@amberline/common';
import { sharedKeys, type MovesFilter } from '../../../lib/shared-queries';

/** The moves' query keys: every query and every invalidation of the moves feature takes its key from here. */
export const moveKeys = {
  all: sharedKeys.moves,
  list: (f: MovesFilter) => sharedKeys.movesList(f),
  stageCounts: () => [...sharedKeys.moves(), 'stage-counts'] as const,
  preview: (body: MoveInput | null) => [...sharedKeys.moves(), 'preview', body] as const,
  one: sharedKeys.move,
  schedule: (id: string) => [...sharedKeys.move(id), 'schedule'] as const,
  history: sharedKeys.moveHistory,
  assessment: (id: string) => [...sharedKeys.move(id), 'assessment'] as const,
  reassessment: (id: string) => [...sharedKeys.move(id), 'reassessment'] as const,
  /** Drivers are users: a change to a user refreshes the list. */
  drivers: () => [...sharedKeys.users(), 'drivers'] as const,
};
