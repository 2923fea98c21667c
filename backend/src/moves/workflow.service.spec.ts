import { DOMAIN_ERRORS, DomainError, type AssessmentDto, type SessionUser } from '@amberline/common';
import type { AuditService } from '../audit/audit.service';
import type { Move } from './entities/move.entity';
import { MoveExtensionsRegistry } from './move-extensions';
import type { MovesRepository } from './moves.repository';
import type { MovesService } from './moves.service';
import type { ScheduleService } from './schedule.service';
import { WorkflowService } from './workflow.service';
import { refusal } from '../../test/utils/refusal';

const NOW = new Date('2026-05-04T15:00:00Z');
const actor: SessionUser = { id: 'u-1', role: 'dispatcher', email: 'd@amberline.example', name: 'Dee' };

function move(over: Partial<Move> = {}): Move {
  return {
    id: 'm-1', reference: 'AM-2026-00001', stage: 'requested', version: 4, customer: 'Acme', customerRef: null, commodity: 'Dozer',
    articles: [], tractorId: 't-1', trailerId: 'r-1', driverId: null, sliderSettingFt: null,
    route: [{ order: 1, jurisdiction: 'TX', miles: 100, roadType: 'interstate', roads: 'I-35' }], jurisdictions: ['TX'],
    origin: 'Austin', destination: 'Dallas', requestedDeparture: '2026-05-10', travelDays: 1, dailyMiles: null, notes: null,
    summary: { permitsNeeded: [], escorts: 0, superload: false, overweight: false, problems: [], estimatedFeesUsd: 0 },
    planRevision: 1, ruleVersions: null, stageChangedAt: null, createdById: 'u-1',
    createdAt: new Date('2026-05-01T00:00:00Z'), updatedAt: new Date('2026-05-01T00:00:00Z'),
    ...over,
  } as Move;
}

const assessment = { ruleVersions: { TX: 3 }, result: { summary: { earliestDeparture: null, earliestDepartureKnown: true }, securement: [] } } as unknown as AssessmentDto;

function setup(current: Move) {
  const manager = {} as never;
  const repo = { transaction: jest.fn((fn: (m: unknown) => unknown) => fn(manager)), updateState: jest.fn(), copy: (m: Move) => ({ ...m }), manager };
  const moves = { lockForUpdate: jest.fn(async () => current), get: jest.fn(async () => current), assessmentOf: jest.fn(async () => assessment) };
  const audit = { record: jest.fn() };
  const extensions = new MoveExtensionsRegistry();
  const schedule = { forMove: jest.fn(async () => ({ findings: [] })) };
  const service = new WorkflowService(
    repo as unknown as MovesRepository, moves as unknown as MovesService, audit as unknown as AuditService, extensions, schedule as unknown as ScheduleService,
  );
  return { service, repo, moves, audit, extensions };
}

describe('WorkflowService.transition', () => {
  it('refuses a stage that is not the next step, listing it as unmet, and writes nothing', async () => {
    const { service, repo, audit } = setup(move({ stage: 'requested' }));
    const e = await refusal(service.transition('m-1', { to: 'running' }, actor, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect(e.message).toBe('a move cannot go from Requested to Running');
    expect(e.details).toEqual({ unmet: [{ code: 'not_a_step', message: e.message }] });
    expect(repo.updateState).not.toHaveBeenCalled();
    expect(audit.record).not.toHaveBeenCalled();
  });

  it('refuses a step whose conditions (here an extension\'s) are unmet, with every unmet condition in the details', async () => {
    const { service, repo, extensions } = setup(move());
    extensions.register({ name: 'permits', unmetConditions: async () => [{ code: 'permit_missing', jurisdiction: 'TX', message: 'TX permit not issued' }] });
    const e = await refusal(service.transition('m-1', { to: 'permits_received' }, actor, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect(e.message).toBe('Cannot move to Permits received: TX permit not issued');
    expect(e.details).toEqual({ unmet: [{ code: 'permit_missing', jurisdiction: 'TX', message: 'TX permit not issued' }] });
    expect(repo.updateState).not.toHaveBeenCalled();
  });

  it('running needs a driver: the base condition refuses without one', async () => {
    const { service } = setup(move({ stage: 'escorts_booked', ruleVersions: { TX: 3 } }));
    const e = await refusal(service.transition('m-1', { to: 'running' }, actor, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect((e.details as { unmet: { code: string }[] }).unmet.map((u) => u.code)).toContain('driver_missing');
  });

  it('passes the caller\'s version to the lock, so a stale copy is refused there', async () => {
    const { service, moves } = setup(move());
    moves.lockForUpdate.mockRejectedValueOnce(new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, 'changed'));
    const e = await refusal(service.transition('m-1', { to: 'permits_received', version: 3 }, actor, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
    expect(moves.lockForUpdate).toHaveBeenCalledWith(expect.anything(), 'm-1', 3);
  });

  it('a step that passes moves the stage, bumps the version and keeps the rule versions it used', async () => {
    const { service, repo, audit } = setup(move());
    await service.transition('m-1', { to: 'permits_received' }, actor, NOW);
    expect(repo.updateState).toHaveBeenCalledWith(expect.anything(), 'm-1', { stage: 'permits_received', version: 5, updatedAt: NOW, stageChangedAt: NOW, ruleVersions: { TX: 3 } });
    expect(audit.record).toHaveBeenCalledWith(expect.anything(), expect.objectContaining({ action: 'stage', before: { stage: 'requested' } }));
  });
});

describe('WorkflowService.reopen and reassess', () => {
  it('a move delivered more than the reopen window ago is too late to reopen', async () => {
    const { service, repo } = setup(move({ stage: 'delivered', stageChangedAt: new Date('2026-03-01T00:00:00Z') }));
    const e = await refusal(service.reopen('m-1', { version: 4, reason: 'wrong delivery date' }, actor, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TOO_LATE);
    expect(repo.updateState).not.toHaveBeenCalled();
  });

  it('only cancelled or recently delivered moves reopen', async () => {
    const { service } = setup(move({ stage: 'permits_received' }));
    const e = await refusal(service.reopen('m-1', { version: 4, reason: 'why not' }, actor, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
  });

  it('a cancelled move reopens to requested and gives up its kept rule versions', async () => {
    const { service, repo } = setup(move({ stage: 'cancelled', ruleVersions: { TX: 2 } }));
    await service.reopen('m-1', { version: 4, reason: 'customer came back' }, actor, NOW);
    expect(repo.updateState).toHaveBeenCalledWith(expect.anything(), 'm-1', expect.objectContaining({ stage: 'requested', version: 5, ruleVersions: null }));
  });

  it('a delivered move keeps its assessment; a requested one has nothing to re-assess', async () => {
    expect((await refusal(setup(move({ stage: 'delivered', ruleVersions: { TX: 2 } })).service.reassess('m-1', { version: 4 }, actor, NOW))).code).toBe(DOMAIN_ERRORS.RECORD_CLOSED);
    expect((await refusal(setup(move({ ruleVersions: null })).service.reassess('m-1', { version: 4 }, actor, NOW))).code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
  });
});
