import { DOMAIN_ERRORS, DomainError, type SessionUser } from '@amberline/common';
import type { EntityManager } from 'typeorm';
import type { AuditService } from '../audit/audit.service';
import type { MoveExtensionsRegistry } from '../moves/move-extensions';
import type { MovesService } from '../moves/moves.service';
import type { Permit } from './entities/permit.entity';
import type { PermitsRepository } from './permits.repository';
import { PermitsService } from './permits.service';

const clerk: SessionUser = { id: '00000000-0000-4000-8000-000000000001', email: 'clerk@example.test', name: 'Clerk', role: 'permit_clerk' };
const now = new Date('2026-12-01T15:00:00Z');

const permit = (over: Partial<Permit> = {}): Permit =>
  ({
    id: 'p1', moveId: 'm1', jurisdiction: 'TX', permitType: 'single_trip', status: 'to_file', needed: true, permitNumber: null, filedAt: null, issuedAt: null,
    validFrom: null, validTo: null, permitted: null, routeText: null, conditions: {}, conditionsText: null, estimatedFeeCents: null, actualFeeCents: null,
    refundable: null, ruleVersion: 1, leadTimeDays: 2, leadTimeKnown: true, assigneeId: null, notes: null, amendmentReason: null, expiryWarning: null,
    expiryCheckedAt: null, version: 3, departure: '2026-12-10', fileBy: '2026-12-08', urgencyGroup: 0, createdAt: now, updatedAt: now, ...over,
  }) as Permit;

/** A repository holding one permit (and a move of the given stage) in memory. */
function fakeRepo(p: Permit | null, opts: { moveStage?: string | null; writeWins?: boolean } = {}) {
  const writes: Permit[] = [];
  const repo = {
    transaction: (fn: (m: EntityManager) => Promise<unknown>) => fn({} as EntityManager),
    lock: async () => p,
    lockMove: async () => (opts.moveStage === null ? null : { id: 'm1', stage: opts.moveStage ?? 'requested' }),
    copy: (x: Permit, changes: Partial<Permit> = {}) => ({ ...x, ...changes }) as Permit,
    updateVersioned: async (_m: EntityManager, _b: Permit, a: Permit) => {
      writes.push(a);
      return opts.writeWins ?? true;
    },
    insertVersion: async () => undefined,
    user: async () => null,
  };
  return { repo: repo as unknown as PermitsRepository, writes };
}

function service(repo: PermitsRepository): PermitsService {
  const audit = { record: async () => undefined } as unknown as AuditService;
  const moves = {} as MovesService;
  const registry = { register: () => undefined } as unknown as MoveExtensionsRegistry;
  return new PermitsService(repo, audit, moves, registry);
}

async function codeOf(p: Promise<unknown>): Promise<string> {
  try {
    await p;
  } catch (e) {
    if (e instanceof DomainError) return e.code;
    throw e;
  }
  throw new Error('expected a refusal');
}

describe('PermitsService.update', () => {
  it('refuses a status change the permit workflow does not allow (to file → issued)', async () => {
    const { repo, writes } = fakeRepo(permit());
    expect(await codeOf(service(repo).update('p1', { version: 3, status: 'issued' }, clerk, now))).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect(writes).toHaveLength(0);
  });

  it('says so when the permit was changed since it was read (versions differ), with the current version', async () => {
    const { repo } = fakeRepo(permit({ version: 4 }));
    const err = await service(repo).update('p1', { version: 3, notes: 'called the state' }, clerk, now).catch((e) => e);
    expect(err).toBeInstanceOf(DomainError);
    expect(err.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(err.message).toMatch(/changed by someone else \(version 4, yours 3\)/);
    expect(err.details).toEqual({ currentVersion: 4 });
  });

  it('says so when someone else wrote between the lock and the write', async () => {
    const { repo } = fakeRepo(permit(), { writeWins: false });
    const s = service(repo);
    jest.spyOn(s, 'get').mockResolvedValue({} as never);
    expect(await codeOf(s.update('p1', { version: 3, notes: 'called the state' }, clerk, now))).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
  });

  it('takes no change on a void permit', async () => {
    const { repo } = fakeRepo(permit({ status: 'void' }));
    expect(await codeOf(service(repo).update('p1', { version: 3, notes: 'x' }, clerk, now))).toBe(DOMAIN_ERRORS.RECORD_CLOSED);
  });

  it('answers a permit that does not exist with not found', async () => {
    const { repo } = fakeRepo(null);
    expect(await codeOf(service(repo).update('p1', { version: 3 }, clerk, now))).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });

  it('asks for the reason of a rejection (a field error, not a domain refusal)', async () => {
    const { repo } = fakeRepo(permit({ status: 'filed' }));
    await expect(service(repo).update('p1', { version: 3, status: 'rejected' }, clerk, now)).rejects.toMatchObject({ code: 'validation_failed', details: [{ field: 'reason' }] });
  });

  it('writes the next version for an allowed change', async () => {
    const { repo, writes } = fakeRepo(permit());
    const s = service(repo);
    jest.spyOn(s, 'get').mockResolvedValue({} as never);
    await s.update('p1', { version: 3, notes: '  called the state  ' }, clerk, now);
    expect(writes).toEqual([expect.objectContaining({ version: 4, notes: 'called the state' })]);
  });
});

describe('PermitsService.syncForMove', () => {
  it.each([['delivered'], ['cancelled']])('a %s move needs no permits', async (stage) => {
    const { repo } = fakeRepo(permit(), { moveStage: stage });
    expect(await codeOf(service(repo).syncForMove('m1', clerk, now))).toBe(DOMAIN_ERRORS.RECORD_CLOSED);
  });
  it('a move that does not exist is not found', async () => {
    const { repo } = fakeRepo(permit(), { moveStage: null });
    expect(await codeOf(service(repo).syncForMove('m1', clerk, now))).toBe(DOMAIN_ERRORS.NOT_FOUND);
  });
});
