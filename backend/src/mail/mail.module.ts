import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { TypeOrmModule } from '@nestjs/typeorm';
import { OutboxMessage } from './entities/outbox-message.entity';
import { MailController } from './mail.controller';
import { MailRepository } from './mail.repository';
import { MailService } from './mail.service';
import { MAIL_SETTINGS, mailSettingsFrom } from './mail.settings';
import { MailWorker } from './mail.worker';

/**
 * E-mail through the outbox. Other modules import MailModule and call `MailService.enqueue(manager, message)`
 * inside their own transaction; the worker sends it.
 */
@Module({
  imports: [TypeOrmModule.forFeature([OutboxMessage])],
  controllers: [MailController],
  providers: [{ provide: MAIL_SETTINGS, inject: [ConfigService], useFactory: mailSettingsFrom }, MailRepository, MailService, MailWorker],
  exports: [MailService, MAIL_SETTINGS],
})
export class MailModule {}
