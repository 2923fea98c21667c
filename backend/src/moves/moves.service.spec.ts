import { DOMAIN_ERRORS, type SessionUser } from '@amberline/common';
import type { AuditService } from '../audit/audit.service';
import type { RulebookService } from '../rulebook/rulebook.service';
import type { AssessmentService } from './assessment.service';
import type { Move } from './entities/move.entity';
import { MoveExtensionsRegistry } from './move-extensions';
import type { MovesRepository } from './moves.repository';
import { MovesService } from './moves.service';
import { refusal } from '../../test/utils/refusal';

const NOW = new Date('2026-05-04T15:00:00Z');
const dispatcher: SessionUser = { id: 'u-1', role: 'dispatcher', email: 'd@amberline.example', name: 'Dee' };

function move(over: Partial<Move> = {}): Move {
  return {
    id: 'm-1', reference: 'AM-2026-00001', stage: 'requested', version: 4, customer: 'Acme', customerRef: null, commodity: 'Dozer',
    articles: [], tractorId: 't-1', trailerId: 'r-1', driverId: 'drv-1', sliderSettingFt: null,
    route: [{ order: 1, jurisdiction: 'TX', miles: 100, roadType: 'interstate', roads: 'I-35' }], jurisdictions: ['TX'],
    origin: 'Austin', destination: 'Dallas', requestedDeparture: '2026-05-10', travelDays: 1, dailyMiles: null, notes: null,
    summary: { permitsNeeded: [], escorts: 0, superload: false, overweight: false, problems: [], estimatedFeesUsd: 0 },
    planRevision: 1, ruleVersions: null, stageChangedAt: null, createdById: 'u-1',
    createdAt: new Date('2026-05-01T00:00:00Z'), updatedAt: new Date('2026-05-01T00:00:00Z'),
    ...over,
  } as Move;
}

function setup(found: Move | null) {
  const manager = {} as never;
  const repo = {
    manager,
    transaction: jest.fn((fn: (m: unknown) => unknown) => fn(manager)),
    findWithEquipment: jest.fn(async () => found),
    lockForUpdate: jest.fn(async () => found),
    updatePlan: jest.fn(async () => true),
    stageCounts: jest.fn(async () => ({ running: 2, requested: 5 })),
  };
  const audit = { record: jest.fn() };
  const service = new MovesService(
    repo as unknown as MovesRepository, audit as unknown as AuditService, {} as AssessmentService, new MoveExtensionsRegistry(), {} as RulebookService,
  );
  return { service, repo, audit };
}

describe('MovesService', () => {
  it('a move that is not there is not found', async () => {
    const e = await refusal(setup(null).service.get('m-9'));
    expect(e.code).toBe(DOMAIN_ERRORS.NOT_FOUND);
    expect(e.message).toBe('No move m-9');
  });

  it('a driver does not see a move assigned to someone else (not found, not forbidden)', async () => {
    const { service } = setup(move({ driverId: 'drv-2' }));
    expect((await refusal(service.get('m-1', { ...dispatcher, id: 'drv-1', role: 'driver' }))).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
    await expect(service.get('m-1', { ...dispatcher, id: 'drv-2', role: 'driver' })).resolves.toMatchObject({ id: 'm-1' });
  });

  it('the lock refuses a caller holding an older version, naming both', async () => {
    const { service } = setup(move({ version: 6 }));
    const e = await refusal(service.lockForUpdate({} as never, 'm-1', 5));
    expect(e.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(e.message).toBe('This move was changed by someone else (version 6, yours 5); reload it');
    await expect(service.lockForUpdate({} as never, 'm-1', 6)).resolves.toMatchObject({ version: 6 });
    await expect(service.lockForUpdate({} as never, 'm-1')).resolves.toMatchObject({ version: 6 });
  });

  it('an edit on a stale version is a version conflict carrying the current version, and writes nothing', async () => {
    const { service, repo, audit } = setup(move({ version: 7 }));
    const e = await refusal(service.update('m-1', { version: 6, notes: 'call first' }, dispatcher, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(e.details).toEqual({ currentVersion: 7 });
    expect(repo.updatePlan).not.toHaveBeenCalled();
    expect(audit.record).not.toHaveBeenCalled();
  });

  it.each(['delivered', 'cancelled'] as const)('a %s move is closed to edits', async (stage) => {
    const { service, repo } = setup(move({ stage }));
    const e = await refusal(service.update('m-1', { version: 4, notes: 'late note' }, dispatcher, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.RECORD_CLOSED);
    expect(e.message).toBe(`A ${stage} move cannot be edited`);
    expect(repo.updatePlan).not.toHaveBeenCalled();
  });

  it('stage counts name every stage, zero where there are none, and a driver counts only their own', async () => {
    const { service, repo } = setup(null);
    expect(await service.stageCounts(dispatcher)).toEqual({ requested: 5, permits_received: 0, escorts_booked: 0, running: 2, delivered: 0, cancelled: 0 });
    await service.stageCounts({ ...dispatcher, id: 'drv-1', role: 'driver' });
    expect(repo.stageCounts).toHaveBeenLastCalledWith('drv-1');
  });
});
