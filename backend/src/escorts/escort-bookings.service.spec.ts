import { DOMAIN_ERRORS, type SessionUser } from '@amberline/common';
import type { AuditService } from '../audit/audit.service';
import type { MailService } from '../mail/mail.service';
import type { MailSettings } from '../mail/mail.settings';
import type { Move } from '../moves/entities/move.entity';
import type { MovesService } from '../moves/moves.service';
import type { VendorsService } from '../vendors/vendors.service';
import type { EscortBooking } from './entities/escort-booking.entity';
import { EscortBookingsService } from './escort-bookings.service';
import type { EscortsRepository } from './escorts.repository';
import { refusal } from '../../test/utils/refusal';

const NOW = new Date('2026-05-04T15:00:00Z');
const dispatcher: SessionUser = { id: 'u-1', role: 'dispatcher', email: 'd@amberline.example', name: 'Dee' };
const booking = (over: Partial<EscortBooking> = {}) => ({ id: 'b-1', moveId: 'm-1', vendorId: 'v-1', status: 'requested', version: 2, ...over }) as EscortBooking;
const move = (over: Partial<Move> = {}) =>
  ({ id: 'm-1', stage: 'permits_received', requestedDeparture: '2026-05-20', travelDays: 2, route: [{ order: 1, jurisdiction: 'TX', timeZone: 'America/Chicago' }], jurisdictions: ['TX'], ...over }) as Move;

function setup(locked: EscortBooking | null, current: Move = move()) {
  const repo = {
    manager: {},
    transaction: jest.fn((fn: (m: unknown) => unknown) => fn({})),
    lockBooking: jest.fn(async () => locked),
    saveBooking: jest.fn(),
    insertBooking: jest.fn(),
  };
  const moves = { lockForUpdate: jest.fn(async () => current), assessmentOf: jest.fn() };
  const service = new EscortBookingsService(
    repo as unknown as EscortsRepository, moves as unknown as MovesService, {} as VendorsService, { record: jest.fn() } as unknown as AuditService,
    { enqueue: jest.fn() } as unknown as MailService, { appUrl: 'http://desk.example' } as MailSettings,
  );
  return { service, repo, moves };
}

describe('EscortBookingsService.cancel', () => {
  it('a booking not on this move is not found', async () => {
    expect((await refusal(setup(null).service.cancel('m-1', 'b-9', { version: 1, reason: 'not needed' }, dispatcher))).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });

  it('a booking changed since it was read is a version conflict', async () => {
    const { service, repo } = setup(booking({ version: 3 }));
    const e = await refusal(service.cancel('m-1', 'b-1', { version: 2, reason: 'not needed' }, dispatcher));
    expect(e.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(e.message).toBe('This booking changed (version 3, yours 2); reload it');
    expect(repo.saveBooking).not.toHaveBeenCalled();
  });

  it.each(['declined', 'cancelled'] as const)('a %s booking cannot be called off', async (status) => {
    const { service, repo } = setup(booking({ status }));
    const e = await refusal(service.cancel('m-1', 'b-1', { version: 2, reason: 'not needed' }, dispatcher));
    expect(e.code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect(repo.saveBooking).not.toHaveBeenCalled();
  });
});

describe('EscortBookingsService.request', () => {
  const dto = { vendorId: 'v-1', position: 'lead', seat: 1, jurisdictions: ['TX'], meetingPoint: 'Yard gate' } as never;

  it.each(['running', 'delivered', 'cancelled'] as const)('no escort is asked for a move that is %s', async (stage) => {
    const { service, repo } = setup(null, move({ stage }));
    const e = await refusal(service.request('m-1', dto, dispatcher, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.RECORD_CLOSED);
    expect(repo.insertBooking).not.toHaveBeenCalled();
  });

  it('a move departing today is too late to ask through a link', async () => {
    const e = await refusal(setup(null, move({ requestedDeparture: '2026-05-04' })).service.request('m-1', dto, dispatcher, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TOO_LATE);
    expect(e.message).toMatch(/^The move departs 2026-05-04: too late to ask through a link/);
  });
});
