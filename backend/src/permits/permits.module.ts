import { join, resolve } from 'node:path';
import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { MailModule } from '../mail/mail.module';
import { MovesModule } from '../moves/moves.module';
import { RunSheetsModule } from '../run-sheets/run-sheets.module';
import { DocumentsService } from './documents.service';
import { PermitDocument } from './entities/permit-document.entity';
import { PermitPayment } from './entities/permit-payment.entity';
import { PermitVersion } from './entities/permit-version.entity';
import { Permit } from './entities/permit.entity';
import { ExpiryScanService } from './expiry-scan.service';
import { PaymentsController } from './payments/payments.controller';
import { PaymentsService } from './payments/payments.service';
import { createStripeClient, STRIPE } from './payments/stripe.provider';
import { PermitsController } from './permits.controller';
import { PermitsService } from './permits.service';
import { PermitsRunSheetSource } from './permits-run-sheet';
import { FILE_STORE } from './storage/file-store';
import { FsFileStore } from './storage/fs-file-store';

/** Default file store: `.data/files` at the project root (FILE_STORE_DIR overrides). */
export const defaultFileStoreDir = () => resolve(process.env.FILE_STORE_DIR || join(__dirname, '..', '..', '..', '.data', 'files'));

/** Permits per move and jurisdiction, their PDFs, fee payments and the workflow guard for receiving permits. */
@Module({
  imports: [TypeOrmModule.forFeature([Permit, PermitVersion, PermitDocument, PermitPayment]), AuditModule, MailModule, MovesModule, RunSheetsModule],
  controllers: [PermitsController, PaymentsController],
  providers: [
    PermitsService,
    DocumentsService,
    PaymentsService,
    ExpiryScanService,
    PermitsRunSheetSource,
    { provide: STRIPE, useFactory: () => createStripeClient(process.env) },
    { provide: FILE_STORE, useFactory: () => new FsFileStore(defaultFileStoreDir()) },
  ],
  exports: [PermitsService, ExpiryScanService, PaymentsService],
})
export class PermitsModule {}
