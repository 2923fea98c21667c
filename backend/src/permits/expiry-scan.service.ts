import { Injectable, Logger } from '@nestjs/common';
import { Cron } from '@nestjs/schedule';
import type { EntityManager } from 'typeorm';
import { formatZoned, instantToLocal, travelSpan, zoneOf, type ExpiryScanResult } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { MailService } from '../mail/mail.service';
import { travelDates } from '../moves/assessment.service';
import { PermitsRepository } from './permits.repository';

/** Hours before expiry at which an issued permit is flagged whatever the plan. */
export const EXPIRY_WARNING_HOURS = 48;

export type ExpiryWarningListener = (flagged: ExpiryScanResult['flagged'], now: Date) => Promise<void> | void;

/**
 * The daily scan: flags issued permits that expire before the planned exit from their state (the end of the last
 * travel day, local time) or within 48 hours, and clears flags that no longer apply. Only one server runs it at a
 * time (a transaction-scoped advisory lock; the others skip). The flags show on the permit desk; the e-mail of the
 * warnings is sent by whoever registers a listener (the mail outbox, when it lands) through `onWarnings`.
 */
@Injectable()
export class ExpiryScanService {
  private readonly logger = new Logger('PermitExpiryScan');
  private readonly listeners: ExpiryWarningListener[] = [];
  constructor(
    private readonly repo: PermitsRepository,
    private readonly audit: AuditService,
    private readonly mail: MailService,
  ) {}

  /** Called with the permits newly flagged by a scan (e.g. to e-mail the clerks). */
  onWarnings(listener: ExpiryWarningListener): void {
    this.listeners.push(listener);
  }

  /** One e-mail per newly flagged permit, to its assignee (or every active permit clerk) and the move's dispatcher,
   * written to the outbox in the scan's own transaction. */
  private async mailWarnings(m: EntityManager, flagged: ExpiryScanResult['flagged'], now: Date): Promise<void> {
    for (const f of flagged) {
      const row = await this.repo.warningRecipients(m, f.permitId);
      const to = [...new Set([...(row.clerks ?? []), ...(row.dispatcher ? [row.dispatcher] : [])])];
      if (!to.length) continue;
      await this.mail.enqueue(m, {
        to,
        subject: `Permit warning: ${row.reference} ${row.jurisdiction} ${row.permit_number ?? ''} ${f.warning}`.replace(/\s+/g, ' ').trim(),
        text: `The ${row.jurisdiction} permit ${row.permit_number ?? '(no number)'} of move ${row.reference} ${f.warning}.\n\nRenew or amend it before the move runs: the permit desk lists it under "expiring soon".\n\nAmberline checked this on ${formatZoned(now.getTime(), zoneOf(row.jurisdiction))}.`,
        dedupeKey: `permit-expiry:${f.permitId}:${f.warning}`,
        related: { entity: 'permit', id: f.permitId },
      });
    }
  }

  @Cron('0 15 6 * * *', { name: 'permit-expiry-scan', timeZone: 'America/Chicago' })
  async daily(): Promise<void> {
    const r = await this.scan(new Date());
    if (r.ran) this.logger.log(`checked ${r.checked} permits, flagged ${r.flagged.length}`);
  }

  async scan(now: Date): Promise<ExpiryScanResult> {
    const result = await this.repo.transaction(async (m) => {
      if (!(await this.repo.tryScanLock(m))) return { ran: false, checked: 0, flagged: [] } as ExpiryScanResult;
      const rows = await this.repo.issuedForScan(m);
      const flagged: ExpiryScanResult['flagged'] = [];
      for (const r of rows) {
        const tz = zoneOf(r.jurisdiction);
        const validTo = new Date(r.valid_to);
        const dates = travelDates(r.departure, r.travel_days);
        const exit = travelSpan(dates, tz).end;
        const shown = `${instantToLocal(validTo, tz).replace('T', ' ')} ${tz}`;
        let warning: string | null = null;
        if (validTo <= now) warning = `expired ${shown}`;
        else if (validTo < exit) warning = `expires ${shown}, before the planned exit at the end of ${dates[dates.length - 1]}`;
        else if (validTo.getTime() - now.getTime() <= EXPIRY_WARNING_HOURS * 3_600_000) warning = `expires within ${EXPIRY_WARNING_HOURS} hours (${shown})`;
        await this.repo.setExpiryWarning(m, r.id, warning, now);
        if (warning !== r.expiry_warning) {
          await this.audit.record(m, {
            moveId: r.move_id, entity: 'permit', entityId: r.id, action: warning ? 'expiry_flagged' : 'expiry_cleared', actorId: null,
            before: { expiryWarning: r.expiry_warning }, after: { jurisdiction: r.jurisdiction, expiryWarning: warning },
          });
          if (warning) flagged.push({ permitId: r.id, warning });
        }
      }
      await this.mailWarnings(m, flagged, now);
      return { ran: true, checked: rows.length, flagged };
    });
    if (result.flagged.length) {
      for (const l of this.listeners) {
        try {
          await l(result.flagged, now);
        } catch (e) {
          this.logger.warn(`expiry listener failed: ${(e as Error).message}`);
        }
      }
    }
    return result;
  }
}
