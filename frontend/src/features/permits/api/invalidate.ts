import type { QueryClient } from '@tanstack/react-query';

/** After any permit or payment change: the desk, the ledger and the moves (their history and guards) are stale. */
export const invalidatePermitData = (qc: QueryClient) =>
  Promise.all([qc.invalidateQueries({ queryKey: ['permits'] }), qc.invalidateQueries({ queryKey: ['payments'] }), qc.invalidateQueries({ queryKey: ['moves'] })]);
