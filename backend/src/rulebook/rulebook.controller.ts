import { Body, Controller, Get, Param, Put } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { JurisdictionSummaryDto, RuleVersionDto, RulebookCoverage, SessionUser } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { UpdateRuleDto } from './dto/rulebook.dto';
import { RulebookService } from './rulebook.service';

@ApiTags('rulebook')
@ApiBearerAuth()
@Controller('rulebook')
export class RulebookController {
  constructor(private readonly rulebook: RulebookService) {}

  @Get('coverage')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  coverage(): Promise<RulebookCoverage> {
    return this.rulebook.coverage();
  }

  @Get('jurisdictions')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  list(): Promise<JurisdictionSummaryDto[]> {
    return this.rulebook.list();
  }

  @Get('jurisdictions/:code')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  current(@Param('code') code: string): Promise<RuleVersionDto> {
    return this.rulebook.current(code);
  }

  @Get('jurisdictions/:code/versions')
  @Roles('admin', 'dispatcher', 'permit_clerk')
  history(@Param('code') code: string): Promise<RuleVersionDto[]> {
    return this.rulebook.history(code);
  }

  @Put('jurisdictions/:code')
  @Roles('admin')
  update(@Param('code') code: string, @Body() dto: UpdateRuleDto, @CurrentUser() user: SessionUser): Promise<RuleVersionDto> {
    return this.rulebook.update(code, dto.record, dto.note, user);
  }
}
