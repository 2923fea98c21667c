import { Injectable } from '@nestjs/common';
import { DataSource } from 'typeorm';

/** Failed sign-ins are counted in PostgreSQL, so the limit holds across several server instances. */
export const MAX_FAILURES_PER_MINUTE = 10;

@Injectable()
export class LoginThrottleService {
  constructor(private readonly ds: DataSource) {}

  async isBlocked(email: string, ip: string): Promise<boolean> {
    const [row] = await this.ds.query(
      `SELECT
         (SELECT count(*) FROM login_failures WHERE email = $1 AND at > now() - interval '1 minute')::int AS by_email,
         (SELECT count(*) FROM login_failures WHERE ip = $2 AND at > now() - interval '1 minute')::int AS by_ip`,
      [email, ip],
    );
    return row.by_email >= MAX_FAILURES_PER_MINUTE || row.by_ip >= MAX_FAILURES_PER_MINUTE;
  }

  async recordFailure(email: string, ip: string): Promise<void> {
    await this.ds.query(`INSERT INTO login_failures (email, ip) VALUES ($1, $2)`, [email, ip]);
    // keep the table small: anything older than an hour no longer counts
    await this.ds.query(`DELETE FROM login_failures WHERE at < now() - interval '1 hour'`);
  }
}
