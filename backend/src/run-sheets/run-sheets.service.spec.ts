import { DOMAIN_ERRORS, planCheck, SAMPLE_PLAN, type AssessmentDto, type CheckFinding, type SessionUser } from '@amberline/common';
import type { AuditService } from '../audit/audit.service';
import type { MailService } from '../mail/mail.service';
import type { Move } from '../moves/entities/move.entity';
import { MoveExtensionsRegistry } from '../moves/move-extensions';
import type { MovesRepository } from '../moves/moves.repository';
import type { MovesService } from '../moves/moves.service';
import type { DepartureChecks } from './entities/departure-checks.entity';
import { RunSheetSourcesRegistry } from './run-sheet-sources';
import type { RunSheetsRepository } from './run-sheets.repository';
import { RunSheetsService } from './run-sheets.service';
import { refusal } from '../../test/utils/refusal';

const NOW = new Date('2026-05-04T15:00:00Z');
const driver: SessionUser = { id: 'drv-1', role: 'driver', email: 'drv@amberline.example', name: 'Rae' };
const dispatcher: SessionUser = { id: 'u-1', role: 'dispatcher', email: 'd@amberline.example', name: 'Dee' };
const result = planCheck(SAMPLE_PLAN);
const assessment = { moveId: 'm-1', moveVersion: 4, computedAt: NOW.toISOString(), ruleVersions: {}, result } as unknown as AssessmentDto;

function move(over: Partial<Move> = {}): Move {
  return {
    id: 'm-1', reference: 'AM-2026-00001', stage: 'escorts_booked', version: 4, customer: 'Acme', customerRef: null, commodity: 'Dozer',
    articles: [], tractorId: 't-1', trailerId: 'r-1', driverId: 'drv-1', sliderSettingFt: null,
    tractor: { id: 't-1', unitNumber: 'T-1' }, trailer: { id: 'r-1', unitNumber: 'R-1', type: 'step_deck', spec: { gaugeCalibration: [], slider: null } },
    route: [], jurisdictions: ['TX'], origin: 'Austin', destination: 'Dallas', requestedDeparture: '2026-05-10', travelDays: 1, dailyMiles: null, notes: null,
    summary: {}, planRevision: 2, ruleVersions: { TX: 3 }, stageChangedAt: null, createdById: 'u-1',
    createdAt: new Date('2026-05-01T00:00:00Z'), updatedAt: new Date('2026-05-01T00:00:00Z'),
    ...over,
  } as unknown as Move;
}

const checks = (over: Partial<DepartureChecks> = {}): DepartureChecks =>
  ({ id: 'c-1', moveId: 'm-1', outcome: 'passed', findings: [] as CheckFinding[], fingerprint: 'fp', ...over }) as DepartureChecks;

function setup(current: Move = move()) {
  const manager = {} as never;
  const repo = {
    manager,
    transaction: jest.fn((fn: (m: unknown) => unknown) => fn(manager)),
    latest: jest.fn(async () => ({ checks: null, acknowledgement: null })),
    latestForFingerprint: jest.fn(async (): Promise<DepartureChecks | null> => checks()),
    voidAcknowledgements: jest.fn(),
    insertAcknowledgement: jest.fn(async () => ({ id: 'a-1' })),
    lockChecks: jest.fn(async (): Promise<DepartureChecks | null> => checks()),
    latestChecks: jest.fn(async (): Promise<DepartureChecks | null> => checks()),
    updateChecks: jest.fn(),
  };
  const moves = { lockForUpdate: jest.fn(async () => current), get: jest.fn(async () => current), assessmentOf: jest.fn(async () => assessment) };
  const service = new RunSheetsService(
    repo as unknown as RunSheetsRepository, moves as unknown as MovesService, {} as MovesRepository, { record: jest.fn() } as unknown as AuditService,
    new MoveExtensionsRegistry(), new RunSheetSourcesRegistry(), { enqueue: jest.fn() } as unknown as MailService,
  );
  return { service, repo, moves };
}

describe('RunSheetsService.acknowledge', () => {
  it('refuses a fingerprint that is not the current run sheet\'s: the run sheet changed', async () => {
    const { service, repo } = setup();
    const e = await refusal(service.acknowledge('m-1', { fingerprint: 'an-older-one' }, driver, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.RUN_SHEET_CHANGED);
    expect(repo.insertAcknowledgement).not.toHaveBeenCalled();
  });

  it('asks for departure checks first, and for checks that passed', async () => {
    const { service, repo } = setup();
    const fingerprint = await service.build('m-1', driver, NOW).then((s) => s.fingerprint);
    repo.latestForFingerprint.mockResolvedValueOnce(null);
    const none = await refusal(service.acknowledge('m-1', { fingerprint }, driver, NOW));
    expect(none.code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
    expect(none.message).toBe('Record the departure checks for this run sheet first');
    repo.latestForFingerprint.mockResolvedValueOnce(checks({ outcome: 'blocked' }));
    const blocked = await refusal(service.acknowledge('m-1', { fingerprint }, driver, NOW));
    expect(blocked.code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
    expect(repo.insertAcknowledgement).not.toHaveBeenCalled();
  });

  it('with passed checks for this version, replaces the standing acknowledgement, under the move\'s lock', async () => {
    const { service, repo, moves } = setup();
    const fingerprint = await service.build('m-1', driver, NOW).then((s) => s.fingerprint);
    await service.acknowledge('m-1', { fingerprint }, driver, NOW);
    expect(moves.lockForUpdate).toHaveBeenCalledWith(expect.anything(), 'm-1');
    expect(repo.voidAcknowledgements).toHaveBeenCalledWith(expect.anything(), 'm-1', NOW, 'replaced by a newer acknowledgement');
    expect(repo.insertAcknowledgement).toHaveBeenCalledWith(expect.anything(), expect.objectContaining({ moveId: 'm-1', driverId: 'drv-1', checksId: 'c-1', fingerprint }));
  });
});

describe('RunSheetsService.submitChecks', () => {
  it('departure checks are not taken for a move that is running (or not yet permitted)', async () => {
    for (const stage of ['running', 'requested'] as const) {
      const e = await refusal(setup(move({ stage })).service.submitChecks('m-1', {} as never, driver, NOW));
      expect(e.code).toBe(DOMAIN_ERRORS.PRECONDITION_UNMET);
    }
  });
});

describe('RunSheetsService.overrideChecks', () => {
  const gauge: CheckFinding = { code: 'gauge_differs', blocking: true, message: 'gauge estimate far off' };
  const tires: CheckFinding = { code: 'tires', blocking: true, message: 'tires are not confirmed properly inflated' };

  it('checks that are not the move\'s are not found; older checks give way to the newer ones', async () => {
    const { service, repo } = setup();
    repo.lockChecks.mockResolvedValueOnce(null);
    expect((await refusal(service.overrideChecks('m-1', 'c-9', 'scale ticket on file', dispatcher, NOW))).code).toBe(DOMAIN_ERRORS.NOT_FOUND);
    repo.lockChecks.mockResolvedValueOnce(checks({ outcome: 'blocked', findings: [gauge] }));
    repo.latestChecks.mockResolvedValueOnce(checks({ id: 'c-2' }));
    expect((await refusal(service.overrideChecks('m-1', 'c-1', 'scale ticket on file', dispatcher, NOW))).code).toBe(DOMAIN_ERRORS.VERSION_CONFLICT);
  });

  it('passed checks are already done, and only a gauge finding may be overridden', async () => {
    const { service, repo } = setup();
    expect((await refusal(service.overrideChecks('m-1', 'c-1', 'scale ticket on file', dispatcher, NOW))).code).toBe(DOMAIN_ERRORS.ALREADY_DONE);
    repo.lockChecks.mockResolvedValueOnce(checks({ outcome: 'blocked', findings: [gauge, tires] }));
    const e = await refusal(service.overrideChecks('m-1', 'c-1', 'scale ticket on file', dispatcher, NOW));
    expect(e.code).toBe(DOMAIN_ERRORS.TRANSITION_REFUSED);
    expect(e.message).toBe(`Only a gauge finding can be overridden; still blocking: ${tires.message}`);
    expect(repo.updateChecks).not.toHaveBeenCalled();
  });
});
