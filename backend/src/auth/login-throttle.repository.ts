import { Injectable } from '@nestjs/common';
import { DataSource } from 'typeorm';

/** Failed sign-ins, kept in PostgreSQL so every server instance counts the same ones. */
@Injectable()
export class LoginThrottleRepository {
  constructor(private readonly ds: DataSource) {}

  /** Failures in the last minute for this e-mail and, separately, from this address. */
  async recentFailures(email: string, ip: string): Promise<{ byEmail: number; byIp: number }> {
    const [row] = await this.ds.query(
      `SELECT
         (SELECT count(*) FROM login_failures WHERE email = $1 AND at > now() - interval '1 minute')::int AS by_email,
         (SELECT count(*) FROM login_failures WHERE ip = $2 AND at > now() - interval '1 minute')::int AS by_ip`,
      [email, ip],
    );
    return { byEmail: row.by_email, byIp: row.by_ip };
  }

  async insertFailure(email: string, ip: string): Promise<void> {
    await this.ds.query(`INSERT INTO login_failures (email, ip) VALUES ($1, $2)`, [email, ip]);
  }

  /** Drops failures older than an hour (they no longer count), keeping the table small. */
  async pruneOlderThanAnHour(): Promise<void> {
    await this.ds.query(`DELETE FROM login_failures WHERE at < now() - interval '1 hour'`);
  }
}
