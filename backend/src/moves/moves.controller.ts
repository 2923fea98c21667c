import { Body, Controller, Get, Param, Patch, Post, Query } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { AssessmentDto, HistoryEntryDto, MoveDto, MovesPage, ReassessmentPreview, ScheduleDto, SessionUser, StageCounts } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { CreateMoveDto, ListMovesQuery, PreviewDto, ReassessDto, ReopenDto, StageChangeDto, UpdateMoveDto } from './dto/move.dto';
import { MovesService, toMoveDto } from './moves.service';
import { WorkflowService } from './workflow.service';

@ApiTags('moves')
@ApiBearerAuth()
@Controller('moves')
export class MovesController {
  constructor(
    private readonly moves: MovesService,
    private readonly workflow: WorkflowService,
  ) {}

  @Get()
  @Roles('moves.read')
  list(@Query() q: ListMovesQuery, @CurrentUser() user: SessionUser): Promise<MovesPage> {
    return this.moves.list(q, user);
  }

  @Get('stage-counts')
  @Roles('moves.read')
  stageCounts(@CurrentUser() user: SessionUser): Promise<StageCounts> {
    return this.moves.stageCounts(user);
  }

  @Post()
  @Roles('moves.edit')
  create(@Body() dto: CreateMoveDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.moves.create(dto, user, new Date());
  }

  @Post('preview')
  @Roles('moves.edit')
  preview(@Body() dto: PreviewDto): Promise<AssessmentDto> {
    return this.moves.preview(dto, new Date());
  }

  @Get(':id')
  @Roles('moves.read')
  async get(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return toMoveDto(await this.moves.get(id, user));
  }

  @Patch(':id')
  @Roles('moves.edit')
  update(@Param('id', UuidParam) id: string, @Body() dto: UpdateMoveDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.moves.update(id, dto, user, new Date());
  }

  @Get(':id/assessment')
  @Roles('moves.read')
  assessment(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<AssessmentDto> {
    return this.moves.assessment(id, user, new Date());
  }

  @Post(':id/stage')
  @Roles('moves.edit')
  stage(@Param('id', UuidParam) id: string, @Body() dto: StageChangeDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.workflow.transition(id, dto, user, new Date());
  }

  @Post(':id/reopen')
  @Roles('moves.edit')
  reopen(@Param('id', UuidParam) id: string, @Body() dto: ReopenDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.workflow.reopen(id, dto, user, new Date());
  }

  @Get(':id/reassessment')
  @Roles('moves.compareRules')
  reassessment(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<ReassessmentPreview> {
    return this.workflow.reassessmentPreview(id, user, new Date());
  }

  @Post(':id/reassess')
  @Roles('moves.edit')
  reassess(@Param('id', UuidParam) id: string, @Body() dto: ReassessDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.workflow.reassess(id, dto, user, new Date());
  }

  @Get(':id/schedule')
  @Roles('moves.read')
  schedule(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<ScheduleDto> {
    return this.workflow.scheduleOf(id, user, new Date());
  }

  @Get(':id/history')
  @Roles('moves.read')
  history(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<HistoryEntryDto[]> {
    return this.moves.history(id, user);
  }
}
