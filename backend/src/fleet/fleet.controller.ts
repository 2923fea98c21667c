import { Body, Controller, Get, Param, Post, Put, Query } from '@nestjs/common';
import { UuidParam, OptionalIntParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { SessionUser, TractorDto, TrailerDto } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { TractorInputDto, TrailerInputDto } from './dto/fleet.dto';
import { FleetService, toTractorDto, toTrailerDto } from './fleet.service';

@ApiTags('fleet')
@ApiBearerAuth()
@Controller('fleet')
export class FleetController {
  constructor(private readonly fleet: FleetService) {}

  @Get('tractors')
  @Roles('fleet.read')
  tractors(): Promise<TractorDto[]> {
    return this.fleet.listTractors();
  }

  @Get('tractors/:id')
  @Roles('fleet.read')
  async tractor(@Param('id', UuidParam) id: string): Promise<TractorDto> {
    return toTractorDto(await this.fleet.tractor(id));
  }

  @Post('tractors')
  @Roles('fleet.edit')
  createTractor(@Body() dto: TractorInputDto, @CurrentUser() user: SessionUser): Promise<TractorDto> {
    return this.fleet.saveTractor(dto, user);
  }

  @Put('tractors/:id')
  @Roles('fleet.edit')
  updateTractor(
    @Param('id', UuidParam) id: string,
    @Query('version', OptionalIntParam) version: number | undefined,
    @Body() dto: TractorInputDto,
    @CurrentUser() user: SessionUser,
  ): Promise<TractorDto> {
    return this.fleet.saveTractor(dto, user, id, version);
  }

  @Get('trailers')
  @Roles('fleet.read')
  trailers(): Promise<TrailerDto[]> {
    return this.fleet.listTrailers();
  }

  @Get('trailers/:id')
  @Roles('fleet.read')
  async trailer(@Param('id', UuidParam) id: string): Promise<TrailerDto> {
    return toTrailerDto(await this.fleet.trailer(id));
  }

  @Post('trailers')
  @Roles('fleet.edit')
  createTrailer(@Body() dto: TrailerInputDto, @CurrentUser() user: SessionUser): Promise<TrailerDto> {
    return this.fleet.saveTrailer(dto, user);
  }

  @Put('trailers/:id')
  @Roles('fleet.edit')
  updateTrailer(
    @Param('id', UuidParam) id: string,
    @Query('version', OptionalIntParam) version: number | undefined,
    @Body() dto: TrailerInputDto,
    @CurrentUser() user: SessionUser,
  ): Promise<TrailerDto> {
    return this.fleet.saveTrailer(dto, user, id, version);
  }
}
