import { createHash } from 'node:crypto';
import { Injectable, OnModuleInit } from '@nestjs/common';
import { DataSource, EntityManager, IsNull } from 'typeorm';
import {
  assessedMarkings, DEPARTURE_TOLERANCE_IN, estimateAxleLoadFromGauge, GAUGE_PLAN_DIFF_LIMIT, formatFeetInches, GAUGE_CAUTION, PLANNING_CAUTION, RULEBOOK_CAUTION,
  type AssessmentDto, type CheckFinding, type DepartureChecksDto, type RunSheetDto, type SessionUser, type UnmetCondition,
} from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { entityColumns, entityFromRow, preparedQuery } from '../database/prepared';
import { MailService } from '../mail/mail.service';
import { AppException, fieldError } from '../core/app-exception';
import { Trailer } from '../fleet/entities/trailer.entity';
import { User } from '../users/entities/user.entity';
import type { Move } from '../moves/entities/move.entity';
import { MoveExtensionsRegistry } from '../moves/move-extensions';
import { MovesService, toMoveDto } from '../moves/moves.service';
import { AcknowledgeDto, DepartureChecksDtoIn } from './dto/run-sheet.dto';
import { DepartureChecks } from './entities/departure-checks.entity';
import { RunSheetAcknowledgement } from './entities/run-sheet-acknowledgement.entity';
import { RunSheetSourcesRegistry } from './run-sheet-sources';

const lbs = (v: number): string => `${Math.round(v).toLocaleString('en-US')} lb`;

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
    private readonly ds: DataSource,
    private readonly moves: MovesService,
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
        await ctx.manager.update(RunSheetAcknowledgement, { moveId: ctx.after.id, voidedAt: IsNull() }, {
          voidedAt: new Date(), voidReason: `plan changed (${ctx.changed.join(', ')}): a new acknowledgement is needed`,
        });
      },
    });
  }

  /** A driver sees only the moves assigned to them (403 otherwise); office roles see every move. */
  private async load(moveId: string, viewer: SessionUser, manager?: EntityManager): Promise<Move> {
    const move = await this.moves.get(moveId, undefined, manager);
    if (viewer.role === 'driver' && move.driverId !== viewer.id) throw new AppException(403, 'forbidden', 'This move is not assigned to you');
    return move;
  }

  /** `known` passes a move and assessment the caller already holds (the workflow guard), so they are not read twice. */
  async build(moveId: string, viewer: SessionUser, now: Date, manager: EntityManager = this.ds.manager, known?: { move: Move; assessment: AssessmentDto }): Promise<RunSheetDto> {
    const move = known?.move ?? (await this.load(moveId, viewer, manager));
    const assessment = known?.assessment ?? (await this.moves.assessmentOf(move, now, manager));
    const r = assessment.result;
    const sources = this.sources.all();
    const permits = (await Promise.all(sources.map((s) => s.permits?.(move, manager) ?? []))).flat();
    const escorts = (await Promise.all(sources.map((s) => s.escorts?.(move, manager) ?? []))).flat();
    const permitted = (await Promise.all(sources.map((s) => s.permittedDimensions?.(move, manager) ?? null))).find((p) => p) ?? null;
    // the latest departure checks (with the driver who recorded them) and the latest acknowledgement, in one statement
    const [row] = await preparedQuery<Record<string, unknown>>(manager, this.latestSql(), [moveId]);
    const latest = row ? entityFromRow<DepartureChecks>(this.ds.getMetadata(DepartureChecks), row, 'c.') : null;
    if (latest) latest.driver = entityFromRow<User>(this.ds.getMetadata(User), row, 'd.') ?? undefined;
    const ack = row ? entityFromRow<RunSheetAcknowledgement>(this.ds.getMetadata(RunSheetAcknowledgement), row, 'a.') : null;
    const trailer = move.trailer ?? (await manager.findOneByOrFail(Trailer, { id: move.trailerId }));
    const fingerprint = this.fingerprint(move, permits, escorts);
    return {
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
  }

  private latestSqlText?: string;
  private latestSql(): string {
    return (this.latestSqlText ??= `
      SELECT ${entityColumns(this.ds.getMetadata(DepartureChecks), 'c', 'c.')}, ${entityColumns(this.ds.getMetadata(User), 'd', 'd.')},
             ${entityColumns(this.ds.getMetadata(RunSheetAcknowledgement), 'a', 'a.')}
        FROM (SELECT 1) one
        LEFT JOIN LATERAL (SELECT * FROM departure_checks WHERE move_id = $1 ORDER BY submitted_at DESC LIMIT 1) c ON true
        LEFT JOIN users d ON d.id = c.driver_id
        LEFT JOIN LATERAL (SELECT * FROM run_sheet_acknowledgements WHERE move_id = $1 ORDER BY acknowledged_at DESC LIMIT 1) a ON true`);
  }

  fingerprint(move: Move, permits: unknown[], escorts: unknown[]): string {
    return createHash('sha256').update(JSON.stringify({ plan: move.planRevision, driver: move.driverId, permits, escorts })).digest('hex');
  }

  async submitChecks(moveId: string, dto: DepartureChecksDtoIn, driver: SessionUser, now: Date): Promise<DepartureChecksDto> {
    return this.ds.transaction(async (m) => {
      const sheet = await this.build(moveId, driver, now, m);
      const move = sheet.move;
      if (move.stage !== 'permits_received' && move.stage !== 'escorts_booked') {
        throw new AppException(409, 'conflict', `Departure checks are taken before the move runs; this move is ${move.stage.replace('_', ' ')}`);
      }
      const findings: CheckFinding[] = [];
      const target = sheet.checkAgainst;
      const dims: [string, number, number, number][] = [
        ['height', dto.measuredHeightIn, target.heightIn, DEPARTURE_TOLERANCE_IN.height],
        ['width', dto.measuredWidthIn, target.widthIn, DEPARTURE_TOLERANCE_IN.width],
        ['length', dto.measuredLengthIn, target.lengthIn, DEPARTURE_TOLERANCE_IN.length],
      ];
      for (const [name, measured, planned, tol] of dims) {
        const over = measured - planned;
        if (over > tol) {
          findings.push({
            code: `${name}_over`, blocking: true,
            message: `measured ${name} ${formatFeetInches(measured)} is ${formatFeetInches(over)} over the ${target.source === 'permit' ? 'permitted' : 'planned'} ${formatFeetInches(planned)} (tolerance ${tol} in): do not depart; the dispatcher is alerted`,
          });
        } else if (-over > 3 * tol) {
          findings.push({ code: `${name}_under`, blocking: false, message: `measured ${name} ${formatFeetInches(measured)} is well under the ${target.source === 'permit' ? 'permitted' : 'planned'} ${formatFeetInches(planned)}: check the plan` });
        }
      }
      const trailer = await m.findOneByOrFail(Trailer, { id: move.trailerId });
      if (trailer.spec.slider && !dto.sliderPinsLocked) findings.push({ code: 'pins_unlocked', blocking: true, message: 'sliding-axle pins are not confirmed locked' });
      if (!dto.tiresInflated) findings.push({ code: 'tires', blocking: true, message: 'tires are not confirmed properly inflated' });
      if (!dto.markingsInPlace) findings.push({ code: 'markings', blocking: true, message: 'flags, signs and lamps are not confirmed in place' });
      if (!dto.permitsOnBoard) findings.push({ code: 'permits_on_board', blocking: true, message: 'permits are not confirmed on board' });
      const gaugeEstimates: DepartureChecksDto['gaugeEstimates'] = [];
      for (const g of dto.gaugeReadings) {
        if (trailer.spec.gaugeCalibration.length < 2) {
          findings.push({ code: 'gauge_uncalibrated', blocking: false, message: `trailer ${trailer.unitNumber} has fewer than two calibration readings: no estimate from the gauge` });
          continue;
        }
        const est = estimateAxleLoadFromGauge(g.psi, trailer.spec.gaugeCalibration, { plannedLb: sheet.axles.trailerLb });
        gaugeEstimates.push({ ...est, group: g.group, plannedLb: sheet.axles.trailerLb });
        const diff = est.loadLb - sheet.axles.trailerLb;
        const share = Math.abs(diff) / sheet.axles.trailerLb;
        if (share > GAUGE_PLAN_DIFF_LIMIT) {
          const scale = (dto.scaleWeights ?? []).find((w) => w.group === g.group);
          const what = `gauge estimate ${lbs(est.loadLb)} on the trailer group is ${Math.round(share * 100)} % off the planned ${lbs(sheet.axles.trailerLb)} (limit ${Math.round(GAUGE_PLAN_DIFF_LIMIT * 100)} %, common practice)`;
          findings.push(
            scale
              ? { code: 'gauge_differs_scaled', blocking: false, message: `${what}; certified scale weight recorded: ${lbs(scale.lb)}${scale.ticket ? ` (ticket ${scale.ticket})` : ''}` }
              : { code: 'gauge_differs', blocking: true, message: `${what}: weigh the group on a certified scale and record it, or ask the dispatcher to override with a reason` },
          );
        } else if (share > 0.1) {
          findings.push({ code: 'gauge_note', blocking: false, message: `gauge estimate ${lbs(est.loadLb)} on the trailer group differs from the plan by ${Math.round(diff).toLocaleString('en-US')} lb: ${GAUGE_CAUTION.toLowerCase()}` });
        }
        for (const w of est.warnings) findings.push({ code: 'gauge_warning', blocking: false, message: w });
      }
      const outcome = findings.some((f) => f.blocking) ? 'blocked' : 'passed';
      const saved = await m.save(m.create(DepartureChecks, {
        moveId, driverId: driver.id, fingerprint: sheet.fingerprint, ...dto, gaugeReadings: dto.gaugeReadings.map((g) => ({ group: g.group, psi: g.psi })),
        scaleWeights: (dto.scaleWeights ?? []).map((w) => ({ group: w.group, lb: w.lb, ...(w.ticket ? { ticket: w.ticket } : {}) })), gaugeEstimates, findings, outcome, override: null, submittedAt: now,
      }));
      await this.audit.record(m, {
        moveId, entity: 'run_sheet', entityId: saved.id, action: outcome === 'blocked' ? 'departure_blocked' : 'departure_checks_passed', actorId: driver.id,
        after: { measured: { heightIn: dto.measuredHeightIn, widthIn: dto.measuredWidthIn, lengthIn: dto.measuredLengthIn }, findings: findings.map((f) => f.message) },
      });
      if (outcome === 'blocked') {
        // the dispatcher who opened the move (and every active admin) hears of it at once, through the outbox
        const [row] = await m.query(
          `SELECT array_remove(array_agg(DISTINCT u.email), NULL) AS emails FROM users u
            WHERE u.active AND (u.id = (SELECT created_by FROM moves WHERE id = $1) OR u.role = 'admin')`,
          [moveId],
        );
        if (row?.emails?.length) {
          await this.mail.enqueue(m, {
            to: row.emails,
            subject: `Departure blocked: ${move.reference} (${move.customer})`,
            text: `${driver.name || 'The driver'} recorded the departure checks for ${move.reference} and they block departure:\n\n${findings
              .filter((f) => f.blocking)
              .map((f) => `- ${f.message}`)
              .join('\n')}\n\nThe move cannot run until the checks pass and the driver acknowledges the run sheet again.`,
            related: { entity: 'departure_checks', id: saved.id },
          });
        }
      }
      const full = await m.findOneOrFail(DepartureChecks, { where: { id: saved.id }, relations: { driver: true } });
      return toChecksDto(full);
    });
  }

  async acknowledge(moveId: string, dto: AcknowledgeDto, driver: SessionUser, now: Date): Promise<RunSheetDto> {
    await this.ds.transaction(async (m) => {
      await m.query(`SELECT id FROM moves WHERE id = $1 FOR UPDATE`, [moveId]);
      const sheet = await this.build(moveId, driver, now, m);
      if (dto.fingerprint !== sheet.fingerprint) {
        throw new AppException(409, 'conflict', 'The run sheet changed since you opened it: reload it, read it again and acknowledge the new version');
      }
      const checks = await m.findOne(DepartureChecks, { where: { moveId, fingerprint: sheet.fingerprint }, order: { submittedAt: 'DESC' } });
      if (!checks) throw new AppException(409, 'conflict', 'Record the departure checks for this run sheet first');
      if (checks.outcome !== 'passed') throw new AppException(409, 'conflict', 'The last departure checks found a problem that blocks departure; resolve it and check again');
      await m.update(RunSheetAcknowledgement, { moveId, voidedAt: IsNull() }, { voidedAt: now, voidReason: 'replaced by a newer acknowledgement' });
      const ack = await m.save(m.create(RunSheetAcknowledgement, { moveId, driverId: driver.id, checksId: checks.id, fingerprint: sheet.fingerprint, acknowledgedAt: now }));
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
    await this.ds.transaction(async (m) => {
      const checks = await m.findOne(DepartureChecks, { where: { id: checksId, moveId }, lock: { mode: 'pessimistic_write' } });
      if (!checks) throw new AppException(404, 'not_found', `No departure checks ${checksId} for this move`);
      const latest = await m.findOne(DepartureChecks, { where: { moveId }, order: { submittedAt: 'DESC' } });
      if (latest?.id !== checks.id) throw new AppException(409, 'conflict', 'Newer departure checks were recorded; override those if needed');
      if (checks.outcome === 'passed') throw new AppException(409, 'conflict', 'These checks already passed');
      const others = checks.findings.filter((f) => f.blocking && f.code !== 'gauge_differs');
      if (others.length) throw new AppException(409, 'conflict', `Only a gauge finding can be overridden; still blocking: ${others.map((f) => f.message).join('; ')}`);
      const override = { by: { id: actor.id, name: actor.name }, reason: why, at: now.toISOString() };
      await m.update(DepartureChecks, { id: checks.id }, { outcome: 'passed', override });
      await this.audit.record(m, {
        moveId, entity: 'run_sheet', entityId: checks.id, action: 'departure_checks_overridden', actorId: actor.id,
        before: { outcome: 'blocked' }, after: { outcome: 'passed', findings: checks.findings.filter((f) => f.blocking).map((f) => f.message) }, reason: why,
      });
    });
    const full = await this.ds.getRepository(DepartureChecks).findOneOrFail({ where: { id: checksId }, relations: { driver: true } });
    return toChecksDto(full);
  }

  async checksHistory(moveId: string, viewer: SessionUser): Promise<DepartureChecksDto[]> {
    await this.load(moveId, viewer);
    const rows = await this.ds.getRepository(DepartureChecks).find({ where: { moveId }, relations: { driver: true }, order: { submittedAt: 'DESC' }, take: 50 });
    return rows.map(toChecksDto);
  }

  private async unmetForRunning(move: Move, manager: EntityManager, assessment: AssessmentDto): Promise<UnmetCondition[]> {
    if (!move.driverId) return []; // the moves module already reports the missing driver
    const sheet = await this.build(move.id, { id: move.driverId, role: 'driver', email: '', name: '' }, new Date(assessment.computedAt), manager, { move, assessment });
    if (!sheet.acknowledgement) return [{ code: 'run_sheet_not_acknowledged', message: 'the driver has not acknowledged the run sheet after passing the departure checks' }];
    if (!sheet.acknowledgement.current) return [{ code: 'run_sheet_changed', message: 'the run sheet changed since the driver acknowledged it: a new acknowledgement is needed' }];
    return [];
  }
}
