import { Body, Controller, Get, Param, Post, Res } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { DepartureChecksDto, RunSheetDto, SessionUser } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { AcknowledgeDto, DepartureChecksDtoIn, OverrideChecksDto } from './dto/run-sheet.dto';
import { renderRunSheetPdf } from './run-sheet-pdf';
import { RunSheetsService } from './run-sheets.service';

@ApiTags('run sheets')
@ApiBearerAuth()
@Controller('moves/:id')
export class RunSheetsController {
  constructor(private readonly sheets: RunSheetsService) {}

  @Get('run-sheet')
  @Roles('runSheets.read')
  get(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<RunSheetDto> {
    return this.sheets.build(id, user, new Date());
  }

  @Get('run-sheet.pdf')
  @Roles('runSheets.read')
  async pdf(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser, @Res() res: Response): Promise<void> {
    const sheet = await this.sheets.build(id, user, new Date());
    const doc = renderRunSheetPdf(sheet);
    res.setHeader('content-type', 'application/pdf');
    res.setHeader('content-disposition', `inline; filename="run-sheet-${sheet.move.reference}.pdf"`);
    doc.pipe(res);
    doc.end();
  }

  @Get('departure-checks')
  @Roles('departureChecks.read')
  checks(@Param('id', UuidParam) id: string, @CurrentUser() user: SessionUser): Promise<DepartureChecksDto[]> {
    return this.sheets.checksHistory(id, user);
  }

  @Post('departure-checks')
  @Roles('departureChecks.record')
  submit(@Param('id', UuidParam) id: string, @Body() dto: DepartureChecksDtoIn, @CurrentUser() user: SessionUser): Promise<DepartureChecksDto> {
    return this.sheets.submitChecks(id, dto, user, new Date());
  }

  @Post('departure-checks/:checksId/override')
  @Roles('departureChecks.override')
  override(
    @Param('id', UuidParam) id: string,
    @Param('checksId', UuidParam) checksId: string,
    @Body() dto: OverrideChecksDto,
    @CurrentUser() user: SessionUser,
  ): Promise<DepartureChecksDto> {
    return this.sheets.overrideChecks(id, checksId, dto.reason, user, new Date());
  }

  @Post('run-sheet/acknowledgement')
  @Roles('departureChecks.record')
  acknowledge(@Param('id', UuidParam) id: string, @Body() dto: AcknowledgeDto, @CurrentUser() user: SessionUser): Promise<RunSheetDto> {
    return this.sheets.acknowledge(id, dto, user, new Date());
  }
}
