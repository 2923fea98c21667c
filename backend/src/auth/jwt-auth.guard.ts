import { CanActivate, ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AppException } from '../core/app-exception';
import { IS_PUBLIC_KEY } from '../core/decorators/public.decorator';
import { AuthService } from './auth.service';

/** Global guard: every route needs a valid bearer token of an active user unless marked @Public(). */
@Injectable()
export class JwtAuthGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly auth: AuthService,
  ) {}

  async canActivate(ctx: ExecutionContext): Promise<boolean> {
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [ctx.getHandler(), ctx.getClass()])) return true;
    const req = ctx.switchToHttp().getRequest();
    const header: string | undefined = req.headers?.authorization;
    const token = header?.startsWith('Bearer ') ? header.slice(7).trim() : undefined;
    if (!token) throw new AppException(401, 'unauthenticated', 'Sign in first: no bearer token');
    const user = await this.auth.userForToken(token);
    if (!user) throw new AppException(401, 'unauthenticated', 'Your session has expired or your account is inactive; sign in again');
    req.user = user;
    return true;
  }
}
