import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  dayPlan, DOMAIN_ERRORS, DomainError, MOVE_STAGES, travelDates,
  type AssessmentDto, type HistoryEntryDto, type MoveDto, type MoveSummaryDto, type MovesPage, type PermitTerms, type SessionUser, type StageCounts,
} from '@amberline/common';
import { AuditService, diff } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { AssessmentService, summarize } from './assessment.service';
import { CreateMoveDto, ListMovesQuery, UpdateMoveDto } from './dto/move.dto';
import { Move } from './entities/move.entity';
import { RulebookService } from '../rulebook/rulebook.service';
import { MoveExtensionsRegistry } from './move-extensions';
import { MovesRepository, type MoveListRow, type MoveTractor, type MoveTrailer } from './moves.repository';
import { resolveRoute } from './route-geo';

/** Fields whose change alters the plan (dimensions, weights, equipment, route) and so affects permits. */
export const PLAN_FIELDS = ['articles', 'route', 'tractorId', 'trailerId', 'sliderSettingFt', 'requestedDeparture', 'travelDays'] as const;

export function toMoveDto(m: Move): MoveDto {
  return {
    id: m.id,
    reference: m.reference,
    stage: m.stage,
    version: m.version,
    customer: m.customer,
    ...(m.customerRef ? { customerRef: m.customerRef } : {}),
    commodity: m.commodity,
    articles: m.articles,
    tractorId: m.tractorId,
    trailerId: m.trailerId,
    sliderSettingFt: m.sliderSettingFt,
    route: m.route,
    origin: m.origin,
    destination: m.destination,
    requestedDeparture: m.requestedDeparture,
    travelDays: m.travelDays,
    travelDates: travelDates(m.requestedDeparture, m.travelDays),
    dailyMiles: m.dailyMiles,
    driverId: m.driverId,
    ...(m.notes ? { notes: m.notes } : {}),
    tractor: { id: m.tractorId, unitNumber: m.tractor?.unitNumber ?? '' },
    trailer: { id: m.trailerId, unitNumber: m.trailer?.unitNumber ?? '', type: m.trailer?.type ?? '' },
    driver: m.driver ? { id: m.driver.id, name: m.driver.name } : null,
    stageChangedAt: m.stageChangedAt ? m.stageChangedAt.toISOString() : null,
    createdAt: m.createdAt.toISOString(),
    updatedAt: m.updatedAt.toISOString(),
  };
}

/** What the audit trail keeps of a move (no derived or bookkeeping fields). */
const auditView = (m: Move) => ({
  customer: m.customer, customerRef: m.customerRef, commodity: m.commodity, stage: m.stage, tractorId: m.tractorId, trailerId: m.trailerId,
  driverId: m.driverId, sliderSettingFt: m.sliderSettingFt, articles: m.articles, route: m.route, origin: m.origin, destination: m.destination,
  requestedDeparture: m.requestedDeparture, travelDays: m.travelDays, dailyMiles: m.dailyMiles, notes: m.notes,
});

/** Today's date where the day starts last in the contiguous US (Pacific), `YYYY-MM-DD`. */
export function earliestAllowedDeparture(now: Date): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone: 'America/Los_Angeles', year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

/** Someone else saved the move after the caller read it. */
export const versionConflict = (current: number, yours: number, details?: Record<string, unknown>): DomainError =>
  new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, `This move was changed by someone else (version ${current}, yours ${yours}); reload it`, details);

@Injectable()
export class MovesService {
  constructor(
    private readonly repo: MovesRepository,
    private readonly audit: AuditService,
    private readonly assessments: AssessmentService,
    private readonly extensions: MoveExtensionsRegistry,
    private readonly rulebook: RulebookService,
  ) {}

  /** Loads a move with its equipment and driver. Drivers may only see moves assigned to them. */
  async get(id: string, viewer?: SessionUser, manager?: EntityManager): Promise<Move> {
    return this.visible(await this.repo.findWithEquipment(id, manager), id, viewer);
  }

  /** The move as `viewer` may see it: a move that is not there, or another driver's, is not found. */
  visible(m: Move | null, id: string, viewer?: SessionUser): Move {
    if (!m || (viewer?.role === 'driver' && m.driverId !== viewer.id)) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No move ${id}`);
    return m;
  }

  /**
   * Locks the move for the rest of `manager`'s transaction and loads it as it is once the lock is held, with its
   * equipment (not found when there is none). With `version`, the caller's copy must still be current.
   */
  async lockForUpdate(manager: EntityManager, id: string, version?: number): Promise<Move> {
    const move = this.visible(await this.repo.lockForUpdate(manager, id), id);
    if (version !== undefined && version !== move.version) throw versionConflict(move.version, version);
    return move;
  }

  private async equipment(m: EntityManager, tractorId: string, trailerId: string): Promise<{ tractor: MoveTractor; trailer: MoveTrailer }> {
    const tractor = await this.repo.tractor(tractorId, m);
    if (!tractor || !tractor.active) throw fieldError('tractorId', 'no active tractor with this id');
    const trailer = await this.repo.trailer(trailerId, m);
    if (!trailer || !trailer.active) throw fieldError('trailerId', 'no active trailer with this id');
    return { tractor, trailer };
  }

  private async checkDriver(m: EntityManager, driverId: string | null | undefined): Promise<void> {
    if (!driverId) return;
    const d = await this.repo.userStanding(driverId, m);
    if (!d || d.role !== 'driver' || !d.active) throw fieldError('driverId', 'no active driver with this id');
  }

  /** A daily distance that would need more days than the move plans is refused, naming the field. */
  private checkDailyMiles(route: { order: number; jurisdiction: string; miles: number }[], travelDays: number, dailyMiles: number | null | undefined): void {
    if (dailyMiles === null || dailyMiles === undefined) return;
    const plan = dayPlan(route, travelDates(new Date().toISOString().slice(0, 10), travelDays), dailyMiles);
    if (plan.daysNeeded > travelDays) {
      throw fieldError('dailyMiles', `at ${dailyMiles} mi a day the route's ${Math.round(plan.totalMiles)} mi take ${plan.daysNeeded} days; the move plans ${travelDays} (raise the daily distance or add travel days)`);
    }
  }

  private checkPlanFields(dto: Partial<CreateMoveDto>, trailer: MoveTrailer, now: Date, departureChanged: boolean): void {
    if (dto.sliderSettingFt !== undefined && dto.sliderSettingFt !== null) {
      const s = trailer.spec.slider;
      if (!s) throw fieldError('sliderSettingFt', `trailer ${trailer.unitNumber} has no sliding axle`);
      if (dto.sliderSettingFt < s.minFromKingpinFt || dto.sliderSettingFt > s.maxFromKingpinFt) {
        throw fieldError('sliderSettingFt', `must be within the trailer's sliding range, ${s.minFromKingpinFt}–${s.maxFromKingpinFt} ft behind the kingpin`);
      }
    }
    if (departureChanged && dto.requestedDeparture) {
      if (Number.isNaN(Date.parse(`${dto.requestedDeparture}T00:00:00Z`))) throw fieldError('requestedDeparture', 'is not a real date');
      if (dto.requestedDeparture < earliestAllowedDeparture(now)) throw fieldError('requestedDeparture', 'is in the past');
    }
  }

  async preview(dto: CreateMoveDto, now: Date): Promise<AssessmentDto> {
    const { tractor, trailer } = await this.equipment(this.repo.manager, dto.tractorId, dto.trailerId);
    this.checkPlanFields(dto, trailer, now, false);
    const route = resolveRoute(dto.route);
    const a = await this.assessments.assess({ ...dto, route, tractor, trailer });
    return this.assessments.toDto('draft', 0, a, now);
  }

  async create(dto: CreateMoveDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    const route = resolveRoute(dto.route);
    const id = await this.repo.transaction(async (m) => {
      const { tractor, trailer } = await this.equipment(m, dto.tractorId, dto.trailerId);
      await this.checkDriver(m, dto.driverId);
      this.checkPlanFields(dto, trailer, now, true);
      this.checkDailyMiles(route, dto.travelDays, dto.dailyMiles);
      const a = await this.assessments.assess({ ...dto, route, tractor, trailer });
      const n = await this.repo.nextReferenceNumber(m);
      const saved = await this.repo.insert(m, {
        reference: `AM-${now.getUTCFullYear()}-${String(n).padStart(5, '0')}`,
        customer: dto.customer.trim(),
        customerRef: dto.customerRef?.trim() || null,
        commodity: dto.commodity.trim(),
        stage: 'requested',
        tractorId: tractor.id,
        trailerId: trailer.id,
        driverId: dto.driverId ?? null,
        sliderSettingFt: dto.sliderSettingFt ?? null,
        articles: JSON.parse(JSON.stringify(dto.articles)),
        route,
        jurisdictions: [...new Set(route.map((s) => s.jurisdiction))],
        origin: dto.origin.trim(),
        destination: dto.destination.trim(),
        requestedDeparture: dto.requestedDeparture,
        travelDays: dto.travelDays,
        dailyMiles: dto.dailyMiles ?? null,
        notes: dto.notes ?? null,
        summary: summarize(a.result),
        createdById: actor.id,
      });
      await this.audit.record(m, { moveId: saved.id, entity: 'move', entityId: saved.id, action: 'created', actorId: actor.id, after: auditView(saved) });
      return saved.id;
    });
    return toMoveDto(await this.get(id));
  }

  async update(id: string, dto: UpdateMoveDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    await this.repo.transaction(async (m) => {
      const before = await this.lockForUpdate(m, id);
      if (before.version !== dto.version) throw versionConflict(before.version, dto.version, { currentVersion: before.version });
      if (before.stage === 'delivered' || before.stage === 'cancelled') throw new DomainError(DOMAIN_ERRORS.RECORD_CLOSED, `A ${before.stage} move cannot be edited`);
      const { version, ...changes } = dto;
      void version;
      const after = this.repo.copy(before);
      if (changes.route) {
        after.route = resolveRoute(changes.route);
        after.jurisdictions = [...new Set(after.route.map((s) => s.jurisdiction))];
      }
      for (const [k, v] of Object.entries(changes)) {
        if (v === undefined || k === 'route') continue;
        (after as unknown as Record<string, unknown>)[k] = k === 'articles' ? JSON.parse(JSON.stringify(v)) : v;
      }
      const { tractor, trailer } = await this.equipment(m, after.tractorId, after.trailerId);
      after.tractor = tractor;
      after.trailer = trailer;
      if (changes.driverId !== undefined) await this.checkDriver(m, changes.driverId);
      this.checkPlanFields({ ...changes, sliderSettingFt: after.sliderSettingFt }, trailer, now, changes.requestedDeparture !== undefined && changes.requestedDeparture !== before.requestedDeparture);
      this.checkDailyMiles(after.route, after.travelDays, after.dailyMiles);
      const changedPlan = PLAN_FIELDS.filter((f) => JSON.stringify(before[f]) !== JSON.stringify(after[f]));
      if (changedPlan.length) {
        const a = await this.assessments.assess({ ...after, tractor, trailer }, { pinned: before.ruleVersions });
        after.summary = summarize(a.result);
        after.planRevision = before.planRevision + 1;
        // a state new on the route of a move that keeps its rule versions is kept at its current version from now on
        if (before.ruleVersions) after.ruleVersions = a.ruleVersions;
      }
      const d = diff(auditView(before), auditView(after));
      if (!Object.keys(d.after).length) return;
      after.version = before.version + 1;
      after.updatedAt = now;
      const written = await this.repo.updatePlan(m, id, before.version, {
        customer: after.customer, customerRef: after.customerRef, commodity: after.commodity, tractorId: after.tractorId, trailerId: after.trailerId,
        driverId: after.driverId, sliderSettingFt: after.sliderSettingFt, articles: after.articles, route: after.route, jurisdictions: after.jurisdictions,
        origin: after.origin, destination: after.destination, requestedDeparture: after.requestedDeparture, travelDays: after.travelDays,
        dailyMiles: after.dailyMiles, notes: after.notes, summary: after.summary, planRevision: after.planRevision, version: after.version, ruleVersions: after.ruleVersions,
      });
      if (!written) throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, 'This move was changed by someone else; reload it');
      await this.audit.record(m, { moveId: id, entity: 'move', entityId: id, action: 'updated', actorId: actor.id, before: d.before, after: d.after });
      if (changedPlan.length) {
        for (const ext of this.extensions.all()) await ext.onPlanChanged?.({ manager: m, before, after, changed: changedPlan, actor });
      }
    });
    return toMoveDto(await this.get(id));
  }

  async list(q: ListMovesQuery, viewer: SessionUser): Promise<MovesPage> {
    const { rows, total } = await this.repo.listPage({ ...q, ...(viewer.role === 'driver' ? { driverId: viewer.id } : {}) });
    return { items: rows.map(toListItem), total, page: q.page, pageSize: q.pageSize };
  }

  async stageCounts(viewer: SessionUser): Promise<StageCounts> {
    const found = await this.repo.stageCounts(viewer.role === 'driver' ? viewer.id : undefined);
    return Object.fromEntries(MOVE_STAGES.map((s) => [s, found[s] ?? 0])) as StageCounts;
  }

  async assessment(id: string, viewer: SessionUser, now: Date): Promise<AssessmentDto> {
    const move = await this.get(id, viewer);
    return this.assessmentOf(move, now);
  }

  /**
   * The move's assessment: with the rule versions it keeps once past `requested` (`rules: 'current'` asks for
   * the current ones, for the re-assessment preview), and with its issued permits' terms governing their states.
   */
  async assessmentOf(move: Move, now: Date, manager?: EntityManager, opts: { rules?: 'kept' | 'current' } = {}): Promise<AssessmentDto> {
    const m = manager ?? this.repo.manager;
    const tractor = move.tractor ?? (await this.repo.tractor(move.tractorId, m));
    const trailer = move.trailer ?? (await this.repo.trailer(move.trailerId, m));
    if (!tractor || !trailer) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No equipment for move ${move.id}`);
    const permits: Record<string, PermitTerms> = {};
    for (const ext of this.extensions.all()) if (ext.permitTerms) Object.assign(permits, await ext.permitTerms(move, m));
    const pinned = opts.rules === 'current' ? null : move.ruleVersions;
    const a = await this.assessments.assess({ ...move, tractor, trailer }, { pinned, permits });
    const dto = this.assessments.toDto(move.id, move.version, a, now);
    if (pinned) {
      const current = await this.rulebook.currentVersions(Object.keys(a.ruleVersions));
      dto.pinned = true;
      dto.newerRules = Object.entries(a.ruleVersions)
        .filter(([code, v]) => (current[code] ?? v) > v)
        .map(([code, v]) => ({ code, used: v, current: current[code] }));
    }
    return dto;
  }

  async history(id: string, viewer: SessionUser): Promise<HistoryEntryDto[]> {
    await this.get(id, viewer);
    return this.audit.forMove(id);
  }
}

function toListItem(r: MoveListRow): MoveSummaryDto {
  return {
    id: r.id,
    reference: r.reference,
    customer: r.customer,
    commodity: r.commodity,
    stage: r.stage,
    origin: r.origin,
    destination: r.destination,
    requestedDeparture: r.requestedDeparture,
    jurisdictions: r.jurisdictions,
    driver: r.driverId ? { id: r.driverId, name: r.driverName ?? '' } : null,
    flags: { permitsNeeded: r.permitsNeeded, escorts: r.escorts, superload: r.superload, problems: r.problems, overweight: r.overweight },
    updatedAt: r.updatedAt,
  };
}
