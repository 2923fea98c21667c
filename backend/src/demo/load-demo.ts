import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import { plainToInstance } from 'class-transformer';
import { validate } from 'class-validator';
import { DataSource } from 'typeorm';
import type { SessionUser } from '@amberline/common';
import { DEMO_MOVES, DEMO_TRACTORS, DEMO_TRAILERS, DEMO_USERS, demoDeparture, seedDemoUsers } from '@amberline/seed';
import { AppModule } from '../app.module';
import { AuditService } from '../audit/audit.service';
import { FleetService } from '../fleet/fleet.service';
import { TractorInputDto, TrailerInputDto } from '../fleet/dto/fleet.dto';
import { CreateMoveDto } from '../moves/dto/move.dto';
import { MovesService } from '../moves/moves.service';

async function valid<T extends object>(cls: new () => T, plain: unknown, what: string): Promise<T> {
  const obj = plainToInstance(cls, JSON.parse(JSON.stringify(plain)));
  const errors = await validate(obj, { whitelist: true, forbidNonWhitelisted: true });
  if (errors.length) throw new Error(`demo data for ${what} is invalid: ${errors.map((e) => e.toString()).join('; ')}`);
  return obj;
}

/**
 * Loads the demo scenario into an empty database through the same services the API uses, so every demo
 * move is validated and assessed like a real one. Moves shown at later stages are put there directly, and
 * their history says so.
 */
export async function loadDemo(now = new Date()): Promise<string> {
  const app = await NestFactory.createApplicationContext(AppModule, { logger: ['error', 'warn'] });
  try {
    const ds = app.get(DataSource);
    const [{ n }] = await ds.query('SELECT count(*)::int AS n FROM users');
    if (n > 0) return `database already has ${n} users; demo scenario not loaded`;
    await seedDemoUsers(ds);
    const users: { id: string; email: string; name: string; role: SessionUser['role'] }[] = await ds.query(
      `SELECT id, email, name, role FROM users WHERE email = ANY($1)`,
      [DEMO_USERS.map((u) => u.email)],
    );
    const byEmail = new Map(users.map((u) => [u.email, u]));
    const admin = byEmail.get('admin@amberline.example')!;
    const dispatcher = byEmail.get('dispatcher@amberline.example')!;
    const fleet = app.get(FleetService);
    const tractorIds = new Map<string, string>();
    const trailerIds = new Map<string, string>();
    for (const t of DEMO_TRACTORS) tractorIds.set(t.unitNumber, (await fleet.saveTractor(await valid(TractorInputDto, t, t.unitNumber), admin)).id);
    for (const t of DEMO_TRAILERS) trailerIds.set(t.unitNumber, (await fleet.saveTrailer(await valid(TrailerInputDto, t, t.unitNumber), admin)).id);

    const moves = app.get(MovesService);
    const audit = app.get(AuditService);
    const today = now.toISOString().slice(0, 10);
    for (const d of DEMO_MOVES) {
      const { key, tractor, trailer, driver, departure, stage, stageReason, purpose, ...rest } = d;
      void key;
      const body = await valid(
        CreateMoveDto,
        {
          ...rest,
          tractorId: tractorIds.get(tractor),
          trailerId: trailerIds.get(trailer),
          ...(driver ? { driverId: byEmail.get(driver)!.id } : {}),
          requestedDeparture: demoDeparture(departure, today),
          notes: `Demo: ${purpose}.`,
        },
        d.key,
      );
      const move = await moves.create(body, dispatcher, now);
      if (stage !== 'requested') {
        await ds.transaction(async (m) => {
          await m.query(`UPDATE moves SET stage = $2, version = version + 1 WHERE id = $1`, [move.id, stage]);
          await audit.record(m, {
            moveId: move.id, entity: 'move', entityId: move.id, action: 'stage', actorId: dispatcher.id,
            before: { stage: 'requested' }, after: { stage },
            reason: stageReason ?? 'demo data: loaded at this stage without its permits and bookings',
          });
        });
      }
    }
    return `demo scenario loaded: ${DEMO_USERS.length} users, ${DEMO_TRACTORS.length} tractors, ${DEMO_TRAILERS.length} trailers, ${DEMO_MOVES.length} moves`;
  } finally {
    await app.close();
  }
}

if (require.main === module) {
  loadDemo()
    .then((msg) => console.log(`demo: ${msg}`))
    .catch((e) => {
      console.error('demo: failed:', e.message);
      process.exit(1);
    });
}
