import { Injectable } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import * as bcrypt from 'bcryptjs';
import type { LoginResponse, SessionUser } from '@amberline/common';
import { AppException } from '../core/app-exception';
import { UsersService } from '../users/users.service';
import { LoginThrottleService } from './login-throttle.service';

export type JwtPayload = { sub: string; role: string };

/** Seconds a throttled sign-in is told to wait (the failure window is one minute). */
export const LOGIN_RETRY_AFTER_S = 60;

// compared against when the e-mail is unknown, so both failures take the same time
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', 12);

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersService,
    private readonly jwt: JwtService,
    private readonly throttle: LoginThrottleService,
  ) {}

  async login(emailRaw: string, password: string, ip: string): Promise<LoginResponse> {
    const email = emailRaw.trim().toLowerCase();
    if (await this.throttle.isBlocked(email, ip)) {
      throw new AppException(429, 'too_many_requests', 'Too many failed sign-ins; wait a minute and try again', undefined, { 'Retry-After': String(LOGIN_RETRY_AFTER_S) });
    }
    const user = await this.users.findByEmail(email);
    const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok || !user.active) {
      await this.throttle.recordFailure(email, ip);
      throw new AppException(401, 'unauthenticated', 'Wrong e-mail or password');
    }
    const session: SessionUser = { id: user.id, email: user.email, name: user.name, role: user.role };
    const accessToken = await this.jwt.signAsync({ sub: user.id, role: user.role } satisfies JwtPayload);
    return { accessToken, user: session };
  }

  /**
   * Resolves a bearer token to a current, active user; null when the token or user is no good (a token without an
   * expiry counts as no good). When the user cannot be looked up (the database is down) it throws 503: an outage
   * must not read as an expired session.
   */
  async userForToken(token: string): Promise<SessionUser | null> {
    let payload: JwtPayload & { exp?: unknown };
    try {
      payload = await this.jwt.verifyAsync<JwtPayload & { exp?: unknown }>(token);
    } catch {
      return null;
    }
    if (typeof payload.exp !== 'number' || typeof payload.sub !== 'string' || !/^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(payload.sub)) return null;
    try {
      return await this.users.sessionUser(payload.sub);
    } catch {
      throw new AppException(503, 'service_unavailable', 'The service is unavailable for the moment (the database cannot be reached); try again shortly');
    }
  }
}
