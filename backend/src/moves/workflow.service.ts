import { Injectable } from '@nestjs/common';
import {
  assessmentDifferences, canTransition, DOMAIN_ERRORS, DomainError, formatZoned, MOVE_STAGE_LABELS, REOPEN_DELIVERED_DAYS, zonedTimeToUtc,
  type MoveDto, type MoveStage, type ReassessmentPreview, type ScheduleDto, type SessionUser, type UnmetCondition,
} from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { ReassessDto, ReopenDto, StageChangeDto } from './dto/move.dto';
import { summarize } from './assessment.service';
import { ScheduleService } from './schedule.service';
import { MoveExtensionsRegistry, type TransitionContext } from './move-extensions';
import { MovesRepository } from './moves.repository';
import { MovesService, toMoveDto } from './moves.service';

/**
 * The conditions the moves module itself checks; permits, escorts and run sheets add theirs as extensions. A move
 * runs only from its earliest legal departure on (the first legal travel window in the first state; the departure
 * date's local midnight there when no window is known).
 */
export function baseConditions(ctx: Pick<TransitionContext, 'move' | 'to' | 'assessment'>, now: Date): UnmetCondition[] {
  const out: UnmetCondition[] = [];
  const r = ctx.assessment.result;
  if (ctx.to === 'running') {
    if (!ctx.move.driverId) out.push({ code: 'driver_missing', message: 'assign a driver before the move runs' });
    const first = ctx.move.route[0];
    const tz = first?.timeZone ?? 'America/Chicago';
    const earliest = r.summary.earliestDeparture ? Date.parse(r.summary.earliestDeparture) : zonedMidnight(ctx.move.requestedDeparture, tz);
    if (now.getTime() < earliest) {
      out.push({
        code: 'before_earliest_departure',
        message: `the move cannot run before its earliest legal departure, ${formatZoned(earliest, tz)}${r.summary.earliestDepartureKnown ? '' : ' (travel rules of the first state not on file: the departure date)'}`,
      });
    }
    for (const s of r.securement) {
      if (!s.ok) out.push({ code: 'securement_short', message: `securement of ${s.articleId} falls short: ${s.findings.join('; ')}` });
    }
  }
  return out;
}

const zonedMidnight = (date: string, tz: string): number => zonedTimeToUtc(Date.parse(`${date}T00:00:00Z`) / 86_400_000, 0, tz);

@Injectable()
export class WorkflowService {
  constructor(
    private readonly repo: MovesRepository,
    private readonly moves: MovesService,
    private readonly audit: AuditService,
    private readonly extensions: MoveExtensionsRegistry,
    private readonly schedule: ScheduleService,
  ) {}

  async transition(id: string, dto: StageChangeDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    if (dto.to === 'cancelled' && !dto.reason?.trim()) throw fieldError('reason', 'say why the move is cancelled');
    await this.repo.transaction(async (manager) => {
      // the row lock makes two simultaneous transitions run one after the other: the second sees the first's result
      const move = await this.moves.lockForUpdate(manager, id, dto.version);
      if (!canTransition(move.stage, dto.to)) {
        const unmet = [{ code: 'not_a_step', message: `a move cannot go from ${MOVE_STAGE_LABELS[move.stage]} to ${MOVE_STAGE_LABELS[dto.to]}` }];
        throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, unmet[0].message, { unmet });
      }
      const assessment = await this.moves.assessmentOf(move, now, manager);
      const ctx: TransitionContext = { manager, move, to: dto.to, assessment, actor };
      const unmet: UnmetCondition[] = dto.to === 'cancelled' ? [] : [...baseConditions(ctx, now)];
      const notes: string[] = [];
      if (dto.to === 'running') {
        // the day plan's dates must agree with the travel windows, permits and escorts before the move rolls
        const s = await this.schedule.forMove(move, assessment, manager);
        for (const f of s.findings.filter((x) => x.blocking)) unmet.push({ code: `schedule_${f.code}`, message: `schedule: ${f.message}`, ...(f.jurisdiction ? { jurisdiction: f.jurisdiction } : {}) });
      }
      if (dto.to !== 'cancelled') {
        for (const ext of this.extensions.all()) {
          if (ext.unmetConditions) unmet.push(...(await ext.unmetConditions(ctx)));
        }
      }
      if (unmet.length) {
        throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, `Cannot move to ${MOVE_STAGE_LABELS[dto.to]}: ${unmet.map((u) => u.message).join('; ')}`, { unmet });
      }
      for (const ext of this.extensions.all()) if (ext.transitionNotes) notes.push(...(await ext.transitionNotes(ctx)));
      // leaving requested, the assessment keeps the rule versions it used: later rule edits change it only when re-assessed
      const pin = move.ruleVersions === null ? { ruleVersions: assessment.ruleVersions } : {};
      await this.repo.updateState(manager, id, { stage: dto.to, version: move.version + 1, updatedAt: now, stageChangedAt: now, ...pin });
      for (const ext of this.extensions.all()) if (ext.afterTransition) await ext.afterTransition({ ...ctx, from: move.stage });
      await this.audit.record(manager, {
        moveId: id, entity: 'move', entityId: id, action: 'stage', actorId: actor.id,
        before: { stage: move.stage }, after: { stage: dto.to, ruleVersions: assessment.ruleVersions, ...(notes.length ? { notes } : {}) },
        reason: dto.reason ?? null,
      });
    });
    return toMoveDto(await this.moves.get(id));
  }

  /**
   * Reopens a cancelled move (back to requested, assessed again with the current rules) or one delivered within
   * REOPEN_DELIVERED_DAYS (back to running). Always with a reason, in the audit trail.
   */
  async reopen(id: string, dto: ReopenDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    const reason = dto.reason?.trim();
    if (!reason) throw fieldError('reason', 'say why the move is reopened');
    await this.repo.transaction(async (manager) => {
      const move = await this.moves.lockForUpdate(manager, id, dto.version);
      let to: MoveStage;
      if (move.stage === 'cancelled') to = 'requested';
      else if (move.stage === 'delivered') {
        const since = move.stageChangedAt ?? move.updatedAt;
        const days = (now.getTime() - since.getTime()) / 86_400_000;
        if (days > REOPEN_DELIVERED_DAYS) {
          throw new DomainError(DOMAIN_ERRORS.TOO_LATE, `A move delivered more than ${REOPEN_DELIVERED_DAYS} days ago cannot be reopened (delivered ${since.toISOString().slice(0, 10)})`);
        }
        to = 'running';
      } else throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, `Only cancelled moves, or moves delivered within ${REOPEN_DELIVERED_DAYS} days, can be reopened; this one is ${MOVE_STAGE_LABELS[move.stage].toLowerCase()}`);
      const back = to === 'requested' ? { ruleVersions: null } : {};
      await this.repo.updateState(manager, id, { stage: to, version: move.version + 1, updatedAt: now, stageChangedAt: now, ...back });
      await this.audit.record(manager, {
        moveId: id, entity: 'move', entityId: id, action: 'reopened', actorId: actor.id, before: { stage: move.stage }, after: { stage: to }, reason,
      });
    });
    return toMoveDto(await this.moves.get(id));
  }

  /** The move's schedule check, as the move page shows it. */
  async scheduleOf(id: string, viewer: SessionUser, now: Date): Promise<ScheduleDto> {
    const move = await this.moves.get(id, viewer);
    return this.schedule.forMove(move, await this.moves.assessmentOf(move, now), this.repo.manager);
  }

  /** What re-assessing with the current rules would change (nothing is written). */
  async reassessmentPreview(id: string, viewer: SessionUser, now: Date): Promise<ReassessmentPreview> {
    const move = await this.moves.get(id, viewer);
    const kept = await this.moves.assessmentOf(move, now);
    const current = await this.moves.assessmentOf(move, now, undefined, { rules: 'current' });
    return {
      moveId: id,
      moveVersion: move.version,
      used: kept.ruleVersions,
      current: current.ruleVersions,
      differences: assessmentDifferences(kept.result, current.result),
      allowed: move.stage !== 'delivered' && move.stage !== 'cancelled' && move.ruleVersions !== null,
    };
  }

  /**
   * Moves a kept assessment to the current rule versions: never for delivered or cancelled moves. Audited with the
   * versions before and after and the differences; permits and the run sheet follow as after a plan change.
   */
  async reassess(id: string, dto: ReassessDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    await this.repo.transaction(async (manager) => {
      const move = await this.moves.lockForUpdate(manager, id, dto.version);
      if (move.stage === 'delivered' || move.stage === 'cancelled') throw new DomainError(DOMAIN_ERRORS.RECORD_CLOSED, `A ${MOVE_STAGE_LABELS[move.stage].toLowerCase()} move keeps its assessment; it is never re-assessed`);
      if (!move.ruleVersions) throw new DomainError(DOMAIN_ERRORS.PRECONDITION_UNMET, 'A requested move is always assessed with the current rules; nothing to re-assess');
      const kept = await this.moves.assessmentOf(move, now, manager);
      const current = await this.moves.assessmentOf(move, now, manager, { rules: 'current' });
      const differences = assessmentDifferences(kept.result, current.result);
      const written = { ruleVersions: current.ruleVersions, summary: summarize(current.result), version: move.version + 1, updatedAt: now };
      await this.repo.updateState(manager, id, written);
      await this.audit.record(manager, {
        moveId: id, entity: 'move', entityId: id, action: 'reassessed', actorId: actor.id,
        before: { ruleVersions: kept.ruleVersions }, after: { ruleVersions: current.ruleVersions, differences }, reason: dto.reason?.trim() || null,
      });
      // the move as just written (its equipment and driver did not change): no need to read it again
      const after = Object.assign(this.repo.copy(move), { tractor: move.tractor, trailer: move.trailer, driver: move.driver }, written);
      for (const ext of this.extensions.all()) await ext.onPlanChanged?.({ manager, before: move, after, changed: ['rule versions'], actor });
    });
    return toMoveDto(await this.moves.get(id));
  }
}
