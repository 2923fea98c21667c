import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditRepository } from './audit.repository';
import { AuditService } from './audit.service';
import { AuditEntry } from './entities/audit-entry.entity';

@Module({
  imports: [TypeOrmModule.forFeature([AuditEntry])],
  providers: [AuditRepository, AuditService],
  exports: [AuditService],
})
export class AuditModule {}
