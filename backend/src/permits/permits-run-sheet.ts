import { Injectable, OnModuleInit } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  describeDaylight, describeHolidays, describeWeekends, instantToLocal, PERMIT_STATUS_LABELS, travelSpan, zoneOf, type RunSheetPermit,
} from '@amberline/common';
import { travelDates } from '../moves/assessment.service';
import { RunSheetSourcesRegistry, type RunSheetSource } from '../run-sheets/run-sheet-sources';
import type { Permit } from './entities/permit.entity';
import { PermitsRepository, type RunSheetPermitRow } from './permits.repository';

/** The move a run sheet is built for, as the run-sheet module hands it over. */
type Move = Parameters<NonNullable<RunSheetSource['permits']>>[0];

/** Plain lines for the permit's structured conditions, as the driver reads them. */
function conditionLines(p: Pick<Permit, 'conditions' | 'conditionsText' | 'routeText'>): string[] {
  const c = p.conditions ?? {};
  const out: string[] = [];
  if (c.escortsFront || c.escortsRear) out.push(`escorts: ${c.escortsFront ?? 0} front, ${c.escortsRear ?? 0} rear`);
  if (c.heightPole) out.push('height pole required');
  const t = c.travel;
  if (t?.hours) out.push(`travel hours: ${t.hours.kind === 'any' ? 'any hour' : t.hours.kind === 'clock' ? `${t.hours.start}–${t.hours.end} local time` : describeDaylight(t.hours)}`);
  if (t?.weekendBans) out.push(`weekends: ${describeWeekends({ bans: t.weekendBans })}`);
  if (t?.holidays) out.push(`holidays: ${describeHolidays(t.holidays)}`);
  for (const cf of t?.curfews ?? []) out.push(`curfew: ${cf.area} ${cf.start}–${cf.end}${cf.appliesIn === 'urban' ? ' (urban)' : ''}`);
  if (c.travelHours) out.push(`travel hours: ${c.travelHours}`);
  if (c.holidays) out.push(`holidays: ${c.holidays}`);
  if (c.maxSpeedMph) out.push(`maximum speed ${c.maxSpeedMph} mph`);
  for (const u of c.utilityContacts ?? []) out.push(`utility contact: ${u}`);
  if (p.conditionsText) out.push(p.conditionsText);
  if (p.routeText) out.push(`permitted route: ${p.routeText}`);
  return out;
}

/** Gives the driver's run sheet the move's permits (number, validity, conditions, PDF) and the permitted dimensions. */
@Injectable()
export class PermitsRunSheetSource implements RunSheetSource, OnModuleInit {
  readonly name = 'permits';
  /** One read of a move's permits per run-sheet build (both methods receive the same move object). */
  private readonly loaded = new WeakMap<Move, Promise<RunSheetPermitRow[]>>();
  constructor(
    private readonly registry: RunSheetSourcesRegistry,
    private readonly repo: PermitsRepository,
  ) {}

  /** The move's permits with each one's latest PDF, in one statement. */
  private permitsOf(move: Move, manager: EntityManager): Promise<RunSheetPermitRow[]> {
    let p = this.loaded.get(move);
    if (!p) {
      p = this.repo.runSheetRows(manager, move.id);
      this.loaded.set(move, p);
    }
    return p;
  }

  onModuleInit(): void {
    this.registry.register(this);
  }

  async permits(move: Move, manager: EntityManager): Promise<RunSheetPermit[]> {
    const list = await this.permitsOf(move, manager);
    if (!list.length) return [];
    const dates = travelDates(move.requestedDeparture, move.travelDays);
    return list.map((p) => {
      const tz = zoneOf(p.jurisdiction);
      let warning: string | null = null;
      if (p.validTo) {
        // the planned exit from the state: the end of the last travel day there, local time
        const exit = travelSpan(dates, tz).end;
        if (p.validTo < exit) warning = `valid only until ${instantToLocal(p.validTo, tz).replace('T', ' ')} (${tz}), before the planned exit from ${p.jurisdiction} at the end of ${dates[dates.length - 1]}`;
      }
      if (p.status === 'needs_amendment') warning = `needs amendment${p.amendmentReason ? `: ${p.amendmentReason}` : ''} — do not run on it`;
      return {
        jurisdiction: p.jurisdiction,
        status: PERMIT_STATUS_LABELS[p.status].toLowerCase(),
        number: p.permitNumber,
        validFrom: p.validFrom ? instantToLocal(p.validFrom, tz).replace('T', ' ') : null,
        validTo: p.validTo ? instantToLocal(p.validTo, tz).replace('T', ' ') : null,
        conditions: conditionLines(p),
        documentUrl: p.documentId ? `/api/permits/${p.id}/documents/${p.documentId}` : null,
        warning: warning ?? (p.expiryWarning || null),
      };
    });
  }

  /** The smallest of each permitted dimension across the move's issued permits: what the loaded rig must not exceed. */
  async permittedDimensions(move: Move, manager: EntityManager): Promise<{ heightIn: number; widthIn: number; lengthIn: number } | null> {
    const issued = (await this.permitsOf(move, manager)).filter((p) => p.status === 'issued' && p.permitted);
    if (!issued.length) return null;
    return {
      heightIn: Math.min(...issued.map((p) => p.permitted!.heightIn)),
      widthIn: Math.min(...issued.map((p) => p.permitted!.widthIn)),
      lengthIn: Math.min(...issued.map((p) => p.permitted!.lengthIn)),
    };
  }
}
