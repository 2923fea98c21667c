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
  @Roles('rulebook.read')
  coverage(): Promise<RulebookCoverage> {
    return this.rulebook.coverage();
  }

  @Get('jurisdictions')
  @Roles('rulebook.read')
  list(): Promise<JurisdictionSummaryDto[]> {
    return this.rulebook.list();
  }

  @Get('jurisdictions/:code')
  @Roles('rulebook.read')
  current(@Param('code') code: string): Promise<RuleVersionDto> {
    return this.rulebook.current(code);
  }

  @Get('jurisdictions/:code/versions')
  @Roles('rulebook.read')
  history(@Param('code') code: string): Promise<RuleVersionDto[]> {
    return this.rulebook.history(code);
  }

  @Put('jurisdictions/:code')
  @Roles('rulebook.edit')
  update(@Param('code') code: string, @Body() dto: UpdateRuleDto, @CurrentUser() user: SessionUser): Promise<RuleVersionDto> {
    return this.rulebook.update(code, dto.record, dto.note, user);
  }
}
