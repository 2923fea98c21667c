import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { MailModule } from '../mail/mail.module';
import { MovesModule } from '../moves/moves.module';
import { DepartureChecks } from './entities/departure-checks.entity';
import { RunSheetAcknowledgement } from './entities/run-sheet-acknowledgement.entity';
import { RunSheetSourcesRegistry } from './run-sheet-sources';
import { RunSheetsController } from './run-sheets.controller';
import { RunSheetsRepository } from './run-sheets.repository';
import { RunSheetsService } from './run-sheets.service';

@Module({
  imports: [TypeOrmModule.forFeature([DepartureChecks, RunSheetAcknowledgement]), AuditModule, MailModule, MovesModule],
  controllers: [RunSheetsController],
  providers: [RunSheetsRepository, RunSheetsService, RunSheetSourcesRegistry],
  exports: [RunSheetSourcesRegistry, RunSheetsService],
})
export class RunSheetsModule {}
