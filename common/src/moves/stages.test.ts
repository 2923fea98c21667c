import { canTransition, MOVE_STAGES } from './stages';

describe('move stages', () => {
  it.each([
    ['requested', 'permits_received', true],
    ['permits_received', 'escorts_booked', true],
    ['escorts_booked', 'running', true],
    ['running', 'delivered', true],
    ['requested', 'running', false],
    ['delivered', 'cancelled', false],
    ['cancelled', 'requested', false],
  ] as const)('%s -> %s allowed: %s', (from, to, ok) => {
    expect(canTransition(from, to)).toBe(ok);
  });

  it('allows cancelling from every stage before delivered', () => {
    for (const s of MOVE_STAGES.filter((x) => x !== 'delivered' && x !== 'cancelled')) {
      expect(canTransition(s, 'cancelled')).toBe(true);
    }
  });
});
