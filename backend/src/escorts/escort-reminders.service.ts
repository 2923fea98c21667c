import { Inject, Injectable, Logger, OnApplicationBootstrap, OnModuleDestroy } from '@nestjs/common';
import { SchedulerRegistry } from '@nestjs/schedule';
import { localDate } from '@amberline/common';
import { AuditService } from '../audit/audit.service';
import { MailService } from '../mail/mail.service';
import { MovesRepository } from '../moves/moves.repository';
import { departureReminderMail, dispatcherReminderNotice, reminderMail } from './escort-mails';
import { EscortBookingsService, moveTimeZone } from './escort-bookings.service';
import { ESCORT_SETTINGS, type EscortSettings } from './escort.settings';
import { EscortsRepository } from './escorts.repository';

export type ReminderReport = { unanswered: number; departure: number };
/** A request unanswered this long gets its reminder. */
export const UNANSWERED_AFTER_MS = 24 * 3_600_000;
const NAME = 'escort-reminders';

const dayBefore = (d: string) => new Date(Date.parse(`${d}T00:00:00Z`) - 86_400_000).toISOString().slice(0, 10);

/**
 * Escort reminders: a request unanswered for 24 hours gets a reminder (with a fresh link) to the vendor and a
 * notice to the dispatcher, once; a confirmed escort gets the run details the day before departure, once. Rows are
 * taken with FOR UPDATE SKIP LOCKED and marked in the same transaction, so several instances never send one twice.
 */
@Injectable()
export class EscortRemindersService implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('EscortReminders');
  private running: Promise<unknown> | null = null;

  constructor(
    private readonly repo: EscortsRepository,
    private readonly moves: MovesRepository,
    private readonly bookings: EscortBookingsService,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly registry: SchedulerRegistry,
    @Inject(ESCORT_SETTINGS) private readonly settings: EscortSettings,
  ) {}

  onApplicationBootstrap(): void {
    if (this.settings.reminderIntervalMs <= 0 || this.registry.doesExist('interval', NAME)) return;
    this.registry.addInterval(NAME, setInterval(() => void this.tick(), this.settings.reminderIntervalMs));
  }

  async onModuleDestroy(): Promise<void> {
    if (this.registry.doesExist('interval', NAME)) this.registry.deleteInterval(NAME);
    await this.running;
  }

  async tick(): Promise<void> {
    if (this.running) return;
    this.running = this.run(new Date())
      .then((r) => {
        if (r.unanswered || r.departure) this.logger.log(`reminders: ${r.unanswered} unanswered, ${r.departure} before departure`);
      })
      .catch((e: Error) => this.logger.error(`reminder run failed: ${e.message}`))
      .finally(() => {
        this.running = null;
      });
    await this.running;
  }

  /** Sends what is due at `now`. `moveIds` limits the run to some moves (a manual re-run, or a test). */
  async run(now: Date, moveIds?: string[]): Promise<ReminderReport> {
    const report: ReminderReport = { unanswered: 0, departure: 0 };

    await this.repo.transaction(async (m) => {
      const due = await this.repo.unansweredDue(m, new Date(now.getTime() - UNANSWERED_AFTER_MS), moveIds);
      for (const { id } of due) {
        const b = await this.repo.load(id, m);
        const move = await this.moves.findWithEquipment(b.moveId, m);
        const vendor = b.vendor!;
        await this.repo.markReminded(m, id, now);
        // a run that has started, or starts before a new link could be used, gets no reminder (the move is always there: a foreign key)
        if (!move || b.startDate <= localDate(now.getTime(), moveTimeZone(move))) continue;
        const { token, expiresAt } = await this.bookings.issueLink(m, b, move, now);
        await this.mail.enqueue(m, reminderMail(b, vendor, `${this.mail.settings.appUrl}/escort-response/${token}`, expiresAt));
        const dispatcher = b.requestedBy ?? null;
        if (dispatcher) await this.mail.enqueue(m, dispatcherReminderNotice(b, vendor, dispatcher.email));
        await this.audit.record(m, { moveId: b.moveId, entity: 'escort_booking', entityId: b.id, action: 'reminded', actorId: null, after: { vendor: vendor.company, unansweredSince: b.requestedAt.toISOString() } });
        report.unanswered++;
      }
    });

    await this.repo.transaction(async (m) => {
      // a window of dates wide enough for every US zone; the exact local day is checked below
      const due = await this.repo.departureDue(m, now, moveIds);
      for (const { id } of due) {
        const b = await this.repo.load(id, m);
        const move = await this.moves.findWithEquipment(b.moveId, m);
        if (!move) continue;
        const today = localDate(now.getTime(), moveTimeZone(move));
        if (today < dayBefore(b.startDate) || today > b.startDate) continue;
        const vendor = b.vendor!;
        await this.repo.markDepartureReminded(m, id, now);
        await this.mail.enqueue(m, departureReminderMail(b, vendor, move.driver?.name ?? null));
        await this.audit.record(m, { moveId: b.moveId, entity: 'escort_booking', entityId: b.id, action: 'departure_reminder', actorId: null, after: { vendor: vendor.company, startDate: b.startDate } });
        report.departure++;
      }
    });
    return report;
  }
}
