import { Injectable } from '@nestjs/common';
import { DataSource, IsNull, type EntityManager } from 'typeorm';
import { entityColumns, entityFromRow, preparedQuery } from '../database/prepared';
import { User } from '../users/entities/user.entity';
import { DepartureChecks } from './entities/departure-checks.entity';
import { RunSheetAcknowledgement } from './entities/run-sheet-acknowledgement.entity';

/** Departure checks and run-sheet acknowledgements: the statements of the run-sheets module and their row mapping. */
@Injectable()
export class RunSheetsRepository {
  constructor(private readonly ds: DataSource) {}

  get manager(): EntityManager {
    return this.ds.manager;
  }

  transaction<T>(fn: (manager: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** The latest departure checks (with the driver who recorded them) and the latest acknowledgement, in one prepared statement. */
  async latest(manager: EntityManager, moveId: string): Promise<{ checks: DepartureChecks | null; acknowledgement: RunSheetAcknowledgement | null }> {
    const [row] = await preparedQuery<Record<string, unknown>>(manager, this.latestSql(), [moveId]);
    if (!row) return { checks: null, acknowledgement: null };
    const checks = entityFromRow<DepartureChecks>(this.ds.getMetadata(DepartureChecks), row, 'c.');
    if (checks) checks.driver = entityFromRow<User>(this.ds.getMetadata(User), row, 'd.') ?? undefined;
    return { checks, acknowledgement: entityFromRow<RunSheetAcknowledgement>(this.ds.getMetadata(RunSheetAcknowledgement), row, 'a.') };
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

  insertChecks(manager: EntityManager, values: Partial<DepartureChecks>): Promise<DepartureChecks> {
    return manager.save(manager.create(DepartureChecks, values));
  }

  /** One record of checks with the driver who recorded them. */
  checksWithDriver(id: string, manager?: EntityManager): Promise<DepartureChecks> {
    return (manager ?? this.ds.manager).findOneOrFail(DepartureChecks, { where: { id }, relations: { driver: true } });
  }

  /** The newest checks recorded for this version of the run sheet, if any. */
  latestForFingerprint(manager: EntityManager, moveId: string, fingerprint: string): Promise<DepartureChecks | null> {
    return manager.findOne(DepartureChecks, { where: { moveId, fingerprint }, order: { submittedAt: 'DESC' } });
  }

  latestChecks(manager: EntityManager, moveId: string): Promise<DepartureChecks | null> {
    return manager.findOne(DepartureChecks, { where: { moveId }, order: { submittedAt: 'DESC' } });
  }

  /** Locks one record of checks of the move for the rest of the transaction; null when the move has no such checks. */
  lockChecks(manager: EntityManager, moveId: string, id: string): Promise<DepartureChecks | null> {
    return manager.findOne(DepartureChecks, { where: { id, moveId }, lock: { mode: 'pessimistic_write' } });
  }

  async updateChecks(manager: EntityManager, id: string, values: Partial<Pick<DepartureChecks, 'outcome' | 'override'>>): Promise<void> {
    await manager.update(DepartureChecks, { id }, values);
  }

  /** The move's checks, newest first (at most `limit`), each with its driver. */
  history(moveId: string, limit: number): Promise<DepartureChecks[]> {
    return this.ds.getRepository(DepartureChecks).find({ where: { moveId }, relations: { driver: true }, order: { submittedAt: 'DESC' }, take: limit });
  }

  /** Voids the move's standing acknowledgement (if any), saying why. */
  async voidAcknowledgements(manager: EntityManager, moveId: string, at: Date, reason: string): Promise<void> {
    await manager.update(RunSheetAcknowledgement, { moveId, voidedAt: IsNull() }, { voidedAt: at, voidReason: reason });
  }

  insertAcknowledgement(manager: EntityManager, values: Pick<RunSheetAcknowledgement, 'moveId' | 'driverId' | 'checksId' | 'fingerprint' | 'acknowledgedAt'>): Promise<RunSheetAcknowledgement> {
    return manager.save(manager.create(RunSheetAcknowledgement, values));
  }

  /** Who hears of blocked checks: the active dispatcher who opened the move and every active admin. */
  async alertRecipients(manager: EntityManager, moveId: string): Promise<string[]> {
    const [row] = await manager.query(
      `SELECT array_remove(array_agg(DISTINCT u.email), NULL) AS emails FROM users u
        WHERE u.active AND (u.id = (SELECT created_by FROM moves WHERE id = $1) OR u.role = 'admin')`,
      [moveId],
    );
    return row?.emails ?? [];
  }
}
