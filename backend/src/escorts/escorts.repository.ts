import { Injectable } from '@nestjs/common';
import { DataSource, In, type EntityManager } from 'typeorm';
import type { BookingStatus, EscortPosition } from '@amberline/common';
import { preparedQuery } from '../database/prepared';
import { EscortBooking } from './entities/escort-booking.entity';
import { EscortResponseToken } from './entities/escort-response-token.entity';

/** The vendor as the escort module shows it (company, contact, operators and vehicles), read with its booking. */
export type BookingVendor = NonNullable<EscortBooking['vendor']>;

/** One escort of the run sheet, as its row reads. */
export type RunSheetEscortRow = Pick<EscortBooking, 'jurisdictions' | 'position' | 'seat' | 'status' | 'answer' | 'meetingPoint' | 'meetingTime'> & { company: string; phone: string };

/** A reminder due: the booking's id. */
type DueRow = { id: string };

/**
 * Escort bookings and their response links: the statements of the escorts module (the permits and users it reads
 * by SQL too), its prepared run-sheet read and its row mapping.
 */
@Injectable()
export class EscortsRepository {
  constructor(private readonly ds: DataSource) {}

  get manager(): EntityManager {
    return this.ds.manager;
  }

  transaction<T>(fn: (manager: EntityManager) => Promise<T>): Promise<T> {
    return this.ds.transaction(fn);
  }

  /** The move's bookings in any of `statuses`, each with its vendor. */
  withStatus(manager: EntityManager, moveId: string, statuses: readonly BookingStatus[]): Promise<EscortBooking[]> {
    return manager.find(EscortBooking, { where: { moveId, status: In([...statuses]) }, relations: { vendor: true } });
  }

  countWithStatus(manager: EntityManager, moveId: string, statuses: readonly BookingStatus[]): Promise<number> {
    return manager.count(EscortBooking, { where: { moveId, status: In([...statuses]) } });
  }

  /** Every booking of the move, newest first, with vendor and requester. */
  forMove(moveId: string): Promise<EscortBooking[]> {
    return this.ds.manager.find(EscortBooking, { where: { moveId }, relations: { vendor: true, requestedBy: true }, order: { requestedAt: 'DESC', id: 'ASC' } });
  }

  /** One booking with its vendor and requester. */
  load(id: string, manager?: EntityManager): Promise<EscortBooking> {
    return (manager ?? this.ds.manager).findOneOrFail(EscortBooking, { where: { id }, relations: { vendor: true, requestedBy: true } });
  }

  /** The latest expiry of each booking's unused links. */
  async linkExpiries(ids: string[]): Promise<Map<string, Date>> {
    if (!ids.length) return new Map();
    const rows: { booking_id: string; e: Date }[] = await this.ds.query(
      `SELECT booking_id, max(expires_at) AS e FROM escort_response_tokens WHERE booking_id = ANY($1) AND used_at IS NULL GROUP BY booking_id`,
      [ids],
    );
    return new Map(rows.map((r) => [r.booking_id, new Date(r.e)]));
  }

  /** A booking of the move that already holds (or may come to hold) this position in any of `jurisdictions`. */
  holding(manager: EntityManager, moveId: string, position: EscortPosition, seat: number, jurisdictions: string[], statuses: readonly BookingStatus[]): Promise<EscortBooking | null> {
    return manager
      .createQueryBuilder(EscortBooking, 'b')
      .leftJoinAndSelect('b.vendor', 'v')
      .where('b.move_id = :moveId AND b.position = :p AND b.seat = :s AND b.status IN (:...st) AND b.jurisdictions && CAST(:j AS varchar[])', {
        moveId, p: position, s: seat, st: [...statuses], j: jurisdictions,
      })
      .getOne();
  }

  /** A user's name and e-mail (the dispatcher a request names); null when there is none. */
  async userContact(manager: EntityManager, id: string): Promise<{ name: string; email: string } | null> {
    const rows: { name: string; email: string }[] = await manager.query(`SELECT name, email FROM users WHERE id = $1`, [id]);
    return rows[0] ?? null;
  }

  insertBooking(manager: EntityManager, values: Partial<EscortBooking>): Promise<EscortBooking> {
    return manager.save(manager.create(EscortBooking, values));
  }

  saveBooking(manager: EntityManager, booking: EscortBooking): Promise<EscortBooking> {
    return manager.save(booking);
  }

  /** Locks one booking of the move for the rest of the transaction; null when the move has no such booking. */
  lockBooking(manager: EntityManager, moveId: string, id: string): Promise<EscortBooking | null> {
    return manager.findOne(EscortBooking, { where: { id, moveId }, lock: { mode: 'pessimistic_write' } });
  }

  /** A booking's vendor. */
  async vendorOf(manager: EntityManager, bookingId: string): Promise<BookingVendor> {
    return (await manager.findOneOrFail(EscortBooking, { where: { id: bookingId }, relations: { vendor: true } })).vendor!;
  }

  insertLink(manager: EntityManager, bookingId: string, tokenHash: string, expiresAt: Date): Promise<unknown> {
    return manager.insert(EscortResponseToken, { bookingId, tokenHash, expiresAt });
  }

  /** The link with this token hash and its booking (both locked when `lock`); nulls when either is missing. */
  async linkWithBooking(manager: EntityManager, tokenHash: string, lock: boolean): Promise<{ token: EscortResponseToken | null; booking: EscortBooking | null }> {
    const locking = lock ? { lock: { mode: 'pessimistic_write' as const } } : {};
    const token = await manager.findOne(EscortResponseToken, { where: { tokenHash }, ...locking });
    if (!token) return { token: null, booking: null };
    return { token, booking: await manager.findOne(EscortBooking, { where: { id: token.bookingId }, ...locking }) };
  }

  /** Spends every open link of the booking. */
  async spendLinks(manager: EntityManager, bookingId: string, at: Date): Promise<void> {
    await manager.query(`UPDATE escort_response_tokens SET used_at = $2 WHERE booking_id = $1 AND used_at IS NULL`, [bookingId, at]);
  }

  /** Validity of the move's issued permits in some jurisdictions (none when the permits table does not exist yet). */
  async issuedPermitWindows(manager: EntityManager, moveId: string, jurisdictions: string[]): Promise<{ jurisdiction: string; validFrom: Date; validTo: Date }[]> {
    const [{ t }] = await manager.query(`SELECT to_regclass('public.permits') IS NOT NULL AS t`);
    if (!t) return [];
    const rows: { jurisdiction: string; valid_from: Date; valid_to: Date }[] = await manager.query(
      `SELECT jurisdiction, valid_from, valid_to FROM permits
       WHERE move_id = $1 AND status = 'issued' AND valid_from IS NOT NULL AND valid_to IS NOT NULL AND jurisdiction = ANY($2)`,
      [moveId, jurisdictions],
    );
    return rows.map((r) => ({ jurisdiction: r.jurisdiction, validFrom: new Date(r.valid_from), validTo: new Date(r.valid_to) }));
  }

  /** The move's escorts for the run sheet: bookings in `statuses` with their vendor's company and phone (prepared). */
  runSheetEscorts(manager: EntityManager, moveId: string, statuses: readonly BookingStatus[]): Promise<RunSheetEscortRow[]> {
    return preparedQuery<RunSheetEscortRow>(
      manager,
      `SELECT b.jurisdictions, b.position, b.seat, b.status, b.answer, b.meeting_point AS "meetingPoint", b.meeting_time AS "meetingTime",
              v.company, v.phone
         FROM escort_bookings b JOIN vendors v ON v.id = b.vendor_id
        WHERE b.move_id = $1 AND b.status = ANY($2::varchar[])
        ORDER BY b.position, b.seat, b.id`,
      [moveId, [...statuses]],
    );
  }

  /**
   * Requests still unanswered that were asked at or before `askedBy`, on moves not yet running, delivered or
   * cancelled; locked with SKIP LOCKED so instances running side by side take different rows.
   */
  unansweredDue(manager: EntityManager, askedBy: Date, moveIds?: string[]): Promise<DueRow[]> {
    return manager.query(
      `SELECT b.id FROM escort_bookings b JOIN moves mv ON mv.id = b.move_id
       WHERE b.status = 'requested' AND b.reminder_sent_at IS NULL AND b.requested_at <= $1::timestamptz
         AND mv.stage NOT IN ('running','delivered','cancelled') ${moveIds ? 'AND b.move_id = ANY($2)' : ''}
       ORDER BY b.requested_at LIMIT 200 FOR UPDATE OF b SKIP LOCKED`,
      moveIds ? [askedBy, moveIds] : [askedBy],
    );
  }

  /**
   * Confirmed bookings without their departure reminder starting within a window of dates wide enough for every US
   * zone from `now` (the exact local day is the caller's to check), on moves neither delivered nor cancelled; locked
   * with SKIP LOCKED.
   */
  departureDue(manager: EntityManager, now: Date, moveIds?: string[]): Promise<DueRow[]> {
    return manager.query(
      `SELECT b.id FROM escort_bookings b JOIN moves mv ON mv.id = b.move_id
       WHERE b.status = 'confirmed' AND b.departure_reminder_sent_at IS NULL
         AND b.start_date BETWEEN ($1::timestamptz AT TIME ZONE 'UTC')::date AND ($1::timestamptz AT TIME ZONE 'UTC')::date + 2
         AND mv.stage NOT IN ('delivered','cancelled') ${moveIds ? 'AND b.move_id = ANY($2)' : ''}
       ORDER BY b.start_date LIMIT 200 FOR UPDATE OF b SKIP LOCKED`,
      moveIds ? [now, moveIds] : [now],
    );
  }

  async markReminded(manager: EntityManager, id: string, at: Date): Promise<void> {
    await manager.update(EscortBooking, { id }, { reminderSentAt: at });
  }

  async markDepartureReminded(manager: EntityManager, id: string, at: Date): Promise<void> {
    await manager.update(EscortBooking, { id }, { departureReminderSentAt: at });
  }
}
