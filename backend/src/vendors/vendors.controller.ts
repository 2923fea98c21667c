import { Body, Controller, Get, Param, Post, Put, Query } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { SessionUser, VendorDto } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { UpdateVendorDto, VendorInputDto, VendorsQueryDto } from './dto/vendor.dto';
import { toVendorDto, VendorsService } from './vendors.service';

@ApiTags('vendors')
@ApiBearerAuth()
@Controller('vendors')
export class VendorsController {
  constructor(private readonly vendors: VendorsService) {}

  @Get()
  @Roles('vendors.manage')
  list(@Query() q: VendorsQueryDto): Promise<VendorDto[]> {
    return this.vendors.list(q, new Date());
  }

  @Get(':id')
  @Roles('vendors.manage')
  async get(@Param('id', UuidParam) id: string): Promise<VendorDto> {
    return toVendorDto(await this.vendors.get(id), new Date());
  }

  @Post()
  @Roles('vendors.manage')
  create(@Body() dto: VendorInputDto, @CurrentUser() user: SessionUser): Promise<VendorDto> {
    return this.vendors.create(dto, user, new Date());
  }

  @Put(':id')
  @Roles('vendors.manage')
  update(@Param('id', UuidParam) id: string, @Body() dto: UpdateVendorDto, @CurrentUser() user: SessionUser): Promise<VendorDto> {
    return this.vendors.update(id, dto, user, new Date());
  }
}
