import { Body, Controller, Get, HttpCode, Ip, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import type { LoginResponse, SessionUser } from '@amberline/common';
import { CurrentUser } from '../core/decorators/current-user.decorator';
import { Public } from '../core/decorators/public.decorator';
import { Roles } from '../core/decorators/roles.decorator';
import { AuthService } from './auth.service';
import { LoginDto } from './dto/login.dto';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(private readonly auth: AuthService) {}

  @Public()
  @Post('login')
  @HttpCode(200)
  login(@Body() dto: LoginDto, @Ip() ip: string): Promise<LoginResponse> {
    return this.auth.login(dto.email, dto.password, ip ?? 'unknown');
  }

  @ApiBearerAuth()
  @Get('me')
  @Roles('session.read')
  me(@CurrentUser() user: SessionUser): SessionUser {
    return user;
  }
}
