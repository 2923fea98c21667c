/** The life of a move. `cancelled` is reachable from any stage before `delivered`. */
export const MOVE_STAGES = [
  'requested',
  'permits_received',
  'escorts_booked',
  'running',
  'delivered',
  'cancelled',
] as const;
export type MoveStage = (typeof MOVE_STAGES)[number];

export const MOVE_STAGE_LABELS: Record<MoveStage, string> = {
  requested: 'Requested',
  permits_received: 'Permits received',
  escorts_booked: 'Escorts booked',
  running: 'Running',
  delivered: 'Delivered',
  cancelled: 'Cancelled',
};

/** Forward transitions the workflow allows (guards are checked by the server on top of these). */
export const MOVE_TRANSITIONS: Record<MoveStage, readonly MoveStage[]> = {
  requested: ['permits_received', 'cancelled'],
  permits_received: ['escorts_booked', 'cancelled'],
  escorts_booked: ['running', 'cancelled'],
  running: ['delivered', 'cancelled'],
  delivered: [],
  cancelled: [],
};

export function canTransition(from: MoveStage, to: MoveStage): boolean {
  return MOVE_TRANSITIONS[from].includes(to);
}
