import type { PaymentsFilter } from './get-payments';
import type { PermitsFilter } from './get-permits';

/** The permit desk's query keys: permits (the queue, one permit, a move's, the overview, assignees) and payments. */
export const permitKeys = {
  all: () => ['permits'] as const,
  list: (f: PermitsFilter) => ['permits', 'list', f] as const,
  one: (id: string) => ['permits', 'one', id] as const,
  move: (moveId: string) => ['permits', 'move', moveId] as const,
  overview: () => ['permits', 'overview'] as const,
  assignees: () => ['permits', 'assignees'] as const,
  payments: () => ['payments'] as const,
  paymentList: (f: PaymentsFilter) => ['payments', 'list', f] as const,
};
