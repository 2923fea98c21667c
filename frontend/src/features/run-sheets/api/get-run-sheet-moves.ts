import { useQueries } from '@tanstack/react-query';
import type { MoveStage, MoveSummaryDto, Role } from '@amberline/common';
import { movesQueryOptions } from '../../../lib/shared-queries';

/** The stages at which the office looks at run sheets: ready to leave, or on the road. */
export const OFFICE_RUN_SHEET_STAGES: MoveStage[] = ['permits_received', 'escorts_booked', 'running'];
const DONE: MoveStage[] = ['delivered', 'cancelled'];

/**
 * The moves whose run sheets a user opens: a driver's own assigned moves (the API lists only those to a driver), or
 * for the office the moves at permits received, escorts booked or running. Open moves come first, next departure first.
 */
export function useRunSheetMoves(role: Role | undefined) {
  const office = role !== 'driver';
  const filters = office
    ? OFFICE_RUN_SHEET_STAGES.map((stage) => ({ page: 1, pageSize: 50, stage, sort: 'departure' as const }))
    : [{ page: 1, pageSize: 50, sort: 'departure' as const }];
  return useQueries({
    queries: filters.map((f) => ({ ...movesQueryOptions(f), enabled: !!role })),
    combine: (results) => {
      const items = results.flatMap((r) => r.data?.items ?? []);
      const byDeparture = (a: MoveSummaryDto, b: MoveSummaryDto) => a.requestedDeparture.localeCompare(b.requestedDeparture) || a.reference.localeCompare(b.reference);
      return {
        open: items.filter((m) => !DONE.includes(m.stage)).sort(byDeparture),
        done: items.filter((m) => DONE.includes(m.stage)).sort((a, b) => -byDeparture(a, b)),
        total: results.reduce((n, r) => n + (r.data?.total ?? 0), 0),
        isPending: results.some((r) => r.isPending),
        error: results.find((r) => r.error)?.error ?? null,
      };
    },
  });
}
