import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { EscortAnswerResult, EscortRequestView } from '@amberline/common';
import { Public } from '../core/decorators/public.decorator';
import { EscortAnswerDto } from './dto/escorts.dto';
import { EscortResponsesService } from './escort-responses.service';

/** The vendor's link: no account, the token is the credential (random, stored hashed, expiring, one answer). */
@ApiTags('escorts')
@Controller('escort-responses')
export class EscortResponsesController {
  constructor(private readonly responses: EscortResponsesService) {}

  @Get(':token')
  @Public()
  view(@Param('token') token: string): Promise<EscortRequestView> {
    return this.responses.view(token, new Date());
  }

  @Post(':token')
  @Public()
  @HttpCode(200)
  answer(@Param('token') token: string, @Body() dto: EscortAnswerDto): Promise<EscortAnswerResult> {
    return this.responses.answer(token, dto, new Date());
  }
}
