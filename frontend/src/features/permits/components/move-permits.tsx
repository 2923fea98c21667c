// Placeholder until the permit desk lands: the permits of one move, shown on the move page.
export function MovePermits(_props: { moveId: string }) {
  return null;
}
