import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  canPermitTransition, cents, DOMAIN_ERRORS, DomainError, factsFromAssessment, instantToLocal, PERMIT_STATUS_LABELS, PERMIT_STATUSES, permittedDifferences, zoneOf,
  type AssessmentDto, type AssignPermitsResponse, type PermitDto, type PermitOverviewDto, type PermitsPage, type PermitStatus,
  type SessionUser, type SyncPermitsResponse, type UnmetCondition,
  type PermitConditions, type PermitTerms, checkPermitTravelTerms, datesByState, formatZoned, validityGaps,
} from '@amberline/common';
import { AuditService, diff } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { MoveExtensionsRegistry, type PlanChangeContext, type TransitionContext } from '../moves/move-extensions';
import { MovesService } from '../moves/moves.service';
import { planOf } from '../moves/schedule.service';
import { AssignPermitsDto, ListPermitsQuery, UpdatePermitDto } from './dto/permit.dto';
import type { Permit } from './entities/permit.entity';
import { snapshotOf, toDocumentDto, toPaymentDto, toSummaryDto, toVersionDto } from './permit-mappers';
import { localInstantOf } from './permit-input';
import { ACTIVE_MOVE_STAGES, PermitsRepository } from './permits.repository';

export { ACTIVE_MOVE_STAGES };

/** A move as the moves module hands it over. */
type MoveRecord = Awaited<ReturnType<MovesService['get']>>;
/** A permit with its move's driver and reference (see PermitsRepository.findWithMove). */
type PermitWithMove = Permit & { moveDriverId: string | null; moveReference: string };

type Change = { action: string; reason?: string | null };

@Injectable()
export class PermitsService implements OnModuleInit {
  constructor(
    private readonly repo: PermitsRepository,
    private readonly audit: AuditService,
    private readonly moves: MovesService,
    private readonly registry: MoveExtensionsRegistry,
  ) {}

  onModuleInit(): void {
    this.registry.register({
      name: 'permits',
      unmetConditions: (ctx) => this.unmetConditions(ctx),
      permitTerms: (move, manager) => this.permitTerms(move.id, manager),
      scheduleFacts: async ({ manager, move }) => {
        const rows = await this.repo.issuedValidity(manager, move.id);
        return { permits: Object.fromEntries(rows.map((r) => [r.jurisdiction, { validFrom: new Date(r.valid_from).toISOString(), validTo: new Date(r.valid_to).toISOString() }])) };
      },
      onPlanChanged: (ctx) => this.onPlanChanged(ctx),
      afterTransition: (ctx) => (ctx.to === 'cancelled' ? this.voidForCancelledMove(ctx.manager, ctx.move.id, ctx.actor) : Promise.resolve()),
    });
  }

  // ---------------------------------------------------------------- reading

  /**
   * The recorded terms of the move's issued permits, by state: what governs travel and escorts there. Escorts count
   * only when the clerk recorded both front and rear.
   */
  async permitTerms(moveId: string, manager?: EntityManager): Promise<Record<string, PermitTerms>> {
    const rows = await this.repo.issuedTerms(moveId, manager);
    const out: Record<string, PermitTerms> = {};
    for (const r of rows) {
      const c = r.conditions ?? {};
      const hasEscorts = c.escortsFront !== undefined && c.escortsRear !== undefined;
      if (!c.travel && !hasEscorts && c.maxSpeedMph === undefined) continue;
      out[r.jurisdiction] = {
        label: `${r.jurisdiction} permit ${r.permit_number ?? '(no number)'}`,
        issuedOn: r.issued_at ? instantToLocal(new Date(r.issued_at), zoneOf(r.jurisdiction)).slice(0, 10) : 'date not recorded',
        ...(c.travel ? { travel: c.travel } : {}),
        ...(hasEscorts ? { escorts: { front: c.escortsFront!, rear: c.escortsRear!, ...(c.heightPole !== undefined ? { heightPole: c.heightPole } : {}) } } : {}),
        ...(c.maxSpeedMph !== undefined ? { maxSpeedMph: c.maxSpeedMph } : {}),
      };
    }
    return out;
  }

  async list(q: ListPermitsQuery, viewer: SessionUser, now: Date): Promise<PermitsPage> {
    const assignee = q.assignee === 'me' ? viewer.id : q.assignee;
    const { rows, total } = await this.repo.page({ status: q.status, jurisdiction: q.jurisdiction, moveId: q.moveId, assignee }, q.sort, q.page, q.pageSize);
    return { items: rows.map((r) => toSummaryDto(r, now)), total, page: q.page, pageSize: q.pageSize };
  }

  async overview(now: Date): Promise<PermitOverviewDto> {
    const counts = Object.fromEntries(PERMIT_STATUSES.map((s) => [s, 0])) as Record<PermitStatus, number>;
    for (const r of await this.repo.countsByStatus()) counts[r.status] = r.n;
    const expiring = await this.repo.expiringSoon(now);
    const amend = await this.repo.needingAmendment();
    // overdue: the file-by date (see fileByDate) is before today's date
    const overdue = await this.repo.countPastFileBy(now.toISOString().slice(0, 10));
    return { counts, overdue, expiringSoon: expiring.map((r) => toSummaryDto(r, now)), needsAmendment: amend.map((r) => toSummaryDto(r, now)) };
  }

  /** The permit row, 404 when missing or (for a driver) not on one of their moves. */
  async load(id: string, viewer?: SessionUser, manager?: EntityManager): Promise<PermitWithMove> {
    const p = await this.repo.findWithMove(id, manager);
    if (!p || (viewer?.role === 'driver' && p.moveDriverId !== viewer.id)) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No permit ${id}`);
    return p;
  }

  async get(id: string, viewer: SessionUser, now: Date): Promise<PermitDto> {
    const p = await this.load(id, viewer);
    return (await this.details([p], now))[0];
  }

  async forMove(moveId: string, viewer: SessionUser, now: Date): Promise<PermitDto[]> {
    await this.moves.get(moveId, viewer);
    return this.details(await this.repo.ofMoveWithMove(moveId), now);
  }

  private async details(list: PermitWithMove[], now: Date): Promise<PermitDto[]> {
    if (!list.length) return [];
    const ids = list.map((p) => p.id);
    const rows = new Map((await this.repo.summariesByIds(ids)).map((r) => [r.id, r]));
    const docs = await this.repo.documentsOf(ids);
    const pays = await this.repo.paymentsOf(ids);
    const versions = await this.repo.versionsOf(ids);
    return list.map((p) => {
      const tz = zoneOf(p.jurisdiction);
      const ctx = { moveReference: p.moveReference, jurisdiction: p.jurisdiction, permitNumber: p.permitNumber };
      return {
        ...toSummaryDto(rows.get(p.id)!, now),
        filedAt: p.filedAt?.toISOString() ?? null,
        issuedAt: p.issuedAt?.toISOString() ?? null,
        validFromLocal: p.validFrom ? instantToLocal(p.validFrom, tz) : null,
        validToLocal: p.validTo ? instantToLocal(p.validTo, tz) : null,
        permitted: p.permitted,
        routeText: p.routeText,
        conditions: p.conditions ?? {},
        conditionsText: p.conditionsText,
        notes: p.notes,
        refundable: p.refundable,
        ruleVersion: p.ruleVersion,
        needed: p.needed,
        documents: docs.filter((d) => d.permitId === p.id).map(toDocumentDto),
        payments: pays.filter((x) => x.permitId === p.id).map((x) => toPaymentDto(x, ctx)),
        history: versions.filter((v) => v.permitId === p.id).map(toVersionDto),
      };
    });
  }

  // ---------------------------------------------------------------- writing

  /** Saves a changed permit: version up, a history snapshot, and the audit entry, all in `m`'s transaction. */
  private async saveChange(m: EntityManager, before: Permit, after: Permit, actor: SessionUser | null, change: Change, now: Date): Promise<void> {
    const b = snapshotOf(before);
    const a = snapshotOf(after);
    const d = diff(b, a);
    if (!Object.keys(d.after).length) return;
    after.version = before.version + 1;
    after.updatedAt = now;
    if (!(await this.repo.updateVersioned(m, before, after, now))) throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, 'This permit was changed by someone else; reload it');
    await this.repo.insertVersion(m, { permitId: after.id, version: after.version, status: after.status, snapshot: a, reason: change.reason ?? null, createdById: actor?.id ?? null });
    await this.audit.record(m, {
      moveId: after.moveId, entity: 'permit', entityId: after.id, action: change.action, actorId: actor?.id ?? null, before: d.before, after: { jurisdiction: after.jurisdiction, ...d.after }, reason: change.reason ?? null,
    });
  }

  async syncForMove(moveId: string, actor: SessionUser, now: Date): Promise<SyncPermitsResponse> {
    const out = await this.repo.transaction(async (m) => {
      const locked = await this.repo.lockMove(m, moveId);
      if (!locked) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No move ${moveId}`);
      if (locked.stage === 'delivered' || locked.stage === 'cancelled') throw new DomainError(DOMAIN_ERRORS.RECORD_CLOSED, `A ${locked.stage} move needs no permits`);
      const move = await this.moves.get(moveId, undefined, m);
      const assessment = await this.moves.assessmentOf(move, now, m);
      return this.syncInTx(m, move, assessment, actor, now, 'from the assessment');
    });
    const rows = await this.repo.liveSummariesOfMove(moveId);
    return { ...out, permits: rows.map((r) => toSummaryDto(r, now)) };
  }

  /**
   * Makes the move's permits follow its assessment: a permit for every jurisdiction that needs one, estimates and
   * lead times refreshed, filed or issued permits whose figures no longer cover the plan flagged for amendment,
   * open permits no longer needed voided.
   */
  async syncInTx(m: EntityManager, move: MoveRecord, assessment: AssessmentDto, actor: SessionUser | null, now: Date, why: string): Promise<{ created: number; updated: number }> {
    const live = await this.repo.lockLiveOfMove(m, move.id);
    const byCode = new Map(live.map((p) => [p.jurisdiction, p]));
    let created = 0;
    let updated = 0;
    for (const j of assessment.result.jurisdictions) {
      const existing = byCode.get(j.code);
      byCode.delete(j.code);
      const estimate = j.fee?.known ? cents(j.fee.totalUsd) : null;
      const refundable = j.fee?.known ? j.fee.refundable : null;
      // a lead time not on file is kept as such: 0 days (file by the departure at the latest), marked unknown
      const leadTime = { leadTimeDays: j.permit.leadTimeDays ?? 0, leadTimeKnown: j.permit.leadTimeDays !== null };
      const ruleVersion = assessment.ruleVersions[j.code] ?? null;
      if (j.permitRequired && !existing) {
        const roads = move.route.filter((s) => s.jurisdiction === j.code).map((s) => `${s.roads} (${s.miles} mi)`).join('; ');
        const saved = await this.repo.insert(m, {
          moveId: move.id,
          jurisdiction: j.code,
          permitType: j.superload.isSuperload ? 'superload' : 'single_trip',
          status: 'to_file',
          version: 1,
          needed: true,
          estimatedFeeCents: estimate,
          refundable,
          ruleVersion,
          ...leadTime,
          routeText: roads || null,
          // escorts not on file are left for the clerk to record from the issued permit (never pre-filled as 0)
          conditions: j.escorts.known
            ? { escortsKnown: true, escortsFront: j.escorts.front, escortsRear: j.escorts.rear, heightPole: j.escorts.heightPole }
            : { escortsKnown: false },
        });
        await this.repo.insertVersion(m, { permitId: saved.id, version: 1, status: 'to_file', snapshot: snapshotOf(saved), reason: why, createdById: actor?.id ?? null });
        await this.audit.record(m, {
          moveId: move.id, entity: 'permit', entityId: saved.id, action: 'created', actorId: actor?.id ?? null,
          after: { jurisdiction: j.code, status: 'to_file', estimatedFeeCents: estimate, ruleVersion }, reason: why,
        });
        created++;
        continue;
      }
      if (!existing) continue;
      const next = this.repo.copy(existing);
      const reasons: string[] = [];
      if (!j.permitRequired) {
        next.needed = false;
        if (existing.status === 'to_file' || existing.status === 'rejected') next.status = 'void';
        else if (existing.status !== 'needs_amendment') reasons.push('the plan no longer needs a permit here; void it once the state agrees');
      } else {
        next.needed = true;
      }
      if (existing.status === 'to_file' || existing.status === 'rejected') {
        next.estimatedFeeCents = estimate;
        next.refundable = refundable;
        next.ruleVersion = ruleVersion;
      }
      Object.assign(next, leadTime);
      if (j.permitRequired && existing.permitted && (existing.status === 'filed' || existing.status === 'issued' || existing.status === 'needs_amendment')) {
        reasons.push(...permittedDifferences(existing.permitted, factsFromAssessment(assessment, j.code, move.planRevision)));
        if (existing.validFrom && existing.validTo && existing.status !== 'filed') {
          const tz = zoneOf(j.code);
          const inState = datesByState(planOf(move))[j.code] ?? [];
          const gaps = validityGaps(j.travel.filter((d) => inState.includes(d.date)), existing.validFrom, existing.validTo, (d) => formatZoned(d.getTime(), tz));
          if (gaps.length) reasons.push(`validity no longer covers the planned travel: ${gaps.map((g) => g.message).join('; ')}`);
        }
      }
      if (reasons.length && existing.status !== 'void') {
        next.status = 'needs_amendment';
        next.amendmentReason = reasons.join('; ');
      }
      const before = snapshotOf(existing);
      if (JSON.stringify(before) !== JSON.stringify(snapshotOf(next))) {
        await this.saveChange(m, existing, next, actor, { action: next.status === 'needs_amendment' && existing.status !== 'needs_amendment' ? 'flagged_for_amendment' : next.status === 'void' ? 'voided' : 'synced', reason: reasons.length ? `${why}: ${reasons.join('; ')}` : why }, now);
        updated++;
      }
    }
    // jurisdictions no longer on the route at all
    for (const existing of byCode.values()) {
      const next = this.repo.copy(existing, { needed: false });
      if (existing.status === 'to_file' || existing.status === 'rejected') next.status = 'void';
      else if (existing.status !== 'needs_amendment') {
        next.status = 'needs_amendment';
        next.amendmentReason = `${existing.jurisdiction} is no longer on the route; void this permit once the state agrees`;
      }
      await this.saveChange(m, existing, next, actor, { action: next.status === 'void' ? 'voided' : 'flagged_for_amendment', reason: `${why}: no longer on the route` }, now);
      updated++;
    }
    return { created, updated };
  }

  async update(id: string, dto: UpdatePermitDto, actor: SessionUser, now: Date): Promise<PermitDto> {
    await this.repo.transaction(async (m) => {
      const before = await this.repo.lock(m, id);
      if (!before) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No permit ${id}`);
      if (before.version !== dto.version) {
        throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, `This permit was changed by someone else (version ${before.version}, yours ${dto.version}); reload it`, { currentVersion: before.version });
      }
      if (before.status === 'void') throw new DomainError(DOMAIN_ERRORS.RECORD_CLOSED, 'A void permit cannot be changed');
      const tz = zoneOf(before.jurisdiction);
      const next = this.repo.copy(before);
      if (dto.permitType !== undefined) next.permitType = dto.permitType;
      if (dto.permitNumber !== undefined) next.permitNumber = dto.permitNumber?.trim() || null;
      if (dto.issuedAt !== undefined) next.issuedAt = dto.issuedAt ? new Date(dto.issuedAt) : null;
      if (dto.validFrom !== undefined) next.validFrom = dto.validFrom ? localInstantOf(dto.validFrom, tz, 'validFrom') : null;
      if (dto.validTo !== undefined) next.validTo = dto.validTo ? localInstantOf(dto.validTo, tz, 'validTo') : null;
      if (dto.routeText !== undefined) next.routeText = dto.routeText?.trim() || null;
      if (dto.conditions !== undefined) {
        const conditions: PermitConditions = JSON.parse(JSON.stringify(dto.conditions));
        if (conditions.travel !== undefined) {
          try {
            conditions.travel = checkPermitTravelTerms(conditions.travel, 'conditions.travel');
          } catch (e) {
            throw fieldError((e as Error).message.split(' ')[0], (e as Error).message);
          }
        }
        next.conditions = conditions;
      }
      if (dto.conditionsText !== undefined) next.conditionsText = dto.conditionsText?.trim() || null;
      if (dto.actualFeeUsd !== undefined) next.actualFeeCents = dto.actualFeeUsd === null ? null : cents(dto.actualFeeUsd);
      if (dto.notes !== undefined) next.notes = dto.notes?.trim() || null;
      if (dto.assigneeId !== undefined) {
        if (dto.assigneeId) await this.checkAssignee(m, dto.assigneeId, 'assigneeId');
        next.assigneeId = dto.assigneeId;
      }
      if (next.validFrom && next.validTo && next.validTo <= next.validFrom) throw fieldError('validTo', 'must be after validFrom');
      if (dto.validFrom !== undefined || dto.validTo !== undefined) next.expiryWarning = null;
      let action = 'updated';
      if (dto.status && dto.status !== before.status) {
        if (!canPermitTransition(before.status, dto.status)) {
          throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, `A permit cannot go from ${PERMIT_STATUS_LABELS[before.status]} to ${PERMIT_STATUS_LABELS[dto.status]}`);
        }
        if ((dto.status === 'rejected' || dto.status === 'void' || dto.status === 'needs_amendment') && !dto.reason?.trim()) {
          throw fieldError('reason', `say why the permit is ${PERMIT_STATUS_LABELS[dto.status].toLowerCase()}`);
        }
        next.status = dto.status;
        action = dto.status;
        if (dto.status === 'filed') {
          // the figures the state is asked to permit: the plan as it stands now
          const move = await this.moves.get(before.moveId, undefined, m);
          const assessment = await this.moves.assessmentOf(move, now, m);
          next.permitted = factsFromAssessment(assessment, before.jurisdiction, move.planRevision);
          next.filedAt = now;
          const j = assessment.result.jurisdictions.find((x) => x.code === before.jurisdiction);
          if (j?.fee) next.estimatedFeeCents = j.fee.known ? cents(j.fee.totalUsd) : null;
        }
        if (dto.status === 'issued') {
          if (!next.permitNumber) throw fieldError('permitNumber', 'record the permit number the state issued');
          if (!next.validFrom) throw fieldError('validFrom', 'record when the permit becomes valid');
          if (!next.validTo) throw fieldError('validTo', 'record when the permit expires');
          next.issuedAt = next.issuedAt ?? now;
          next.amendmentReason = null;
        }
        if (dto.status === 'needs_amendment') next.amendmentReason = dto.reason!.trim();
        if (dto.status === 'to_file') next.filedAt = null;
      }
      await this.saveChange(m, before, next, actor, { action, reason: dto.reason?.trim() ?? null }, now);
    });
    return this.get(id, actor, now);
  }

  /** Who permits can be assigned to: active permit clerks and admins. */
  assignees(): Promise<{ id: string; name: string; role: string }[]> {
    return this.repo.assignees();
  }

  private async checkAssignee(m: EntityManager, userId: string, field: string): Promise<void> {
    const u = await this.repo.user(m, userId);
    if (!u || !u.active || (u.role !== 'permit_clerk' && u.role !== 'admin')) throw fieldError(field, 'no active permit clerk or admin with this id');
  }

  async assign(dto: AssignPermitsDto, actor: SessionUser, now: Date): Promise<AssignPermitsResponse> {
    const ids = [...new Set(dto.permitIds)];
    return this.repo.transaction(async (m) => {
      if (dto.assigneeId) await this.checkAssignee(m, dto.assigneeId, 'assigneeId');
      const list = await this.repo.lockMany(m, ids);
      const found = new Set(list.map((p) => p.id));
      const missing = ids.filter((i) => !found.has(i));
      if (missing.length) throw fieldError('permitIds', `no permit ${missing.join(', ')}`);
      let updated = 0;
      for (const p of list) {
        if (p.status === 'void' || p.assigneeId === dto.assigneeId) continue;
        await this.saveChange(m, p, this.repo.copy(p, { assigneeId: dto.assigneeId }), actor, { action: 'assigned' }, now);
        updated++;
      }
      return { updated };
    });
  }

  // ---------------------------------------------------------------- the move's workflow

  /** A cancelled move's open permits are voided in the cancelling transaction (refunds stay a clerk's decision). */
  private async voidForCancelledMove(m: EntityManager, moveId: string, actor: SessionUser): Promise<void> {
    const now = new Date();
    const open = await this.repo.lockLiveOfMove(m, moveId);
    for (const p of open) {
      await this.saveChange(m, p, this.repo.copy(p, { status: 'void' }), actor, { action: 'voided', reason: 'the move was cancelled' }, now);
    }
  }

  private async onPlanChanged(ctx: PlanChangeContext): Promise<void> {
    const now = new Date();
    const any = await this.repo.countLiveOfMove(ctx.manager, ctx.after.id);
    if (!any) return; // permits not created yet: nothing to follow
    const assessment = await this.moves.assessmentOf(ctx.after, now, ctx.manager);
    await this.syncInTx(ctx.manager, ctx.after, assessment, ctx.actor, now, `plan changed (${ctx.changed.join(', ')})`);
  }

  /**
   * To receive permits: every jurisdiction that needs a permit has one that is issued, has its PDF, is paid, and
   * whose validity covers the planned travel days. One line per missing thing. Before the move runs the permits it
   * has are checked again (one flagged for amendment, unpaid or expired holds the move back).
   */
  async unmetConditions(ctx: TransitionContext, now = new Date()): Promise<UnmetCondition[]> {
    if (ctx.to === 'escorts_booked') return this.escortsAnsweredByPermits(ctx);
    if (ctx.to !== 'permits_received' && ctx.to !== 'running') return [];
    const needed = ctx.assessment.result.summary.permitsNeeded;
    if (!needed.length) return [];
    const rows = await this.repo.liveWithPaid(ctx.manager, ctx.move.id);
    const out: UnmetCondition[] = [];
    for (const code of needed) {
      const p = rows.find((r) => r.jurisdiction === code);
      const push = (c: string, message: string) => out.push({ code: c, jurisdiction: code, message: `${code} permit: ${message}` });
      if (!p) {
        // before the run, the permits were checked at permits_received; a move that got there another way is not
        // held back here for permits that were never created
        if (ctx.to === 'permits_received') push('permit_missing', 'not created yet (create permits from the assessment)');
        continue;
      }
      if (p.status !== 'issued') push('permit_not_issued', `is ${PERMIT_STATUS_LABELS[p.status].toLowerCase()}, not issued${p.amendment_reason ? ` (${p.amendment_reason})` : ''}`);
      if (p.document_count === 0) push('permit_pdf_missing', 'no permit PDF attached');
      if (!p.paid_any) push('permit_unpaid', p.payment_status === 'processing' ? 'fee payment not confirmed yet' : 'fee not paid');
      if (!p.valid_from || !p.valid_to) {
        if (p.status === 'issued') push('permit_validity', 'no validity window recorded');
      } else {
        const tz = zoneOf(code);
        const from = new Date(p.valid_from);
        const to = new Date(p.valid_to);
        // the days the day plan puts the move in this state
        const inState = datesByState(planOf(ctx.move))[code] ?? [];
        const days = (ctx.assessment.result.jurisdictions.find((j) => j.code === code)?.travel ?? []).filter((d) => inState.includes(d.date));
        const gaps = validityGaps(days, from, to, (d) => formatZoned(d.getTime(), tz));
        for (const g of gaps) push('permit_validity', `valid ${formatZoned(from.getTime(), tz)} to ${formatZoned(to.getTime(), tz)}: ${g.message}`);
        if (!gaps.length && ctx.to === 'running') {
          if (to <= now) push('permit_validity', 'has expired');
          else if (code === ctx.move.route[0]?.jurisdiction && from > now) push('permit_not_yet_valid', `is valid only from ${formatZoned(from.getTime(), tz)}; the move cannot run before`);
        }
      }
    }
    return out;
  }

  /**
   * Escorts the rulebook has not on file for this load are an open question until the state's permit answers it: the
   * clerk records the permit's escort counts (front and rear, 0 when it asks none) before escorts can be called booked.
   */
  private async escortsAnsweredByPermits(ctx: TransitionContext): Promise<UnmetCondition[]> {
    const open = ctx.assessment.result.summary.escortsNotOnFile;
    if (!open.length) return [];
    const rows = await this.repo.issuedConditionsIn(ctx.manager, ctx.move.id, open);
    return open
      .filter((code) => {
        const c = rows.find((r) => r.jurisdiction === code)?.conditions;
        return c?.escortsFront === undefined || c?.escortsRear === undefined;
      })
      .map((code) => ({
        code: 'escorts_not_on_file',
        jurisdiction: code,
        message: `${code} escorts: not on file in the rulebook — record the escorts the issued permit asks (front and rear, 0 if none)`,
      }));
  }
}
