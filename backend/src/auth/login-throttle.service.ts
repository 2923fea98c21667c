import { Injectable } from '@nestjs/common';
import { LoginThrottleRepository } from './login-throttle.repository';

/** Failed sign-ins are counted in PostgreSQL, so the limit holds across several server instances. */
export const MAX_FAILURES_PER_MINUTE = 10;

@Injectable()
export class LoginThrottleService {
  constructor(private readonly repo: LoginThrottleRepository) {}

  /** Blocked when either the e-mail or the address has reached the limit of failures in the last minute. */
  async isBlocked(email: string, ip: string): Promise<boolean> {
    const { byEmail, byIp } = await this.repo.recentFailures(email, ip);
    return byEmail >= MAX_FAILURES_PER_MINUTE || byIp >= MAX_FAILURES_PER_MINUTE;
  }

  async recordFailure(email: string, ip: string): Promise<void> {
    await this.repo.insertFailure(email, ip);
    await this.repo.pruneOlderThanAnHour();
  }
}
