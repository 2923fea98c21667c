import { CanActivate, ExecutionContext, Injectable } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Role, SessionUser } from '@amberline/common';
import { AppException } from '../app-exception';
import { IS_PUBLIC_KEY } from '../decorators/public.decorator';
import { ROLES_KEY } from '../decorators/roles.decorator';

/** Checks the caller's role against the handler's @Roles. A private handler with no @Roles is refused. */
@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(ctx: ExecutionContext): boolean {
    const targets = [ctx.getHandler(), ctx.getClass()];
    if (this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, targets)) return true;
    const roles = this.reflector.getAllAndOverride<Role[]>(ROLES_KEY, targets);
    const user: SessionUser | undefined = ctx.switchToHttp().getRequest().user;
    if (!roles || roles.length === 0 || !user || !roles.includes(user.role)) {
      throw new AppException(403, 'forbidden', 'Your role may not do this');
    }
    return true;
  }
}
