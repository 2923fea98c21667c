import { Inject, Injectable, Logger, OnApplicationBootstrap, OnModuleDestroy } from '@nestjs/common';
import { SchedulerRegistry } from '@nestjs/schedule';
import { MailService } from './mail.service';
import { MAIL_SETTINGS, type MailSettings } from './mail.settings';

const NAME = 'mail-outbox';

/** Runs `sendDue` on a schedule (@nestjs/schedule registry). One run at a time per instance; instances share rows safely. */
@Injectable()
export class MailWorker implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('MailWorker');
  private running: Promise<unknown> | null = null;

  constructor(
    private readonly mail: MailService,
    private readonly registry: SchedulerRegistry,
    @Inject(MAIL_SETTINGS) private readonly settings: MailSettings,
  ) {}

  onApplicationBootstrap(): void {
    if (this.settings.sendIntervalMs <= 0 || this.registry.doesExist('interval', NAME)) return;
    this.registry.addInterval(NAME, setInterval(() => void this.tick(), this.settings.sendIntervalMs));
  }

  async tick(): Promise<void> {
    if (this.running) return;
    this.running = this.mail
      .sendDue(new Date())
      .then((r) => {
        if (r.sent || r.failed) this.logger.log(`outbox: ${r.sent} sent, ${r.retrying} to retry, ${r.failed} failed`);
      })
      .catch((e: Error) => this.logger.error(`outbox run failed: ${e.message}`))
      .finally(() => {
        this.running = null;
      });
    await this.running;
  }

  async onModuleDestroy(): Promise<void> {
    if (this.registry.doesExist('interval', NAME)) this.registry.deleteInterval(NAME);
    await this.running;
  }
}
