import { createHash } from 'node:crypto';
import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  assessedMarkings, blockingBeyondOverride, DOMAIN_ERRORS, DomainError, evaluateDepartureChecks, PLANNING_CAUTION, RULEBOOK_CAUTION,
  type AssessmentDto, type DepartureChecksDto, type RunSheetDto, type SessionUser, type UnmetCondition,
} from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { MailService } from '../mail/mail.service';
import { AppException, fieldError } from '../core/app-exception';
import { MoveExtensionsRegistry } from '../moves/move-extensions';
import { MovesRepository, type Move, type MoveTrailer } from '../moves/moves.repository';
import { MovesService, toMoveDto } from '../moves/moves.service';
import { AcknowledgeDto, DepartureChecksDtoIn } from './dto/run-sheet.dto';
import type { DepartureChecks } from './entities/departure-checks.entity';
import { RunSheetSourcesRegistry } from './run-sheet-sources';
import { RunSheetsRepository } from './run-sheets.repository';

export const RUN_SHEET_CAUTIONS = [
  'Measure the loaded height and width before departure.',
  'The permit, posted signs and officers on the road govern; follow the permitted route only.',
  'Check overhead and side clearances on the route; a height pole only warns, it does not clear.',
  'Weights here are planned or estimated: confirm them on a certified scale.',
  PLANNING_CAUTION,
  RULEBOOK_CAUTION,
];

const toChecksDto = (c: DepartureChecks): DepartureChecksDto => ({
  id: c.id,
  fingerprint: c.fingerprint,
  measuredHeightIn: c.measuredHeightIn,
  measuredWidthIn: c.measuredWidthIn,
  measuredLengthIn: c.measuredLengthIn,
  sliderPinsLocked: c.sliderPinsLocked,
  tiresInflated: c.tiresInflated,
  markingsInPlace: c.markingsInPlace,
  permitsOnBoard: c.permitsOnBoard,
  gaugeReadings: c.gaugeReadings,
  scaleWeights: c.scaleWeights ?? [],
  gaugeEstimates: c.gaugeEstimates,
  override: c.override ?? null,
  findings: c.findings,
  outcome: c.outcome,
  submittedAt: c.submittedAt.toISOString(),
  driver: { id: c.driverId, name: c.driver?.name ?? '' },
});

/** The driver's read-only brief, the departure checks and the acknowledgement that lets a move run. */
@Injectable()
export class RunSheetsService implements OnModuleInit {
  constructor(
    private readonly repo: RunSheetsRepository,
    private readonly moves: MovesService,
    private readonly movesRepo: MovesRepository,
    private readonly audit: AuditService,
    private readonly extensions: MoveExtensionsRegistry,
    private readonly sources: RunSheetSourcesRegistry,
    private readonly mail: MailService,
  ) {}

  onModuleInit(): void {
    this.extensions.register({
      name: 'run-sheets',
      unmetConditions: async (ctx) => (ctx.to === 'running' ? this.unmetForRunning(ctx.move, ctx.manager, ctx.assessment) : []),
      onPlanChanged: async (ctx) => {
        await this.repo.voidAcknowledgements(ctx.manager, ctx.after.id, new Date(), `plan changed (${ctx.changed.join(', ')}): a new acknowledgement is needed`);
      },
    });
  }

  /** A driver sees only the moves assigned to them (403 otherwise); office roles see every move. */
  private visibleTo(move: Move, viewer: SessionUser): Move {
    if (viewer.role === 'driver' && move.driverId !== viewer.id) throw new AppException(403, 'forbidden', 'This move is not assigned to you');
    return move;
  }

  private async load(moveId: string, viewer: SessionUser, manager?: EntityManager): Promise<Move> {
    return this.visibleTo(await this.moves.get(moveId, undefined, manager), viewer);
  }

  /**
   * `known` passes a move (and its assessment) the caller already holds (the workflow guard, an acknowledgement
   * under the move's lock), so they are not read twice; the caller has checked the viewer may see it.
   */
  async build(moveId: string, viewer: SessionUser, now: Date, manager: EntityManager = this.repo.manager, known?: { move: Move; assessment?: AssessmentDto }): Promise<RunSheetDto> {
    return (await this.compose(moveId, viewer, now, manager, known)).sheet;
  }

  /** The run sheet with the move and trailer it was built from. */
  private async compose(moveId: string, viewer: SessionUser, now: Date, manager: EntityManager, known?: { move: Move; assessment?: AssessmentDto }): Promise<{ sheet: RunSheetDto; move: Move; trailer: MoveTrailer }> {
    const move = known?.move ?? (await this.load(moveId, viewer, manager));
    const assessment = known?.assessment ?? (await this.moves.assessmentOf(move, now, manager));
    const r = assessment.result;
    const sources = this.sources.all();
    const permits = (await Promise.all(sources.map((s) => s.permits?.(move, manager) ?? []))).flat();
    const escorts = (await Promise.all(sources.map((s) => s.escorts?.(move, manager) ?? []))).flat();
    const permitted = (await Promise.all(sources.map((s) => s.permittedDimensions?.(move, manager) ?? null))).find((p) => p) ?? null;
    const { checks: latest, acknowledgement: ack } = await this.repo.latest(manager, moveId);
    const trailer = move.trailer ?? (await this.movesRepo.trailer(move.trailerId, manager));
    if (!trailer) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No trailer ${move.trailerId}`);
    const fingerprint = this.fingerprint(move, permits, escorts);
    const sheet: RunSheetDto = {
      move: toMoveDto(move),
      fingerprint,
      generatedAt: now.toISOString(),
      dimensions: r.dimensions,
      checkAgainst: permitted ? { ...permitted, source: 'permit' } : { heightIn: r.dimensions.heightIn, widthIn: r.dimensions.widthIn, lengthIn: r.dimensions.lengthIn, source: 'plan' },
      markings: assessedMarkings(r), // every state's assessed markings, merged: one line per item and place
      securement: r.securement,
      axles: { steerLb: r.axleLoads.steerLb, driveLb: r.axleLoads.driveLb, trailerLb: r.axleLoads.trailerLb, grossLb: r.axleLoads.grossLb, sliderSettingFt: move.sliderSettingFt, federal: r.federal },
      travel: r.jurisdictions.map((j) => ({ jurisdiction: j.code, name: j.name, days: j.travel })),
      earliestDeparture: r.summary.earliestDeparture,
      earliestDepartureKnown: r.summary.earliestDepartureKnown,
      openQuestions: r.summary.openQuestions,
      permits,
      escorts,
      gaugeCalibration: trailer.spec.gaugeCalibration,
      cautions: RUN_SHEET_CAUTIONS,
      latestChecks: latest ? toChecksDto(latest) : null,
      acknowledgement: ack && !ack.voidedAt ? { at: ack.acknowledgedAt.toISOString(), fingerprint: ack.fingerprint, current: ack.fingerprint === fingerprint } : null,
    };
    return { sheet, move, trailer };
  }

  fingerprint(move: Move, permits: unknown[], escorts: unknown[]): string {
    return createHash('sha256').update(JSON.stringify({ plan: move.planRevision, driver: move.driverId, permits, escorts })).digest('hex');
  }

  async submitChecks(moveId: string, dto: DepartureChecksDtoIn, driver: SessionUser, now: Date): Promise<DepartureChecksDto> {
    return this.repo.transaction(async (m) => {
      const { sheet, trailer } = await this.compose(moveId, driver, now, m);
      const move = sheet.move;
      if (move.stage !== 'permits_received' && move.stage !== 'escorts_booked') {
        throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, `Departure checks are taken before the move runs; this move is ${move.stage.replace('_', ' ')}`);
      }
      const { findings, gaugeEstimates, outcome } = evaluateDepartureChecks(
        dto,
        sheet.checkAgainst,
        { unitNumber: trailer.unitNumber, hasSlider: !!trailer.spec.slider, gaugeCalibration: trailer.spec.gaugeCalibration },
        sheet.axles.trailerLb,
      );
      const saved = await this.repo.insertChecks(m, {
        moveId, driverId: driver.id, fingerprint: sheet.fingerprint, ...dto, gaugeReadings: dto.gaugeReadings.map((g) => ({ group: g.group, psi: g.psi })),
        scaleWeights: (dto.scaleWeights ?? []).map((w) => ({ group: w.group, lb: w.lb, ...(w.ticket ? { ticket: w.ticket } : {}) })), gaugeEstimates, findings, outcome, override: null, submittedAt: now,
      });
      await this.audit.record(m, {
        moveId, entity: 'run_sheet', entityId: saved.id, action: outcome === 'blocked' ? 'departure_blocked' : 'departure_checks_passed', actorId: driver.id,
        after: { measured: { heightIn: dto.measuredHeightIn, widthIn: dto.measuredWidthIn, lengthIn: dto.measuredLengthIn }, findings: findings.map((f) => f.message) },
      });
      if (outcome === 'blocked') {
        // the dispatcher who opened the move (and every active admin) hears of it at once, through the outbox
        const emails = await this.repo.alertRecipients(m, moveId);
        if (emails.length) {
          await this.mail.enqueue(m, {
            to: emails,
            subject: `Departure blocked: ${move.reference} (${move.customer})`,
            text: `${driver.name || 'The driver'} recorded the departure checks for ${move.reference} and they block departure:\n\n${findings
              .filter((f) => f.blocking)
              .map((f) => `- ${f.message}`)
              .join('\n')}\n\nThe move cannot run until the checks pass and the driver acknowledges the run sheet again.`,
            related: { entity: 'departure_checks', id: saved.id },
          });
        }
      }
      return toChecksDto(await this.repo.checksWithDriver(saved.id, m));
    });
  }

  async acknowledge(moveId: string, dto: AcknowledgeDto, driver: SessionUser, now: Date): Promise<RunSheetDto> {
    await this.repo.transaction(async (m) => {
      const move = this.visibleTo(await this.moves.lockForUpdate(m, moveId), driver);
      const sheet = await this.build(moveId, driver, now, m, { move });
      if (dto.fingerprint !== sheet.fingerprint) {
        throw new DomainError(DOMAIN_ERRORS.RUN_SHEET_CHANGED, 'The run sheet changed since you opened it: reload it, read it again and acknowledge the new version');
      }
      const checks = await this.repo.latestForFingerprint(m, moveId, sheet.fingerprint);
      if (!checks) throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, 'Record the departure checks for this run sheet first');
      if (checks.outcome !== 'passed') throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, 'The last departure checks found a problem that blocks departure; resolve it and check again');
      await this.repo.voidAcknowledgements(m, moveId, now, 'replaced by a newer acknowledgement');
      const ack = await this.repo.insertAcknowledgement(m, { moveId, driverId: driver.id, checksId: checks.id, fingerprint: sheet.fingerprint, acknowledgedAt: now });
      await this.audit.record(m, { moveId, entity: 'run_sheet', entityId: ack.id, action: 'acknowledged', actorId: driver.id, after: { fingerprint: sheet.fingerprint, checksId: checks.id } });
    });
    return this.build(moveId, driver, now);
  }

  /**
   * A dispatcher lets the latest checks pass when what blocks them is only a gauge estimate far off the plan (the
   * dispatcher knows the weights another way), with a reason, in the audit trail. Any other blocking finding stays.
   */
  async overrideChecks(moveId: string, checksId: string, reason: string, actor: SessionUser, now: Date): Promise<DepartureChecksDto> {
    const why = reason.trim();
    if (!why) throw fieldError('reason', 'say why the checks may pass');
    await this.repo.transaction(async (m) => {
      const checks = await this.repo.lockChecks(m, moveId, checksId);
      if (!checks) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No departure checks ${checksId} for this move`);
      const latest = await this.repo.latestChecks(m, moveId);
      if (latest?.id !== checks.id) throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, 'Newer departure checks were recorded; override those if needed');
      if (checks.outcome === 'passed') throw new DomainError(DOMAIN_ERRORS.ALREADY_DONE, 'These checks already passed');
      const others = blockingBeyondOverride(checks.findings);
      if (others.length) throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, `Only a gauge finding can be overridden; still blocking: ${others.map((f) => f.message).join('; ')}`);
      const override = { by: { id: actor.id, name: actor.name }, reason: why, at: now.toISOString() };
      await this.repo.updateChecks(m, checks.id, { outcome: 'passed', override });
      await this.audit.record(m, {
        moveId, entity: 'run_sheet', entityId: checks.id, action: 'departure_checks_overridden', actorId: actor.id,
        before: { outcome: 'blocked' }, after: { outcome: 'passed', findings: checks.findings.filter((f) => f.blocking).map((f) => f.message) }, reason: why,
      });
    });
    return toChecksDto(await this.repo.checksWithDriver(checksId));
  }

  async checksHistory(moveId: string, viewer: SessionUser): Promise<DepartureChecksDto[]> {
    await this.load(moveId, viewer);
    return (await this.repo.history(moveId, 50)).map(toChecksDto);
  }

  private async unmetForRunning(move: Move, manager: EntityManager, assessment: AssessmentDto): Promise<UnmetCondition[]> {
    if (!move.driverId) return []; // the moves module already reports the missing driver
    const sheet = await this.build(move.id, { id: move.driverId, role: 'driver', email: '', name: '' }, new Date(assessment.computedAt), manager, { move, assessment });
    if (!sheet.acknowledgement) return [{ code: 'run_sheet_not_acknowledged', message: 'the driver has not acknowledged the run sheet after passing the departure checks' }];
    if (!sheet.acknowledgement.current) return [{ code: 'run_sheet_changed', message: 'the run sheet changed since the driver acknowledged it: a new acknowledgement is needed' }];
    return [];
  }
}
