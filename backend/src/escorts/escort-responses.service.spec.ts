import { DOMAIN_ERRORS, DomainError } from '@amberline/common';
import type { AuditService } from '../audit/audit.service';
import type { MailService } from '../mail/mail.service';
import type { MovesRepository } from '../moves/moves.repository';
import type { EscortBooking } from './entities/escort-booking.entity';
import type { EscortResponseToken } from './entities/escort-response-token.entity';
import { EscortResponsesService } from './escort-responses.service';
import type { EscortsRepository } from './escorts.repository';

const NOW = new Date('2026-05-04T15:00:00Z');
const TOKEN = 'A'.repeat(43);
const link = (over: Partial<EscortResponseToken> = {}) => ({ id: 'l-1', bookingId: 'b-1', usedAt: null, expiresAt: new Date('2026-05-09T05:00:00Z'), ...over }) as EscortResponseToken;
const booking = (over: Partial<EscortBooking> = {}) => ({ id: 'b-1', moveId: 'm-1', vendorId: 'v-1', status: 'requested', ...over }) as EscortBooking;

function setup(found: { token: EscortResponseToken | null; booking: EscortBooking | null }, moveStage = 'escorts_booked') {
  const repo = {
    manager: {},
    transaction: jest.fn((fn: (m: unknown) => unknown) => fn({})),
    linkWithBooking: jest.fn(async () => found),
    vendorOf: jest.fn(async () => ({ id: 'v-1', company: 'Lone Star Pilots', operators: [], vehicles: [] })),
    saveBooking: jest.fn(),
    spendLinks: jest.fn(),
  };
  const moves = { findWithEquipment: jest.fn(async () => ({ id: 'm-1', stage: moveStage, route: [] })) };
  const service = new EscortResponsesService(
    repo as unknown as EscortsRepository, moves as unknown as MovesRepository, { record: jest.fn() } as unknown as AuditService, { enqueue: jest.fn() } as unknown as MailService,
  );
  return { service, repo };
}

const thrown = (p: Promise<unknown>): Promise<unknown> => p.then(() => null, (x: unknown) => x);

describe('EscortResponsesService: a link takes one answer', () => {
  it.each<[string, Parameters<typeof setup>[0], string?]>([
    ['a link already used', { token: link({ usedAt: new Date('2026-05-03T00:00:00Z') }), booking: booking() }],
    ['a booking already confirmed through another link', { token: link(), booking: booking({ status: 'confirmed' }) }],
    ['a booking with dates proposed', { token: link(), booking: booking({ status: 'proposed' }) }],
  ])('%s is closed: used', async (_name, found) => {
    const { service, repo } = setup(found);
    const e = await thrown(service.answer(TOKEN, { decision: 'decline', reason: 'no operator' } as never, NOW));
    expect(e).toBeInstanceOf(DomainError);
    expect((e as DomainError).code).toBe(DOMAIN_ERRORS.LINK_CLOSED);
    expect((e as DomainError).details).toEqual({ link: 'used' });
    expect(repo.saveBooking).not.toHaveBeenCalled();
    expect(repo.spendLinks).not.toHaveBeenCalled();
  });

  it('a booking called off, or a move already running, closes the request', async () => {
    for (const [found, stage] of [[{ token: link(), booking: booking({ status: 'cancelled' }) }, 'escorts_booked'], [{ token: link(), booking: booking() }, 'running']] as const) {
      const e = await thrown(setup(found, stage).service.view(TOKEN, NOW));
      expect(e).toBeInstanceOf(DomainError);
      expect(e).toMatchObject({ code: DOMAIN_ERRORS.LINK_CLOSED, details: { link: 'closed' } });
    }
  });

  it('an unknown or malformed link is not valid (404), an expired one is gone (410), and neither says more', async () => {
    const unknown = await thrown(setup({ token: null, booking: null }).service.view(TOKEN, NOW));
    expect(unknown).toBeInstanceOf(DomainError);
    expect(unknown).toMatchObject({ code: DOMAIN_ERRORS.NOT_FOUND, details: { link: 'invalid' } });
    expect(await thrown(setup({ token: link(), booking: booking() }).service.view('not-a-token', NOW))).toMatchObject({ code: DOMAIN_ERRORS.NOT_FOUND, details: { link: 'invalid' } });
    const expired = await thrown(setup({ token: link({ expiresAt: new Date('2026-05-04T14:59:00Z') }), booking: booking() }).service.view(TOKEN, NOW));
    expect(expired).toMatchObject({ code: DOMAIN_ERRORS.GONE, details: { link: 'expired' } });
  });
});
