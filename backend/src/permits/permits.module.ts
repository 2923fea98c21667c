import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { APP_CONFIG, type AppConfig } from '../config/app-config';
import { MailModule } from '../mail/mail.module';
import { MovesModule } from '../moves/moves.module';
import { RunSheetsModule } from '../run-sheets/run-sheets.module';
import { DocumentsRepository } from './documents.repository';
import { DocumentsService } from './documents.service';
import { PermitDocument } from './entities/permit-document.entity';
import { PermitPayment } from './entities/permit-payment.entity';
import { PermitVersion } from './entities/permit-version.entity';
import { Permit } from './entities/permit.entity';
import { ExpiryScanService } from './expiry-scan.service';
import { PaymentsController } from './payments/payments.controller';
import { PaymentsRepository } from './payments/payments.repository';
import { PaymentsService } from './payments/payments.service';
import { createStripeClient, STRIPE, STRIPE_SETTINGS, type StripeSettings } from './payments/stripe.provider';
import { PermitsController } from './permits.controller';
import { PermitsRepository } from './permits.repository';
import { PermitsService } from './permits.service';
import { PermitsRunSheetSource } from './permits-run-sheet';
import { FILE_STORE } from './storage/file-store';
import { FsFileStore } from './storage/fs-file-store';

/** Permits per move and jurisdiction, their PDFs, fee payments and the workflow guard for receiving permits. */
@Module({
  imports: [TypeOrmModule.forFeature([Permit, PermitVersion, PermitDocument, PermitPayment]), AuditModule, MailModule, MovesModule, RunSheetsModule],
  controllers: [PermitsController, PaymentsController],
  providers: [
    PermitsRepository,
    DocumentsRepository,
    PaymentsRepository,
    PermitsService,
    DocumentsService,
    PaymentsService,
    ExpiryScanService,
    PermitsRunSheetSource,
    { provide: STRIPE_SETTINGS, inject: [APP_CONFIG], useFactory: (config: AppConfig): StripeSettings => config.stripe },
    { provide: STRIPE, inject: [STRIPE_SETTINGS], useFactory: createStripeClient },
    { provide: FILE_STORE, inject: [APP_CONFIG], useFactory: (config: AppConfig) => new FsFileStore(config.fileStoreDir) },
  ],
  exports: [PermitsService, ExpiryScanService, PaymentsService, PermitsRepository],
})
export class PermitsModule {}
