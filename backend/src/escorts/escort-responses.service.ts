import { Injectable } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  answerWarnings, BOOKING_STATUS_LABELS, DOMAIN_ERRORS, DomainError, ESCORT_POSITION_LABELS, jurisdictionByCode, localDate, PLANNING_CAUTION,
  type EscortAnswer, type EscortAnswerResult, type EscortRequestView,
} from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { fieldError } from '../core/app-exception';
import { MailService } from '../mail/mail.service';
import { MovesRepository, type Move } from '../moves/moves.repository';
import { EscortAnswerDto } from './dto/escorts.dto';
import type { EscortBooking } from './entities/escort-booking.entity';
import type { EscortResponseToken } from './entities/escort-response-token.entity';
import { answerNotice, confirmationMail } from './escort-mails';
import { hashToken, TOKEN_PATTERN } from './escort-tokens';
import { EscortsRepository, type BookingVendor } from './escorts.repository';

/**
 * Answers for a link that cannot be used. They say why, and nothing about the booking behind it. An invalid or
 * expired link keeps its plain body (`{ statusCode, error, message, details }`, no domain code): the vendor's page
 * and its tests read exactly that; a used or closed link is the domain's LINK_CLOSED, with `details.link` saying which.
 */
const INVALID = () => new DomainError(DOMAIN_ERRORS.NOT_FOUND, 'This link is not valid. Check that it was copied whole, or ask the dispatcher who sent it for a new one.', { link: 'invalid' });
const EXPIRED = () => new DomainError(DOMAIN_ERRORS.GONE, 'This link has expired. Ask the dispatcher who sent it for a new one.', { link: 'expired' });
const USED = () => new DomainError(DOMAIN_ERRORS.LINK_CLOSED, 'This link has already been used to answer. Call the dispatcher to change the answer.', { link: 'used' });
const CLOSED = () => new DomainError(DOMAIN_ERRORS.LINK_CLOSED, 'This request is no longer open. Call the dispatcher if you have questions.', { link: 'closed' });

const MAX_PROPOSAL_DAYS = 60;

type Found = { token: EscortResponseToken; booking: EscortBooking; move: Move; vendor: BookingVendor };

/** The vendor's side: the request behind a link, and the one answer it takes. No account; the link is the credential. */
@Injectable()
export class EscortResponsesService {
  constructor(
    private readonly repo: EscortsRepository,
    private readonly moves: MovesRepository,
    private readonly audit: AuditService,
    private readonly mail: MailService,
  ) {}

  private async find(m: EntityManager, token: string, now: Date, lock: boolean): Promise<Found> {
    if (!TOKEN_PATTERN.test(token)) throw INVALID();
    const { token: t, booking } = await this.repo.linkWithBooking(m, hashToken(token), lock);
    if (!t || !booking) throw INVALID();
    if (t.usedAt || booking.status === 'confirmed' || booking.status === 'declined' || booking.status === 'proposed') throw USED();
    if (booking.status !== 'requested') throw CLOSED();
    if (t.expiresAt.getTime() <= now.getTime()) throw EXPIRED();
    const move = await this.moves.findWithEquipment(booking.moveId, m);
    if (!move || ['running', 'delivered', 'cancelled'].includes(move.stage)) throw CLOSED();
    const vendor = await this.repo.vendorOf(m, booking.id);
    return { token: t, booking, move, vendor };
  }

  async view(token: string, now: Date): Promise<EscortRequestView> {
    const { token: t, booking: b, vendor: v } = await this.find(this.repo.manager, token, now, false);
    const s = b.requestSummary;
    return {
      vendor: {
        company: v.company,
        operators: v.operators.map((o) => ({ name: o.name, phone: o.phone ?? null, certifications: o.certifications.map((c) => ({ state: c.state, number: c.number })) })),
        vehicles: v.vehicles.map((x) => ({ label: x.label, plate: x.plate ?? null })),
      },
      requestedBy: s.requestedBy,
      move: s.move,
      position: b.position,
      positionLabel: ESCORT_POSITION_LABELS[b.position],
      seat: b.seat,
      jurisdictions: b.jurisdictions,
      startDate: b.startDate,
      endDate: b.endDate,
      meetingPoint: b.meetingPoint,
      meetingTime: b.meetingTime,
      notes: b.notes,
      heightPoleSetIn: s.heightPoleSetIn,
      certificationStates: s.certificationStates,
      linkExpiresAt: t.expiresAt.toISOString(),
      caution: `The issued permits govern escort positions, routes and travel times. ${PLANNING_CAUTION}`,
    };
  }

  /** Validity windows of the move's issued permits, by jurisdiction (the permits table may not exist yet). */
  private async permitWindows(m: EntityManager, move: Move, jurisdictions: string[]): Promise<{ code: string; from: string; to: string }[]> {
    const rows = await this.repo.issuedPermitWindows(m, move.id, jurisdictions);
    return rows.map((r) => {
      const tz = move.route.find((s) => s.jurisdiction === r.jurisdiction)?.timeZone ?? jurisdictionByCode(r.jurisdiction)?.timeZone ?? 'UTC';
      return { code: r.jurisdiction, from: localDate(r.validFrom.getTime(), tz), to: localDate(r.validTo.getTime(), tz) };
    });
  }

  private async checkAnswer(m: EntityManager, dto: EscortAnswerDto, f: Found, now: Date): Promise<EscortAnswer> {
    if (dto.decision === 'confirm') {
      if (!dto.operatorName) throw fieldError('operatorName', 'name the operator who will drive the escort vehicle');
      if (!dto.vehicle) throw fieldError('vehicle', 'name the escort vehicle (e.g. make, color, plate)');
      if (!dto.phone) throw fieldError('phone', 'give a phone number that reaches the operator on the road');
      const certs = (dto.certifications ?? []).filter((c) => c.number);
      return { decision: 'confirm', operatorName: dto.operatorName, vehicle: dto.vehicle, phone: dto.phone, certifications: certs, ...(dto.note ? { note: dto.note } : {}) };
    }
    if (dto.decision === 'decline') {
      if (!dto.reason) throw fieldError('reason', 'say why you decline, so the dispatcher can plan');
      return { decision: 'decline', reason: dto.reason };
    }
    const { proposedStart: start, proposedEnd: end } = dto;
    if (!start) throw fieldError('proposedStart', 'give the first day you could run, YYYY-MM-DD');
    if (!end) throw fieldError('proposedEnd', 'give the last day of the run you propose, YYYY-MM-DD');
    for (const [field, d] of [['proposedStart', start], ['proposedEnd', end]] as const) {
      if (Number.isNaN(Date.parse(`${d}T00:00:00Z`)) || new Date(`${d}T00:00:00Z`).toISOString().slice(0, 10) !== d) throw fieldError(field, 'is not a real date');
    }
    if (end < start) throw fieldError('proposedEnd', 'must not be before proposedStart');
    const today = localDate(now.getTime(), f.booking.requestSummary.timeZone);
    if (start <= today) throw fieldError('proposedStart', `must be after today (${today})`);
    if ((Date.parse(end) - Date.parse(start)) / 86_400_000 + 1 > MAX_PROPOSAL_DAYS) throw fieldError('proposedEnd', `a run of at most ${MAX_PROPOSAL_DAYS} days`);
    if (start === f.booking.startDate && end === f.booking.endDate) throw fieldError('proposedStart', 'these are the requested dates; confirm instead');
    for (const w of await this.permitWindows(m, f.move, f.booking.jurisdictions)) {
      const name = jurisdictionByCode(w.code)?.name ?? w.code;
      if (start < w.from || end > w.to) {
        throw fieldError(start < w.from ? 'proposedStart' : 'proposedEnd', `the ${name} permit for this move is valid ${w.from} to ${w.to}; propose dates inside it, or call the dispatcher`);
      }
    }
    return { decision: 'propose', proposedStart: start, proposedEnd: end, ...(dto.note ? { note: dto.note } : {}) };
  }

  /** Records the one answer a link takes. Everything (booking, token, audit, e-mails) in one transaction. */
  async answer(token: string, dto: EscortAnswerDto, now: Date): Promise<EscortAnswerResult> {
    return this.repo.transaction(async (m) => {
      const f = await this.find(m, token, now, true);
      const answer = await this.checkAnswer(m, dto, f, now);
      const b = f.booking;
      const newWarnings = answer.decision === 'confirm' ? answerWarnings(b.jurisdictions, answer.certifications ?? []) : [];
      b.status = answer.decision === 'confirm' ? 'confirmed' : answer.decision === 'decline' ? 'declined' : 'proposed';
      b.answer = answer;
      b.respondedAt = now;
      b.warnings = [...b.warnings, ...newWarnings];
      b.version += 1;
      await this.repo.saveBooking(m, b);
      // every link of this booking is spent by one answer
      await this.repo.spendLinks(m, b.id, now);
      await this.audit.record(m, {
        moveId: b.moveId, entity: 'escort_booking', entityId: b.id, action: 'answered', actorId: null,
        before: { status: 'requested' }, after: { status: b.status, by: f.vendor.company, answer }, reason: answer.reason ?? null,
      });
      if (answer.decision === 'confirm') await this.mail.enqueue(m, confirmationMail(b, f.vendor));
      const dispatcher = b.requestSummary.requestedBy?.email;
      if (dispatcher) await this.mail.enqueue(m, answerNotice(b, f.vendor, dispatcher));
      const message =
        answer.decision === 'confirm'
          ? 'Thank you: the escort is booked. A confirmation with a calendar file is on its way to you.'
          : answer.decision === 'decline'
            ? 'Thank you: the dispatcher has your answer and will ask someone else.'
            : 'Thank you: the dispatcher has your proposed dates and will be in touch.';
      return { decision: answer.decision, status: b.status, message: `${BOOKING_STATUS_LABELS[b.status]}. ${message}`, warnings: newWarnings };
    });
  }
}
