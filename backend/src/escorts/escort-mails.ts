import { createEvent } from 'ics';
import {
  BOOKING_STATUS_LABELS, ESCORT_CERTIFICATION_NOTE, ESCORT_POSITION_LABELS, formatFeetInches, formatPounds, formatZoned, jurisdictionByCode, slotLabel,
} from '@amberline/common';
import type { OutgoingMail } from '../mail/mail.service';
import type { EscortBooking } from './entities/escort-booking.entity';

/** The e-mails of escort bookings. Plain text; links are absolute, from APP_URL. */

const stateNames = (codes: string[]) => codes.map((c) => jurisdictionByCode(c)?.name ?? c).join(', ');
const dates = (b: Pick<EscortBooking, 'startDate' | 'endDate'>) => (b.startDate === b.endDate ? b.startDate : `${b.startDate} to ${b.endDate}`);
const related = (b: EscortBooking) => ({ entity: 'escort_booking', id: b.id });
const CAUTION = 'The issued permits govern the escort positions, routes and travel times; follow them and the state rules where they differ from this summary.';

export type VendorContact = { company: string; email: string; contactName: string };

/** The run in a few lines: load, dimensions, route in the booked states, dates, meeting point. */
export function runDetails(b: EscortBooking): string {
  const s = b.requestSummary;
  const d = s.move.dimensions;
  const lines = [
    `Move ${s.move.reference}: ${s.move.commodity}, ${s.move.origin} to ${s.move.destination}`,
    `Position: ${slotLabel(b.position, b.seat)} in ${stateNames(b.jurisdictions)}`,
    `Dates: ${dates(b)}`,
    `Meeting point: ${b.meetingPoint}${b.meetingTime ? ` at ${b.meetingTime} local time` : ''}`,
    `Load: ${formatFeetInches(d.widthIn)} wide, ${formatFeetInches(d.heightIn)} high, ${formatFeetInches(d.lengthIn)} long` +
      `${d.frontOverhangIn > 0 ? `, front overhang ${formatFeetInches(d.frontOverhangIn)}` : ''}${d.rearOverhangIn > 0 ? `, rear overhang ${formatFeetInches(d.rearOverhangIn)}` : ''}, gross ${formatPounds(d.grossLb)}`,
    ...(s.heightPoleSetIn && b.position === 'height_pole' ? [`Height pole setting: ${formatFeetInches(s.heightPoleSetIn)}`] : []),
    'Route:',
    ...s.move.route.map((r) => `  ${r.order}. ${r.jurisdiction} ${r.roads} (${r.miles} mi, ${r.roadType})`),
    ...(b.notes ? [`Notes: ${b.notes}`] : []),
  ];
  return lines.join('\n');
}

/** Times in these mails are read in the zone of the first state the escort covers. */
const zoneOfBooking = (b: EscortBooking): string => jurisdictionByCode(b.jurisdictions[0] ?? '')?.timeZone ?? 'America/Chicago';
const linkExpiry = (b: EscortBooking, at: Date): string => formatZoned(at.getTime(), zoneOfBooking(b));

const signature = (b: EscortBooking) =>
  b.requestSummary.requestedBy ? `${b.requestSummary.requestedBy.name}, dispatch\n${b.requestSummary.requestedBy.email}` : 'Dispatch';

export function requestMail(b: EscortBooking, v: VendorContact, link: string, expiresAt: Date): OutgoingMail {
  const certs = b.requestSummary.certificationStates.filter((c) => b.jurisdictions.includes(c));
  return {
    to: v.email,
    subject: `Escort request ${b.requestSummary.move.reference}: ${slotLabel(b.position, b.seat)}, ${dates(b)}`,
    text: [
      `Hello ${v.contactName},`,
      '',
      `We would like to book ${v.company} for an escort on the run below.`,
      '',
      runDetails(b),
      '',
      'Confirm the dates (with the operator, vehicle, phone and certificate numbers), decline, or propose other dates here:',
      link,
      `The link works once and until ${linkExpiry(b, expiresAt)}.`,
      ...(certs.length ? ['', `${stateNames(certs)} ask for an escort operator certificate. ${ESCORT_CERTIFICATION_NOTE}`] : []),
      '',
      CAUTION,
      '',
      signature(b),
    ].join('\n'),
    related: related(b),
  };
}

export function reminderMail(b: EscortBooking, v: VendorContact, link: string, expiresAt: Date): OutgoingMail {
  return {
    to: v.email,
    subject: `Reminder: escort request ${b.requestSummary.move.reference} awaits your answer`,
    text: [
      `Hello ${v.contactName},`,
      '',
      `We have not had your answer to our escort request of ${formatZoned(b.requestedAt.getTime(), zoneOfBooking(b))}.`,
      '',
      runDetails(b),
      '',
      'Answer here (a new link; the earlier one also works until it expires):',
      link,
      `This link works once and until ${linkExpiry(b, expiresAt)}.`,
      '',
      signature(b),
    ].join('\n'),
    dedupeKey: `escort-reminder:${b.id}`,
    related: related(b),
  };
}

export function dispatcherReminderNotice(b: EscortBooking, v: VendorContact, to: string): OutgoingMail {
  return {
    to,
    subject: `No answer yet from ${v.company}: ${b.requestSummary.move.reference} ${slotLabel(b.position, b.seat)}`,
    text: [
      `${v.company} has not answered the escort request for ${b.requestSummary.move.reference} (${slotLabel(b.position, b.seat)}, ${stateNames(b.jurisdictions)}, ${dates(b)}) in 24 hours.`,
      'A reminder with a new link went to the vendor. Call them, or call the booking off and ask another vendor.',
    ].join('\n'),
    dedupeKey: `escort-reminder-notice:${b.id}`,
    related: related(b),
  };
}

/** An all-day calendar entry over the booked dates, with the meeting point and run details. */
export function calendarFile(b: EscortBooking): string {
  const [y1, m1, d1] = b.startDate.split('-').map(Number);
  const end = new Date(Date.parse(`${b.endDate}T00:00:00Z`) + 86_400_000);
  const { error, value } = createEvent({
    uid: `${b.id}@escorts.amberline`,
    productId: 'amberline/escorts',
    method: 'PUBLISH',
    title: `Escort ${b.requestSummary.move.reference}: ${slotLabel(b.position, b.seat)}${b.meetingTime ? `, meet ${b.meetingTime}` : ''}`,
    description: runDetails(b),
    location: b.meetingPoint,
    status: 'CONFIRMED',
    start: [y1, m1, d1],
    end: [end.getUTCFullYear(), end.getUTCMonth() + 1, end.getUTCDate()],
  });
  if (error || !value) throw new Error(`calendar file: ${error?.message ?? 'empty'}`);
  return value;
}

export function confirmationMail(b: EscortBooking, v: VendorContact): OutgoingMail {
  const a = b.answer!;
  return {
    to: v.email,
    subject: `Confirmed: escort ${b.requestSummary.move.reference}, ${dates(b)}`,
    text: [
      `Hello ${v.contactName},`,
      '',
      'Thank you, your escort is booked:',
      '',
      runDetails(b),
      '',
      `Operator: ${a.operatorName}, ${a.phone}; vehicle: ${a.vehicle}`,
      ...(a.certifications?.length ? [`Certificates: ${a.certifications.map((c) => `${c.state} ${c.number}`).join(', ')}`] : []),
      '',
      'The calendar file attached holds the dates and the meeting point. We will send the run details again the day before departure.',
      '',
      CAUTION,
      '',
      signature(b),
    ].join('\n'),
    attachments: [{ filename: `escort-${b.requestSummary.move.reference}.ics`, contentType: 'text/calendar; charset=utf-8; method=PUBLISH', content: calendarFile(b) }],
    related: related(b),
  };
}

export function answerNotice(b: EscortBooking, v: VendorContact, to: string): OutgoingMail {
  const a = b.answer!;
  const head = `${v.company} answered the escort request for ${b.requestSummary.move.reference} (${slotLabel(b.position, b.seat)}, ${stateNames(b.jurisdictions)}, ${dates(b)}):`;
  const body =
    a.decision === 'confirm'
      ? [`Confirmed. Operator ${a.operatorName}, ${a.phone}; vehicle ${a.vehicle}.`, ...(a.certifications?.length ? [`Certificates: ${a.certifications.map((c) => `${c.state} ${c.number}`).join(', ')}`] : [])]
      : a.decision === 'decline'
        ? [`Declined: ${a.reason}`, 'The position is open again; ask another vendor.']
        : [`Proposes other dates: ${a.proposedStart} to ${a.proposedEnd}.${a.note ? ` ${a.note}` : ''}`, 'The position stays open until it is confirmed for the move\u2019s dates.'];
  return {
    to,
    subject: `${BOOKING_STATUS_LABELS[b.status]}: ${v.company}, ${b.requestSummary.move.reference} ${slotLabel(b.position, b.seat)}`,
    text: [head, '', ...body, ...(b.warnings.length ? ['', 'Warnings:', ...b.warnings.map((w) => `- ${w}`)] : [])].join('\n'),
    related: related(b),
  };
}

export function departureReminderMail(b: EscortBooking, v: VendorContact, driverName: string | null): OutgoingMail {
  const a = b.answer;
  return {
    to: v.email,
    subject: `Tomorrow: escort ${b.requestSummary.move.reference}, meet at ${b.meetingPoint}`,
    text: [
      `Hello ${v.contactName},`,
      '',
      `A reminder of the escort run starting ${b.startDate}:`,
      '',
      runDetails(b),
      '',
      ...(a?.operatorName ? [`Your operator: ${a.operatorName}, ${a.phone}; vehicle ${a.vehicle}`] : []),
      ...(driverName ? [`Driver of the load: ${driverName}`] : []),
      '',
      CAUTION,
      '',
      signature(b),
    ].join('\n'),
    attachments: [{ filename: `escort-${b.requestSummary.move.reference}.ics`, contentType: 'text/calendar; charset=utf-8; method=PUBLISH', content: calendarFile(b) }],
    dedupeKey: `escort-departure:${b.id}:${b.startDate}`,
    related: related(b),
  };
}

export function cancellationMail(b: EscortBooking, v: VendorContact): OutgoingMail {
  return {
    to: v.email,
    subject: `Called off: escort ${b.requestSummary.move.reference}, ${dates(b)}`,
    text: [
      `Hello ${v.contactName},`,
      '',
      `We have called off the escort ${slotLabel(b.position, b.seat)} for ${b.requestSummary.move.reference} (${stateNames(b.jurisdictions)}, ${dates(b)}).`,
      `Reason: ${b.cancelReason}`,
      'Any link we sent for this request no longer works.',
      '',
      signature(b),
    ].join('\n'),
    related: related(b),
  };
}

export const positionName = (p: EscortBooking['position']) => ESCORT_POSITION_LABELS[p];
