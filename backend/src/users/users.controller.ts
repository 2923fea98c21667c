import { Body, Controller, Get, Param, Patch, Post, Query } from '@nestjs/common';
import { UuidParam } from '../core/param-pipes';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { Page, SessionUser, UserDto } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { CreateUserDto, ListUsersQuery, UpdateUserDto } from './dto/user.dto';
import { UsersService } from './users.service';

@ApiTags('users')
@ApiBearerAuth()
@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Get()
  @Roles('users.manage')
  list(@Query() q: ListUsersQuery): Promise<Page<UserDto>> {
    return this.users.list(q);
  }

  /** Active drivers, for assigning a driver to a move. */
  @Get('drivers')
  @Roles('drivers.read')
  drivers(): Promise<{ id: string; name: string; email: string }[]> {
    return this.users.activeDrivers();
  }

  @Post()
  @Roles('users.manage')
  create(@Body() dto: CreateUserDto): Promise<UserDto> {
    return this.users.create(dto);
  }

  @Patch(':id')
  @Roles('users.manage')
  update(@Param('id', UuidParam) id: string, @Body() dto: UpdateUserDto, @CurrentUser() actor: SessionUser): Promise<UserDto> {
    return this.users.update(id, dto, actor);
  }
}
