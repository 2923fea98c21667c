/** Escort positions a move needs (from its per-jurisdiction assessment) and how far bookings cover them. Pure. */
import type { Reason } from '../engine/reasons';
import { jurisdictionByCode } from '../geo/jurisdictions';
import {
  ESCORT_POSITION_LABELS, type BookingStatus, type EscortCertification, type EscortOperator, type EscortPosition, type EscortVehicle,
  type SlotCoverageStatus, type VendorInsurance,
} from '../types/escorts';

/** The part of a jurisdiction's assessment this needs. */
export type EscortNeed = {
  code: string;
  name: string;
  escorts: { front: number; rear: number; heightPole: boolean; heightPoleSetIn: number | null; reasons: Reason[] };
};

export type RequiredSlot = {
  position: EscortPosition;
  seat: number;
  heightPoleSetIn: number | null;
  /** Jurisdictions where this slot is needed, with the reasons the rulebook gives there. */
  jurisdictions: { code: string; name: string; reasons: string[] }[];
};

/**
 * Turns each jurisdiction's front/rear count into seats: when a height pole is asked for, the first front escort
 * carries it (`height_pole` seat 1) and any other front escorts are `lead` seats; rear escorts are `chase` seats.
 * A slot is the same position and seat across jurisdictions, so one vendor can run it end to end.
 */
export function requiredEscortSlots(needs: readonly EscortNeed[]): RequiredSlot[] {
  const slots = new Map<string, RequiredSlot>();
  const add = (position: EscortPosition, seat: number, j: EscortNeed, reasons: string[]) => {
    const key = `${position}:${seat}`;
    let s = slots.get(key);
    if (!s) {
      s = { position, seat, heightPoleSetIn: null, jurisdictions: [] };
      slots.set(key, s);
    }
    if (position === 'height_pole' && j.escorts.heightPoleSetIn !== null) {
      s.heightPoleSetIn = Math.max(s.heightPoleSetIn ?? 0, j.escorts.heightPoleSetIn);
    }
    s.jurisdictions.push({ code: j.code, name: j.name, reasons });
  };
  for (const j of needs) {
    const e = j.escorts;
    const messages = e.reasons.map((r) => r.message);
    const pole = e.heightPole ? 1 : 0;
    if (pole) add('height_pole', 1, j, messages.filter((m) => /pole|height/i.test(m)).length ? messages.filter((m) => /pole|height/i.test(m)) : messages);
    const leads = Math.max(0, e.front - pole);
    for (let i = 1; i <= leads; i++) add('lead', i, j, messages);
    for (let i = 1; i <= e.rear; i++) add('chase', i, j, messages);
  }
  const order: Record<EscortPosition, number> = { height_pole: 0, lead: 1, chase: 2 };
  return [...slots.values()].sort((a, b) => order[a.position] - order[b.position] || a.seat - b.seat);
}

export const slotLabel = (position: EscortPosition, seat: number): string => `${ESCORT_POSITION_LABELS[position]}${seat > 1 ? ` #${seat}` : ''}`;

/** A booking as far as coverage is concerned. */
export type BookingCover = {
  id: string;
  position: EscortPosition;
  seat: number;
  jurisdictions: string[];
  status: BookingStatus;
  startDate: string;
  endDate: string;
  vendor: string;
};

export type SlotCoverage = Omit<RequiredSlot, 'jurisdictions'> & {
  jurisdictions: (RequiredSlot['jurisdictions'][number] & { status: SlotCoverageStatus; bookingId: string | null; vendor: string | null })[];
  satisfied: boolean;
};

const RANK: Record<SlotCoverageStatus, number> = { confirmed: 3, proposed: 2, requested: 1, open: 0 };

/**
 * For each required slot and jurisdiction, the best booking that covers it. A confirmed booking counts only when
 * its dates cover every travel day (a change of dates after confirmation reopens the slot).
 */
export function escortCoverage(slots: readonly RequiredSlot[], bookings: readonly BookingCover[], travelDates: readonly string[]): SlotCoverage[] {
  const first = travelDates[0];
  const last = travelDates[travelDates.length - 1];
  return slots.map((s) => {
    const jurisdictions = s.jurisdictions.map((j) => {
      let best: { status: SlotCoverageStatus; bookingId: string | null; vendor: string | null } = { status: 'open', bookingId: null, vendor: null };
      for (const b of bookings) {
        if (b.position !== s.position || b.seat !== s.seat || !b.jurisdictions.includes(j.code)) continue;
        let status: SlotCoverageStatus;
        if (b.status === 'confirmed') status = first && last && b.startDate <= first && b.endDate >= last ? 'confirmed' : 'open';
        else if (b.status === 'proposed' || b.status === 'requested') status = b.status;
        else continue;
        if (RANK[status] > RANK[best.status]) best = { status, bookingId: b.id, vendor: b.vendor };
      }
      return { ...j, ...best };
    });
    return { ...s, jurisdictions, satisfied: jurisdictions.every((j) => j.status === 'confirmed') };
  });
}

/**
 * Jurisdictions that ask escort (pilot car) operators to hold a certificate of their own.
 * SAMPLE DATA: several states certify escort operators and some accept other states' certificates; check the
 * state's current escort rules before relying on this list. Reciprocity is not modelled.
 */
export const ESCORT_CERTIFICATION_STATES: readonly string[] = ['AZ', 'CO', 'FL', 'GA', 'KS', 'MN', 'NC', 'NY', 'OK', 'PA', 'UT', 'VA', 'WA'];
export const ESCORT_CERTIFICATION_NOTE =
  'Which states ask for an escort certificate is sample data; check each state\u2019s current escort rules.';

export const certificationRequired = (state: string): boolean => ESCORT_CERTIFICATION_STATES.includes(state);

const stateName = (code: string) => jurisdictionByCode(code)?.name ?? code;

export type VendorFacts = {
  company: string;
  states: readonly string[];
  operators: readonly EscortOperator[];
  vehicles: readonly EscortVehicle[];
  insurance: VendorInsurance;
};

/**
 * Warnings for booking this vendor for this position on these jurisdictions and dates: certificates a state asks for
 * that no operator holds or that lapse before the run ends, insurance that lapses, a missing height pole or
 * markings. Warnings, not refusals: the dispatcher decides.
 */
export function bookingWarnings(v: VendorFacts, position: EscortPosition, jurisdictions: readonly string[], lastDay: string): string[] {
  const out: string[] = [];
  for (const code of jurisdictions) {
    if (!certificationRequired(code)) continue;
    const certs: { op: string; cert: EscortCertification }[] = v.operators.flatMap((o) => o.certifications.filter((c) => c.state === code).map((cert) => ({ op: o.name, cert })));
    if (!certs.length) {
      out.push(`${stateName(code)} asks for an escort certificate and no operator of ${v.company} holds one (sample data)`);
      continue;
    }
    if (!certs.some((c) => c.cert.expires >= lastDay)) {
      const latest = certs.reduce((a, b) => (a.cert.expires >= b.cert.expires ? a : b));
      out.push(`${stateName(code)} escort certificate of ${latest.op} (${latest.cert.number}) expires ${latest.cert.expires}, before the run ends ${lastDay}`);
    }
  }
  if (v.insurance.expires < lastDay) out.push(`insurance of ${v.company} expires ${v.insurance.expires}, before the run ends ${lastDay}`);
  if (position === 'height_pole' && !v.vehicles.some((x) => x.equipment.heightPole)) out.push(`${v.company} lists no vehicle with a height pole`);
  if (!v.vehicles.some((x) => x.equipment.amberLights && x.equipment.signs && x.equipment.flags)) {
    out.push(`${v.company} lists no vehicle with amber lights, OVERSIZE LOAD signs and flags`);
  }
  return out;
}

/** Certificates the vendor named when confirming, compared with what the states ask for. */
export function answerWarnings(jurisdictions: readonly string[], given: readonly { state: string; number: string }[]): string[] {
  return jurisdictions
    .filter((c) => certificationRequired(c) && !given.some((g) => g.state === c && g.number.trim()))
    .map((c) => `the vendor named no ${stateName(c)} escort certificate number (${stateName(c)} asks for one; sample data)`);
}

/** Lapsed insurance or certificates as of a day, for the vendor list. */
export function vendorWarnings(v: VendorFacts, today: string): string[] {
  const out: string[] = [];
  if (v.insurance.expires < today) out.push(`insurance expired ${v.insurance.expires}`);
  for (const o of v.operators) for (const c of o.certifications) if (c.expires < today) out.push(`${o.name}: ${stateName(c.state)} certificate expired ${c.expires}`);
  return out;
}
