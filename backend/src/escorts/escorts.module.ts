import { Module } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { MailModule } from '../mail/mail.module';
import { MovesModule } from '../moves/moves.module';
import { RunSheetsModule } from '../run-sheets/run-sheets.module';
import { VendorsModule } from '../vendors/vendors.module';
import { EscortBooking } from './entities/escort-booking.entity';
import { EscortResponseToken } from './entities/escort-response-token.entity';
import { EscortBookingsController } from './escort-bookings.controller';
import { EscortBookingsService } from './escort-bookings.service';
import { EscortRemindersService } from './escort-reminders.service';
import { EscortResponsesController } from './escort-responses.controller';
import { EscortResponsesService } from './escort-responses.service';
import { ESCORT_SETTINGS, escortSettingsFrom } from './escort.settings';
import { EscortsRunSheetSource } from './escorts-run-sheet';
import { EscortsRepository } from './escorts.repository';
import { EscortsWorkflow } from './escorts-workflow';

@Module({
  imports: [TypeOrmModule.forFeature([EscortBooking, EscortResponseToken]), AuditModule, MailModule, MovesModule, VendorsModule, RunSheetsModule],
  controllers: [EscortBookingsController, EscortResponsesController],
  providers: [
    { provide: ESCORT_SETTINGS, inject: [ConfigService], useFactory: escortSettingsFrom },
    EscortsRepository, EscortBookingsService, EscortResponsesService, EscortRemindersService, EscortsWorkflow, EscortsRunSheetSource,
  ],
  exports: [EscortBookingsService, EscortRemindersService],
})
export class EscortsModule {}
