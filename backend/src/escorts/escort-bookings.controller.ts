import { Body, Controller, Get, HttpCode, Param, Post } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { EscortBookingDto, MoveEscortsDto, SessionUser } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { CancelEscortBookingDto, CreateEscortBookingDto } from './dto/escorts.dto';
import { EscortBookingsService } from './escort-bookings.service';

@ApiTags('escorts')
@ApiBearerAuth()
@Controller('moves/:moveId/escort-bookings')
export class EscortBookingsController {
  constructor(private readonly bookings: EscortBookingsService) {}

  @Get()
  @Roles('escorts.read')
  list(@Param('moveId', UuidParam) moveId: string, @CurrentUser() user: SessionUser): Promise<MoveEscortsDto> {
    return this.bookings.forMove(moveId, user, new Date());
  }

  @Post()
  @Roles('escorts.book')
  request(@Param('moveId', UuidParam) moveId: string, @Body() dto: CreateEscortBookingDto, @CurrentUser() user: SessionUser): Promise<EscortBookingDto> {
    return this.bookings.request(moveId, dto, user, new Date());
  }

  @Post(':bookingId/cancel')
  @HttpCode(200)
  @Roles('escorts.book')
  cancel(
    @Param('moveId', UuidParam) moveId: string,
    @Param('bookingId', UuidParam) bookingId: string,
    @Body() dto: CancelEscortBookingDto,
    @CurrentUser() user: SessionUser,
  ): Promise<EscortBookingDto> {
    return this.bookings.cancel(moveId, bookingId, dto, user);
  }
}
