import { Injectable } from '@nestjs/common';
import { DataSource, type EntityManager, type EntityTarget, type ObjectLiteral } from 'typeorm';
import type { MoveStage, MoveSummaryDto, StageCounts } from '@amberline/common';
import { entityColumns, entityFromRow, preparedQuery } from '../database/prepared';
import { Tractor } from '../fleet/entities/tractor.entity';
import { Trailer } from '../fleet/entities/trailer.entity';
import { User } from '../users/entities/user.entity';
import { Move } from './entities/move.entity';

/** A move as the moves module hands it to others (its row, with equipment and driver when read with them). */
export type { Move };

/** The tractor and trailer a move (or a draft) is planned on, as the moves module reads them. */
export type MoveTractor = NonNullable<Move['tractor']>;
export type MoveTrailer = NonNullable<Move['trailer']>;

/** One page of the moves list, as its filters ask. */
export type MoveListFilter = {
  stage?: MoveStage;
  jurisdiction?: string;
  driverId?: string;
  search?: string;
  sort?: 'departure' | '-departure' | 'updated';
  page: number;
  pageSize: number;
};

export type MoveListRow = Pick<MoveSummaryDto, 'id' | 'reference' | 'customer' | 'commodity' | 'stage' | 'origin' | 'destination' | 'requestedDeparture' | 'jurisdictions' | 'updatedAt'>
  & MoveSummaryDto['flags'] & { driverId: string | null; driverName: string | null };

/** Columns a plan edit writes. */
export type MovePlanColumns = Pick<Move,
  | 'customer' | 'customerRef' | 'commodity' | 'tractorId' | 'trailerId' | 'driverId' | 'sliderSettingFt' | 'articles' | 'route' | 'jurisdictions'
  | 'origin' | 'destination' | 'requestedDeparture' | 'travelDays' | 'dailyMiles' | 'notes' | 'summary' | 'planRevision' | 'version' | 'ruleVersions'>;

/** Columns a stage change, reopen or re-assessment writes. */
export type MoveStateColumns = Partial<Pick<Move, 'stage' | 'version' | 'updatedAt' | 'stageChangedAt' | 'ruleVersions' | 'summary'>>;

/**
 * The moves table: every statement the moves module runs, its prepared hot reads, and the rebuilding of a move
 * with its equipment and driver from one row. Other modules lock and read moves through it too.
 */
@Injectable()
export class MovesRepository {
  constructor(private readonly ds: DataSource) {}

  /** The manager outside any transaction. */
  get manager(): EntityManager {
    return this.ds.manager;
  }

  transaction<T>(fn: (manager: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** The move with its tractor, trailer and driver, in one prepared statement (the move page's and run sheet's read). */
  async findWithEquipment(id: string, manager?: EntityManager): Promise<Move | null> {
    const [row] = await preparedQuery<Record<string, unknown>>(manager ?? this.ds, this.getSql(), [id]);
    return row ? this.fromRow(row) : null;
  }

  /**
   * Locks the move's row for the rest of `manager`'s transaction, then reads it (with its equipment and driver) as
   * it is once the lock is held: two changes to one move run one after the other and the second sees the first's
   * result. Null when there is no such move.
   */
  async lockForUpdate(manager: EntityManager, id: string): Promise<Move | null> {
    const locked: unknown[] = await manager.query(`SELECT id FROM moves WHERE id = $1 FOR UPDATE`, [id]);
    if (!locked.length) return null;
    return this.findWithEquipment(id, manager);
  }

  private getSqlText?: string;
  private getSql(): string {
    const meta = (e: EntityTarget<ObjectLiteral>) => this.ds.getMetadata(e);
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

  tractor(id: string, manager?: EntityManager): Promise<MoveTractor | null> {
    return (manager ?? this.ds.manager).findOneBy(Tractor, { id });
  }

  trailer(id: string, manager?: EntityManager): Promise<MoveTrailer | null> {
    return (manager ?? this.ds.manager).findOneBy(Trailer, { id });
  }

  /** A user's role and whether the account is active (to check a driver assignment); null when there is none. */
  async userStanding(id: string, manager?: EntityManager): Promise<{ role: string; active: boolean } | null> {
    const rows: { role: string; active: boolean }[] = await (manager ?? this.ds.manager).query(`SELECT role, active FROM users WHERE id = $1`, [id]);
    return rows[0] ?? null;
  }

  async nextReferenceNumber(manager: EntityManager): Promise<number> {
    const [{ n }] = await manager.query(`SELECT nextval('move_reference_seq')::int AS n`);
    return n;
  }

  /** Inserts a new move; returns it as saved (with its id, defaults and timestamps). */
  insert(manager: EntityManager, values: Partial<Move>): Promise<Move> {
    return manager.save(manager.create(Move, values));
  }

  /** A copy of a move to change in memory (the equipment and driver it was read with are not carried over). */
  copy(move: Move): Move {
    return this.ds.manager.create(Move, { ...move, tractor: undefined, trailer: undefined, driver: undefined });
  }

  /** Writes a plan edit if the move is still at `expectedVersion`; false when someone else changed it first. */
  async updatePlan(manager: EntityManager, id: string, expectedVersion: number, values: MovePlanColumns): Promise<boolean> {
    const res = await manager
      .createQueryBuilder()
      .update(Move)
      .set(values)
      .where('id = :id AND version = :v', { id, v: expectedVersion })
      .execute();
    return res.affected === 1;
  }

  async updateState(manager: EntityManager, id: string, values: MoveStateColumns): Promise<void> {
    await manager.update(Move, { id }, values);
  }

  /**
   * The busiest read of the desk, so plain SQL: only the columns the list shows (the flags read out of the summary
   * JSON and the dates formatted in SQL) and no entity hydration. The driver join is many-to-one, so LIMIT/OFFSET
   * pages correctly. The total is a separate count, which PostgreSQL answers from the index alone (a window count
   * would read every filtered row).
   */
  async listPage(q: MoveListFilter): Promise<{ rows: MoveListRow[]; total: number }> {
    const where: string[] = [];
    const params: unknown[] = [];
    const param = (v: unknown) => (params.push(v), `$${params.length}`);
    if (q.stage) where.push(`m.stage = ${param(q.stage)}`);
    if (q.jurisdiction) where.push(`${param(q.jurisdiction)} = ANY(m.jurisdictions)`);
    if (q.driverId) where.push(`m.driver_id = ${param(q.driverId)}`);
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
    return { rows, total };
  }

  /** Moves per stage (only a driver's own when `driverId` is given); stages with none are absent. */
  async stageCounts(driverId?: string): Promise<Partial<StageCounts>> {
    const rows: { stage: MoveStage; n: number }[] = await this.ds.query(
      `SELECT stage, count(*)::int AS n FROM moves ${driverId ? 'WHERE driver_id = $1' : ''} GROUP BY stage`,
      driverId ? [driverId] : [],
    );
    return Object.fromEntries(rows.map((r) => [r.stage, r.n]));
  }
}
