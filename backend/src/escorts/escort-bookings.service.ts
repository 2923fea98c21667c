import { Inject, Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  bookingWarnings, DOMAIN_ERRORS, DomainError, ESCORT_CERTIFICATION_STATES, escortCoverage, jurisdictionByCode, localDate, PLANNING_CAUTION, requiredEscortSlots,
  RULEBOOK_CAUTION, slotLabel, travelDates,
  type AssessmentDto, type BookingStatus, type EscortBookingDto, type MoveEscortsDto, type SessionUser, type SlotCoverage,
} from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { MailService } from '../mail/mail.service';
import { MAIL_SETTINGS, type MailSettings } from '../mail/mail.settings';
import type { Move } from '../moves/moves.repository';
import { MovesService } from '../moves/moves.service';
import { VendorsService } from '../vendors/vendors.service';
import { CancelEscortBookingDto, CreateEscortBookingDto } from './dto/escorts.dto';
import type { EscortBooking, RequestSummary } from './entities/escort-booking.entity';
import { cancellationMail, requestMail } from './escort-mails';
import { hashToken, linkExpiry, newToken } from './escort-tokens';
import { EscortsRepository } from './escorts.repository';

/** Bookings that still hold (or may come to hold) their position. */
export const ACTIVE_STATUSES = ['requested', 'proposed', 'confirmed'] as const satisfies readonly BookingStatus[];
const CLOSED_STAGES = ['running', 'delivered', 'cancelled'];

export function toBookingDto(b: EscortBooking, linkExpiresAt: Date | null): EscortBookingDto {
  return {
    id: b.id,
    moveId: b.moveId,
    vendor: { id: b.vendorId, company: b.vendor?.company ?? '', email: b.vendor?.email ?? '', phone: b.vendor?.phone ?? '' },
    position: b.position,
    seat: b.seat,
    jurisdictions: b.jurisdictions,
    startDate: b.startDate,
    endDate: b.endDate,
    meetingPoint: b.meetingPoint,
    meetingTime: b.meetingTime,
    notes: b.notes,
    status: b.status,
    requestedAt: b.requestedAt.toISOString(),
    requestedBy: b.requestedBy ? { id: b.requestedBy.id, name: b.requestedBy.name } : null,
    respondedAt: b.respondedAt?.toISOString() ?? null,
    answer: b.answer,
    cancelReason: b.cancelReason,
    warnings: b.warnings,
    linkExpiresAt: b.status === 'requested' && linkExpiresAt ? linkExpiresAt.toISOString() : null,
    reminderSentAt: b.reminderSentAt?.toISOString() ?? null,
    version: b.version,
  };
}

/** The first segment's zone: dates of the run are read there. */
export const moveTimeZone = (m: Pick<Move, 'route' | 'jurisdictions'>): string => m.route[0]?.timeZone ?? jurisdictionByCode(m.jurisdictions[0] ?? '')?.timeZone ?? 'America/Chicago';

@Injectable()
export class EscortBookingsService {
  constructor(
    private readonly repo: EscortsRepository,
    private readonly moves: MovesService,
    private readonly vendors: VendorsService,
    private readonly audit: AuditService,
    private readonly mail: MailService,
    @Inject(MAIL_SETTINGS) private readonly mailSettings: MailSettings,
  ) {}

  link(token: string): string {
    return `${this.mailSettings.appUrl}/escort-response/${token}`;
  }

  /** Required positions of a move (from its assessment) against its bookings. */
  async coverage(manager: EntityManager, move: Move, assessment: AssessmentDto): Promise<SlotCoverage[]> {
    const slots = requiredEscortSlots(assessment.result.jurisdictions);
    if (!slots.length) return [];
    const bookings = await this.repo.withStatus(manager, move.id, ACTIVE_STATUSES);
    return escortCoverage(
      slots,
      bookings.map((b) => ({ ...b, vendor: b.vendor?.company ?? '' })),
      travelDates(move.requestedDeparture, move.travelDays),
    );
  }

  /** Issues a link for a booking; returns the token (for the e-mail only) and its expiry. */
  async issueLink(manager: EntityManager, booking: Pick<EscortBooking, 'id'>, move: Pick<Move, 'requestedDeparture' | 'route' | 'jurisdictions'>, now: Date): Promise<{ token: string; expiresAt: Date }> {
    const token = newToken();
    const expiresAt = linkExpiry(now, move.requestedDeparture, moveTimeZone(move));
    await this.repo.insertLink(manager, booking.id, hashToken(token), expiresAt);
    return { token, expiresAt };
  }

  async forMove(moveId: string, viewer: SessionUser, now: Date): Promise<MoveEscortsDto> {
    const move = await this.moves.get(moveId, viewer);
    const assessment = await this.moves.assessmentOf(move, now);
    const coverage = await this.coverage(this.repo.manager, move, assessment);
    const bookings = await this.repo.forMove(moveId);
    const expiries = await this.repo.linkExpiries(bookings.filter((b) => b.status === 'requested').map((b) => b.id));
    return {
      moveId: move.id,
      reference: move.reference,
      stage: move.stage,
      planRevision: move.planRevision,
      travelDates: travelDates(move.requestedDeparture, move.travelDays),
      needsEscorts: coverage.length > 0,
      escortsNotOnFile: assessment.result.summary.escortsNotOnFile,
      slots: coverage.map((s) => ({
        position: s.position,
        seat: s.seat,
        label: slotLabel(s.position, s.seat),
        heightPoleSetIn: s.heightPoleSetIn,
        jurisdictions: s.jurisdictions,
        satisfied: s.satisfied,
      })),
      bookings: bookings.map((b) => toBookingDto(b, expiries.get(b.id) ?? null)),
      certificationStates: move.jurisdictions.filter((c) => ESCORT_CERTIFICATION_STATES.includes(c)),
      caution: `${RULEBOOK_CAUTION} ${PLANNING_CAUTION}`,
    };
  }

  /** Asks a vendor for one required position on some of the move's jurisdictions; the request e-mail goes to the outbox in the same transaction. */
  async request(moveId: string, dto: CreateEscortBookingDto, actor: SessionUser, now: Date): Promise<EscortBookingDto> {
    const { bookingId, expiresAt } = await this.repo.transaction(async (m) => {
      const move = await this.moves.lockForUpdate(m, moveId);
      if (CLOSED_STAGES.includes(move.stage)) throw new DomainError(DOMAIN_ERRORS.RECORD_CLOSED, `Escorts cannot be booked for a move that is ${move.stage}`);
      const days = travelDates(move.requestedDeparture, move.travelDays);
      const tz = moveTimeZone(move);
      if (days[0] <= localDate(now.getTime(), tz)) {
        throw new DomainError(DOMAIN_ERRORS.TOO_LATE, `The move departs ${days[0]}: too late to ask through a link; call the vendor and book by phone`);
      }
      const assessment = await this.moves.assessmentOf(move, now, m);
      const slots = requiredEscortSlots(assessment.result.jurisdictions);
      const label = slotLabel(dto.position, dto.seat);
      const slot = slots.find((s) => s.position === dto.position && s.seat === dto.seat);
      if (!slot) {
        const needed = slots.map((s) => slotLabel(s.position, s.seat)).join(', ') || 'none';
        throw fieldError('position', `the assessment asks for no ${label} on this move (it asks for: ${needed})`);
      }
      const jurisdictions = [...new Set(dto.jurisdictions)];
      const outside = jurisdictions.filter((j) => !slot.jurisdictions.some((x) => x.code === j));
      if (outside.length) {
        throw fieldError('jurisdictions', `${outside.join(', ')}: no ${label} needed there (needed in ${slot.jurisdictions.map((x) => x.code).join(', ')})`);
      }
      const taken = await this.repo.holding(m, moveId, dto.position, dto.seat, jurisdictions, ACTIVE_STATUSES);
      if (taken) {
        throw new DomainError(DOMAIN_ERRORS.ALREADY_TAKEN, `${label} in ${taken.jurisdictions.filter((j) => jurisdictions.includes(j)).join(', ')} is already ${taken.status} with ${taken.vendor?.company}; call that booking off first`);
      }
      const vendor = await this.vendors.get(dto.vendorId, m);
      if (!vendor.active) throw fieldError('vendorId', `${vendor.company} is inactive`);
      const uncovered = jurisdictions.filter((j) => !vendor.states.includes(j));
      if (uncovered.length) throw fieldError('vendorId', `${vendor.company} does not cover ${uncovered.join(', ')}`);

      const requester = await this.repo.userContact(m, actor.id);
      const dims = assessment.result.dimensions;
      const summary: RequestSummary = {
        move: {
          reference: move.reference,
          commodity: move.commodity,
          origin: move.origin,
          destination: move.destination,
          travelDates: days,
          dimensions: {
            widthIn: dims.widthIn, heightIn: dims.heightIn, lengthIn: dims.lengthIn, frontOverhangIn: dims.frontOverhangIn, rearOverhangIn: dims.rearOverhangIn,
            grossLb: assessment.result.axleLoads.grossLb,
          },
          route: move.route
            .filter((r) => jurisdictions.includes(r.jurisdiction))
            .map((r) => ({ order: r.order, jurisdiction: r.jurisdiction, roads: r.roads, miles: r.miles, roadType: r.roadType })),
        },
        heightPoleSetIn: dto.position === 'height_pole' ? slot.heightPoleSetIn : null,
        requestedBy: requester ? { name: requester.name, email: requester.email } : null,
        certificationStates: jurisdictions.filter((c) => ESCORT_CERTIFICATION_STATES.includes(c)),
        timeZone: tz,
      };
      const booking = await this.repo.insertBooking(m, {
        moveId, vendorId: vendor.id, position: dto.position, seat: dto.seat, jurisdictions,
        startDate: days[0], endDate: days[days.length - 1],
        meetingPoint: dto.meetingPoint, meetingTime: dto.meetingTime ?? null, notes: dto.notes?.trim() || null,
        status: 'requested', requestSummary: summary, warnings: bookingWarnings(vendor, dto.position, jurisdictions, days[days.length - 1]),
        requestedById: actor.id, requestedAt: now, planRevision: move.planRevision,
      });
      const { token, expiresAt } = await this.issueLink(m, booking, move, now);
      await this.audit.record(m, {
        moveId, entity: 'escort_booking', entityId: booking.id, action: 'requested', actorId: actor.id,
        after: { vendor: vendor.company, position: booking.position, seat: booking.seat, jurisdictions, startDate: booking.startDate, endDate: booking.endDate, warnings: booking.warnings },
      });
      await this.mail.enqueue(m, requestMail(booking, vendor, this.link(token), expiresAt));
      return { bookingId: booking.id, expiresAt };
    });
    return toBookingDto(await this.repo.load(bookingId), expiresAt);
  }

  async cancel(moveId: string, bookingId: string, dto: CancelEscortBookingDto, actor: SessionUser): Promise<EscortBookingDto> {
    await this.repo.transaction(async (m) => {
      const b = await this.repo.lockBooking(m, moveId, bookingId);
      if (!b) throw new DomainError(DOMAIN_ERRORS.NOT_FOUND, `No escort booking ${bookingId} on move ${moveId}`);
      if (b.version !== dto.version) throw new DomainError(DOMAIN_ERRORS.VERSION_CONFLICT, `This booking changed (version ${b.version}, yours ${dto.version}); reload it`);
      if (!ACTIVE_STATUSES.includes(b.status as (typeof ACTIVE_STATUSES)[number])) throw new DomainError(DOMAIN_ERRORS.TRANSITION_REFUSED, `A ${b.status} booking cannot be called off`);
      const before = b.status;
      b.status = 'cancelled';
      b.cancelReason = dto.reason;
      b.version += 1;
      await this.repo.saveBooking(m, b);
      const vendor = await this.repo.vendorOf(m, b.id);
      await this.audit.record(m, {
        moveId, entity: 'escort_booking', entityId: b.id, action: 'cancelled', actorId: actor.id, before: { status: before }, after: { status: 'cancelled' }, reason: dto.reason,
      });
      await this.mail.enqueue(m, cancellationMail(b, vendor));
    });
    return toBookingDto(await this.repo.load(bookingId), null);
  }
}
