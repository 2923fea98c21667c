import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { Jurisdiction } from './entities/jurisdiction.entity';
import { RuleVersion } from './entities/rule-version.entity';
import { RulebookController } from './rulebook.controller';
import { RulebookRepository } from './rulebook.repository';
import { RulebookService } from './rulebook.service';

@Module({
  imports: [TypeOrmModule.forFeature([Jurisdiction, RuleVersion]), AuditModule],
  controllers: [RulebookController],
  providers: [RulebookRepository, RulebookService],
  exports: [RulebookService],
})
export class RulebookModule {}
