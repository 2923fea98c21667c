import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { FleetModule } from '../fleet/fleet.module';
import { RulebookModule } from '../rulebook/rulebook.module';
import { AssessmentService } from './assessment.service';
import { Move } from './entities/move.entity';
import { MoveExtensionsRegistry } from './move-extensions';
import { MovesController } from './moves.controller';
import { MovesService } from './moves.service';
import { ScheduleService } from './schedule.service';
import { WorkflowService } from './workflow.service';

@Module({
  imports: [TypeOrmModule.forFeature([Move]), AuditModule, FleetModule, RulebookModule],
  controllers: [MovesController],
  providers: [MovesService, AssessmentService, WorkflowService, MoveExtensionsRegistry, ScheduleService],
  exports: [MovesService, AssessmentService, MoveExtensionsRegistry, ScheduleService],
})
export class MovesModule {}
