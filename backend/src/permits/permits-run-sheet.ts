import { Injectable, OnModuleInit } from '@nestjs/common';
import { In, Not, type EntityManager } from 'typeorm';
import { PERMIT_STATUS_LABELS, type RunSheetPermit } from '@amberline/common';
import { travelDates } from '../moves/assessment.service';
import type { Move } from '../moves/entities/move.entity';
import { RunSheetSourcesRegistry, type RunSheetSource } from '../run-sheets/run-sheet-sources';
import { PermitDocument } from './entities/permit-document.entity';
import { Permit } from './entities/permit.entity';
import { instantToLocal, travelSpan, zoneOf } from './permit-rules';

/** Plain lines for the permit's structured conditions, as the driver reads them. */
function conditionLines(p: Permit): string[] {
  const c = p.conditions ?? {};
  const out: string[] = [];
  if (c.escortsFront || c.escortsRear) out.push(`escorts: ${c.escortsFront ?? 0} front, ${c.escortsRear ?? 0} rear`);
  if (c.heightPole) out.push('height pole required');
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
  private readonly loaded = new WeakMap<Move, Promise<Permit[]>>();
  constructor(private readonly registry: RunSheetSourcesRegistry) {}

  private permitsOf(move: Move, manager: EntityManager): Promise<Permit[]> {
    let p = this.loaded.get(move);
    if (!p) {
      p = manager.find(Permit, { where: { moveId: move.id, status: Not('void') }, order: { jurisdiction: 'ASC', createdAt: 'ASC' } });
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
    const docs = await manager.find(PermitDocument, { where: { permitId: In(list.map((p) => p.id)) }, order: { version: 'DESC' } });
    const dates = travelDates(move.requestedDeparture, move.travelDays);
    return list.map((p) => {
      const tz = zoneOf(p.jurisdiction);
      const doc = docs.find((d) => d.permitId === p.id);
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
        documentUrl: doc ? `/api/permits/${p.id}/documents/${doc.id}` : null,
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
