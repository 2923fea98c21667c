import { Injectable } from '@nestjs/common';
import { DataSource, EntityManager } from 'typeorm';
import {
  dayPlan, MOVE_STAGES, type AssessmentDto, type HistoryEntryDto, type MoveDto, type MoveStage, type MoveSummaryDto, type MovesPage, type PermitTerms,
  type SessionUser, type StageCounts,
} from '@amberline/common';
import { AuditService, diff } from '../audit/audit.service';
import { entityColumns, entityFromRow, preparedQuery } from '../database/prepared';
import { AppException, fieldError } from '../core/app-exception';
import { Tractor } from '../fleet/entities/tractor.entity';
import { Trailer } from '../fleet/entities/trailer.entity';
import { User } from '../users/entities/user.entity';
import { AssessmentService, summarize, travelDates } from './assessment.service';
import { CreateMoveDto, ListMovesQuery, UpdateMoveDto } from './dto/move.dto';
import { Move } from './entities/move.entity';
import { RulebookService } from '../rulebook/rulebook.service';
import { MoveExtensionsRegistry } from './move-extensions';
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

@Injectable()
export class MovesService {
  constructor(
    private readonly ds: DataSource,
    private readonly audit: AuditService,
    private readonly assessments: AssessmentService,
    private readonly extensions: MoveExtensionsRegistry,
    private readonly rulebook: RulebookService,
  ) {}

  /** Loads a move with its equipment and driver. Drivers may only see moves assigned to them. */
  async get(id: string, viewer?: SessionUser, manager?: EntityManager): Promise<Move> {
    const [row] = await preparedQuery<Record<string, unknown>>(manager ?? this.ds, this.getSql(), [id]);
    const m = row ? this.fromRow(row) : null;
    if (!m || (viewer?.role === 'driver' && m.driverId !== viewer.id)) throw new AppException(404, 'not_found', `No move ${id}`);
    return m;
  }

  /** The move with its equipment and driver in one prepared statement (the move page's and run sheet's read). */
  private getSqlText?: string;
  private getSql(): string {
    const meta = (e: Function) => this.ds.getMetadata(e);
    return (this.getSqlText ??= `
      SELECT ${entityColumns(meta(Move), 'm')}, ${entityColumns(meta(Tractor), 't', 'tractor.')}, ${entityColumns(meta(Trailer), 'r', 'trailer.')},
             ${entityColumns(meta(User), 'd', 'driver.')}
        FROM moves m JOIN tractors t ON t.id = m.tractor_id JOIN trailers r ON r.id = m.trailer_id LEFT JOIN users d ON d.id = m.driver_id
       WHERE m.id = $1`);
  }

  private fromRow(row: Record<string, unknown>): Move {
    const m = entityFromRow<Move>(this.ds.getMetadata(Move), row)!;
    m.tractor = entityFromRow<Tractor>(this.ds.getMetadata(Tractor), row, 'tractor.') ?? undefined;
    m.trailer = entityFromRow<Trailer>(this.ds.getMetadata(Trailer), row, 'trailer.') ?? undefined;
    m.driver = entityFromRow<User>(this.ds.getMetadata(User), row, 'driver.');
    return m;
  }

  private async equipment(m: EntityManager, tractorId: string, trailerId: string): Promise<{ tractor: Tractor; trailer: Trailer }> {
    const tractor = await m.findOneBy(Tractor, { id: tractorId });
    if (!tractor || !tractor.active) throw fieldError('tractorId', 'no active tractor with this id');
    const trailer = await m.findOneBy(Trailer, { id: trailerId });
    if (!trailer || !trailer.active) throw fieldError('trailerId', 'no active trailer with this id');
    return { tractor, trailer };
  }

  private async checkDriver(m: EntityManager, driverId: string | null | undefined): Promise<void> {
    if (!driverId) return;
    const d = await m.findOneBy(User, { id: driverId });
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

  private checkPlanFields(dto: Partial<CreateMoveDto>, trailer: Trailer, now: Date, departureChanged: boolean): void {
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
    const { tractor, trailer } = await this.equipment(this.ds.manager, dto.tractorId, dto.trailerId);
    this.checkPlanFields(dto, trailer, now, false);
    const route = resolveRoute(dto.route);
    const a = await this.assessments.assess({ ...dto, route, tractor, trailer });
    return this.assessments.toDto('draft', 0, a, now);
  }

  async create(dto: CreateMoveDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    const route = resolveRoute(dto.route);
    const id = await this.ds.transaction(async (m) => {
      const { tractor, trailer } = await this.equipment(m, dto.tractorId, dto.trailerId);
      await this.checkDriver(m, dto.driverId);
      this.checkPlanFields(dto, trailer, now, true);
      this.checkDailyMiles(route, dto.travelDays, dto.dailyMiles);
      const a = await this.assessments.assess({ ...dto, route, tractor, trailer });
      const [{ n }] = await m.query(`SELECT nextval('move_reference_seq')::int AS n`);
      const move = m.create(Move, {
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
      const saved = await m.save(move);
      await this.audit.record(m, { moveId: saved.id, entity: 'move', entityId: saved.id, action: 'created', actorId: actor.id, after: auditView(saved) });
      return saved.id;
    });
    return toMoveDto(await this.get(id));
  }

  async update(id: string, dto: UpdateMoveDto, actor: SessionUser, now: Date): Promise<MoveDto> {
    await this.ds.transaction(async (m) => {
      const before = await m.findOne(Move, { where: { id }, lock: { mode: 'pessimistic_write' } });
      if (!before) throw new AppException(404, 'not_found', `No move ${id}`);
      if (before.version !== dto.version) {
        throw new AppException(409, 'conflict', `This move was changed by someone else (version ${before.version}, yours ${dto.version}); reload it`, { currentVersion: before.version });
      }
      if (before.stage === 'delivered' || before.stage === 'cancelled') throw new AppException(409, 'conflict', `A ${before.stage} move cannot be edited`);
      const { version, ...changes } = dto;
      void version;
      const after = m.create(Move, { ...before });
      if (changes.route) {
        after.route = resolveRoute(changes.route);
        after.jurisdictions = [...new Set(after.route.map((s) => s.jurisdiction))];
      }
      for (const [k, v] of Object.entries(changes)) {
        if (v === undefined || k === 'route') continue;
        (after as unknown as Record<string, unknown>)[k] = k === 'articles' ? JSON.parse(JSON.stringify(v)) : v;
      }
      const { tractor, trailer } = await this.equipment(m, after.tractorId, after.trailerId);
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
      const res = await m
        .createQueryBuilder()
        .update(Move)
        .set({
          customer: after.customer, customerRef: after.customerRef, commodity: after.commodity, tractorId: after.tractorId, trailerId: after.trailerId,
          driverId: after.driverId, sliderSettingFt: after.sliderSettingFt, articles: after.articles, route: after.route, jurisdictions: after.jurisdictions,
          origin: after.origin, destination: after.destination, requestedDeparture: after.requestedDeparture, travelDays: after.travelDays,
          dailyMiles: after.dailyMiles, notes: after.notes, summary: after.summary, planRevision: after.planRevision, version: after.version, ruleVersions: after.ruleVersions,
        })
        .where('id = :id AND version = :v', { id, v: before.version })
        .execute();
      if (res.affected !== 1) throw new AppException(409, 'conflict', 'This move was changed by someone else; reload it');
      await this.audit.record(m, { moveId: id, entity: 'move', entityId: id, action: 'updated', actorId: actor.id, before: d.before, after: d.after });
      if (changedPlan.length) {
        for (const ext of this.extensions.all()) await ext.onPlanChanged?.({ manager: m, before, after, changed: changedPlan, actor });
      }
    });
    return toMoveDto(await this.get(id));
  }

  async list(q: ListMovesQuery, viewer: SessionUser): Promise<MovesPage> {
    // The desk's busiest call, so it is plain SQL: only the columns the list shows (the flags read out of the
    // summary JSON and the dates formatted in SQL) and no entity hydration. The driver join is many-to-one, so
    // LIMIT/OFFSET pages correctly. The total is a separate count, which PostgreSQL answers from the index alone
    // (a window count would read every filtered row).
    const where: string[] = [];
    const params: unknown[] = [];
    const param = (v: unknown) => (params.push(v), `$${params.length}`);
    if (q.stage) where.push(`m.stage = ${param(q.stage)}`);
    if (q.jurisdiction) where.push(`${param(q.jurisdiction)} = ANY(m.jurisdictions)`);
    if (viewer.role === 'driver') where.push(`m.driver_id = ${param(viewer.id)}`);
    if (q.search) {
      // the same expression as the trigram index moves_search_idx
      where.push(`(m.reference || ' ' || m.customer || ' ' || m.commodity || ' ' || m.origin || ' ' || m.destination) ILIKE ${param(`%${q.search.replace(/[%_\\]/g, '\\$&')}%`)}`);
    }
    const whereSql = where.length ? `WHERE ${where.join(' AND ')}` : '';
    const order = q.sort === 'updated' ? 'm.updated_at DESC, m.id' : `m.requested_departure ${q.sort === '-departure' ? 'DESC' : 'ASC'}, m.id`;
    const n = params.length;
    const [rows, [{ total }]] = await Promise.all([
      preparedQuery<MoveListRow>(
        this.ds,
        `SELECT m.id, m.reference, m.customer, m.commodity, m.stage, m.origin, m.destination,
                to_char(m.requested_departure, 'YYYY-MM-DD') AS "requestedDeparture", m.jurisdictions,
                d.id AS "driverId", d.name AS "driverName",
                coalesce(jsonb_array_length(m.summary->'permitsNeeded'), 0) AS "permitsNeeded",
                coalesce((m.summary->>'escorts')::int, 0) AS escorts,
                coalesce((m.summary->>'superload')::boolean, false) AS superload,
                coalesce(jsonb_array_length(m.summary->'problems'), 0) AS problems,
                coalesce((m.summary->>'overweight')::boolean, false) AS overweight,
                to_char(m.updated_at AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"') AS "updatedAt"
           FROM moves m LEFT JOIN users d ON d.id = m.driver_id
          ${whereSql}
          ORDER BY ${order}
          LIMIT $${n + 1} OFFSET $${n + 2}`,
        [...params, q.pageSize, (q.page - 1) * q.pageSize],
      ),
      preparedQuery<{ total: number }>(this.ds, `SELECT count(*)::int AS total FROM moves m ${whereSql}`, params),
    ]);
    return { items: rows.map(toListItem), total, page: q.page, pageSize: q.pageSize };
  }

  async stageCounts(viewer: SessionUser): Promise<StageCounts> {
    const rows: { stage: MoveStage; n: number }[] = await this.ds.query(
      `SELECT stage, count(*)::int AS n FROM moves ${viewer.role === 'driver' ? 'WHERE driver_id = $1' : ''} GROUP BY stage`,
      viewer.role === 'driver' ? [viewer.id] : [],
    );
    const counts = Object.fromEntries(MOVE_STAGES.map((s) => [s, 0])) as StageCounts;
    for (const r of rows) counts[r.stage] = r.n;
    return counts;
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
    const m = manager ?? this.ds.manager;
    const tractor = move.tractor ?? (await m.findOneByOrFail(Tractor, { id: move.tractorId }));
    const trailer = move.trailer ?? (await m.findOneByOrFail(Trailer, { id: move.trailerId }));
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

type MoveListRow = Pick<MoveSummaryDto, 'id' | 'reference' | 'customer' | 'commodity' | 'stage' | 'origin' | 'destination' | 'requestedDeparture' | 'jurisdictions' | 'updatedAt'>
  & MoveSummaryDto['flags'] & { driverId: string | null; driverName: string | null };

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
