// Placeholder until escort bookings land: the escort positions and bookings of one move, shown on the move page.
export function MoveEscorts(_props: { moveId: string }) {
  return null;
}
