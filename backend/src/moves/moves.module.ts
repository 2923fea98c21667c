import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { AuditModule } from '../audit/audit.module';
import { RulebookModule } from '../rulebook/rulebook.module';
import { AssessmentService } from './assessment.service';
import { Move } from './entities/move.entity';
import { MoveExtensionsRegistry } from './move-extensions';
import { MovesController } from './moves.controller';
import { MovesRepository } from './moves.repository';
import { MovesService } from './moves.service';
import { ScheduleService } from './schedule.service';
import { WorkflowService } from './workflow.service';

/**
 * Moves, their workflow and assessment. The repository reads the tractor, trailer and driver of a move by SQL
 * (they are columns of the move's page), so no fleet or users service is needed; other modules lock and read moves
 * through the exported MovesRepository and take part in the workflow through MoveExtensionsRegistry.
 */
@Module({
  imports: [TypeOrmModule.forFeature([Move]), AuditModule, RulebookModule],
  controllers: [MovesController],
  providers: [MovesRepository, MovesService, AssessmentService, WorkflowService, MoveExtensionsRegistry, ScheduleService],
  exports: [MovesRepository, MovesService, AssessmentService, MoveExtensionsRegistry, ScheduleService],
})
export class MovesModule {}
