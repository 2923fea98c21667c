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
  @Roles('admin', 'dispatcher', 'permit_clerk', 'driver')
  list(@Query() q: ListMovesQuery, @CurrentUser() user: SessionUser): Promise<MovesPage> {
    return this.moves.list(q, user);
  }

  @Get('stage-counts')
  @Roles('admin', 'dispatcher', 'permit_clerk', 'driver')
  stageCounts(@CurrentUser() user: SessionUser): Promise<StageCounts> {
    return this.moves.stageCounts(user);
  }

  @Post()
  @Roles('admin', 'dispatcher')
  create(@Body() dto: CreateMoveDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.moves.create(dto, user, new Date());
  }

  @Post('preview')
  @Roles('admin', 'dispatcher')
  preview(@Body() dto: PreviewDto): Promise<AssessmentDto> {
    return this.moves.preview(dto, new Date());
  }

  @Get(':id')
  @Roles('admin', 'dispatcher', 'permit_clerk', 'driver')
  async get(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return toMoveDto(await this.moves.get(id, user));
  }

  @Patch(':id')
  @Roles('admin', 'dispatcher')
  update(@Param('id', UuidParam) id: string, @Body() dto: UpdateMoveDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.moves.update(id, dto, user, new Date());
  }

  @Get(':id/assessment')
  @Roles('admin', 'dispatcher', 'permit_clerk', 'driver')
  assessment(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<AssessmentDto> {
    return this.moves.assessment(id, user, new Date());
  }

  @Post(':id/stage')
  @Roles('admin', 'dispatcher')
  stage(@Param('id', UuidParam) id: string, @Body() dto: StageChangeDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.workflow.transition(id, dto, user, new Date());
  }

  @Post(':id/reopen')
  @Roles('admin', 'dispatcher')
  reopen(@Param('id', UuidParam) id: string, @Body() dto: ReopenDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.workflow.reopen(id, dto, user, new Date());
  }

  @Get(':id/reassessment')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  reassessment(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<ReassessmentPreview> {
    return this.workflow.reassessmentPreview(id, user, new Date());
  }

  @Post(':id/reassess')
  @Roles('admin', 'dispatcher')
  reassess(@Param('id', UuidParam) id: string, @Body() dto: ReassessDto, @CurrentUser() user: SessionUser): Promise<MoveDto> {
    return this.workflow.reassess(id, dto, user, new Date());
  }

  @Get(':id/schedule')
  @Roles('admin', 'dispatcher', 'permit_clerk', 'driver')
  schedule(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<ScheduleDto> {
    return this.workflow.scheduleOf(id, user, new Date());
  }

  @Get(':id/history')
  @Roles('admin', 'dispatcher', 'permit_clerk', 'driver')
  history(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<HistoryEntryDto[]> {
    return this.moves.history(id, user);
  }
}
