import { Body, Controller, Get, Param, Put } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { JurisdictionSummaryDto, RuleVersionDto, SessionUser } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { UpdateRuleDto } from './dto/rulebook.dto';
import { RulebookService } from './rulebook.service';

@ApiTags('rulebook')
@ApiBearerAuth()
@Controller('rulebook/jurisdictions')
export class RulebookController {
  constructor(private readonly rulebook: RulebookService) {}

  @Get()
  @Roles('admin', 'dispatcher', 'permit_clerk')
  list(): Promise<JurisdictionSummaryDto[]> {
    return this.rulebook.list();
  }

  @Get(':code')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  current(@Param('code') code: string): Promise<RuleVersionDto> {
    return this.rulebook.current(code);
  }

  @Get(':code/versions')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  history(@Param('code') code: string): Promise<RuleVersionDto[]> {
    return this.rulebook.history(code);
  }

  @Put(':code')
  @Roles('admin')
  update(@Param('code') code: string, @Body() dto: UpdateRuleDto, @CurrentUser() user: SessionUser): Promise<RuleVersionDto> {
    return this.rulebook.update(code, dto.record, dto.note, user);
  }
}
