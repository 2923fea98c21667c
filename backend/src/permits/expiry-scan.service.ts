import { Injectable, Logger } from '@nestjs/common';
import { Cron } from '@nestjs/schedule';
import { DataSource, type EntityManager } from 'typeorm';
import { formatZoned, type ExpiryScanResult } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { MailService } from '../mail/mail.service';
import { travelDates } from '../moves/assessment.service';
import { instantToLocal, travelSpan, zoneOf } from './permit-rules';
import { ACTIVE_MOVE_STAGES } from './permits.service';

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
    private readonly ds: DataSource,
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
      const [row] = await m.query(
        `SELECT p.jurisdiction, p.permit_number, mv.reference, mv.id AS move_id,
                coalesce((SELECT array_agg(u.email) FROM users u WHERE u.id = p.assignee_id AND u.active),
                         (SELECT array_agg(u.email) FROM users u WHERE u.role = 'permit_clerk' AND u.active), '{}') AS clerks,
                (SELECT u.email FROM users u WHERE u.id = mv.created_by AND u.active) AS dispatcher
           FROM permits p JOIN moves mv ON mv.id = p.move_id WHERE p.id = $1`,
        [f.permitId],
      );
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
    const result = await this.ds.transaction(async (m) => {
      const [{ locked }] = await m.query(`SELECT pg_try_advisory_xact_lock(hashtext('amberline.permits.expiry-scan')) AS locked`);
      if (!locked) return { ran: false, checked: 0, flagged: [] } as ExpiryScanResult;
      const rows: { id: string; move_id: string; jurisdiction: string; valid_to: Date; expiry_warning: string | null; departure: string; travel_days: number }[] = await m.query(
        `SELECT p.id, p.move_id, p.jurisdiction, p.valid_to, p.expiry_warning, to_char(m.requested_departure, 'YYYY-MM-DD') AS departure, m.travel_days
           FROM permits p JOIN moves m ON m.id = p.move_id
          WHERE p.status = 'issued' AND p.valid_to IS NOT NULL AND m.stage IN (${ACTIVE_MOVE_STAGES.map((s) => `'${s}'`).join(',')})
          FOR UPDATE OF p`,
      );
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
        await m.query(`UPDATE permits SET expiry_warning = $2, expiry_checked_at = $3 WHERE id = $1`, [r.id, warning, now]);
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
