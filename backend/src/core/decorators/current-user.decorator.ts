import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { SessionUser } from '@amberline/common';

/** The signed-in user the auth guard attached to the request. */
export const CurrentUser = createParamDecorator((_: unknown, ctx: ExecutionContext): SessionUser => {
  return ctx.switchToHttp().getRequest().user;
});
