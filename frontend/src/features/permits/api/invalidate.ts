import type { QueryClient } from '@tanstack/react-query';
import { permitKeys } from './keys';
import { sharedKeys } from '../../../lib/shared-queries';

/** After any permit or payment change: the desk, the ledger and the moves (their history and guards) are stale. */
export const invalidatePermitData = (qc: QueryClient) =>
  Promise.all([qc.invalidateQueries({ queryKey: permitKeys.all() }), qc.invalidateQueries({ queryKey: permitKeys.payments() }), qc.invalidateQueries({ queryKey: sharedKeys.moves() })]);
