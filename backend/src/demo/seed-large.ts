import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import { plainToInstance } from 'class-transformer';
import { DataSource } from 'typeorm';
import type { SessionUser } from '@amberline/common';
import { DEMO_MOVES, DEMO_TRACTORS, DEMO_TRAILERS, demoDeparture, seedTractor, seedTrailer, seedUsersBulk } from '@amberline/seed';
import { AppModule } from '../app.module';
import { CreateMoveDto } from '../moves/dto/move.dto';
import { MovesService } from '../moves/moves.service';

export const LARGE = { moves: 10_000, users: { driver: 150, dispatcher: 30, permit_clerk: 15, admin: 5 } } as const;

/**
 * The large dataset for benchmarks: 200 users, a fleet, and 10,000 moves made from the demo moves (each
 * template created and assessed through the service, then copied in bulk with varied customers, dates,
 * drivers and stages). Other modules' bulk rows (permits, escort bookings) are added by their own steps.
 */
export async function seedLarge(now = new Date()): Promise<string> {
  const started = Date.now();
  const app = await NestFactory.createApplicationContext(AppModule, { logger: ['error', 'warn'] });
  try {
    const ds = app.get(DataSource);
    const [{ n }] = await ds.query(`SELECT count(*)::int AS n FROM moves`);
    if (n >= LARGE.moves) return `already ${n} moves; nothing added`;
    const tag = `large${Date.now().toString(36)}`;
    const users = await seedUsersBulk(ds, LARGE.users, tag);
    const drivers = users.filter((u) => u.role === 'driver').map((u) => u.id);
    const dispatcherRow = users.find((u) => u.role === 'dispatcher')!;
    const dispatcher: SessionUser = { id: dispatcherRow.id, role: 'dispatcher', email: '', name: 'Bench dispatcher' };
    const tractors = new Map<string, string>();
    const trailers = new Map<string, string>();
    for (let i = 0; i < 40; i++) {
      const t = DEMO_TRACTORS[i % DEMO_TRACTORS.length];
      const { unitNumber, plate, ...spec } = t;
      void plate;
      const id = (await seedTractor(ds, { ...spec, unitNumber: `${unitNumber}-${tag}-${i}` })).id;
      if (i < DEMO_TRACTORS.length) tractors.set(unitNumber, id);
    }
    for (let i = 0; i < 60; i++) {
      const t = DEMO_TRAILERS[i % DEMO_TRAILERS.length];
      const id = (await seedTrailer(ds, { ...t, unitNumber: `${t.unitNumber}-${tag}-${i}` })).id;
      if (i < DEMO_TRAILERS.length) trailers.set(t.unitNumber, id);
    }
    // one real move per demo template, through the service (validated and assessed)
    const moves = app.get(MovesService);
    const today = now.toISOString().slice(0, 10);
    const templates: string[] = [];
    for (const d of DEMO_MOVES) {
      const { key, tractor, trailer, driver, departure, stage, stageReason, purpose, ...rest } = d;
      void key; void driver; void stage; void stageReason; void purpose;
      const dto = plainToInstance(CreateMoveDto, JSON.parse(JSON.stringify({ ...rest, tractorId: tractors.get(tractor), trailerId: trailers.get(trailer), requestedDeparture: demoDeparture(departure, today) })));
      templates.push((await moves.create(dto, dispatcher, now)).id);
    }
    // copies in bulk: customers, dates (a year back to a year ahead), drivers and stages vary
    const copies = LARGE.moves - templates.length;
    await ds.transaction(async (m) => {
      await m.query(
        `INSERT INTO moves (reference, customer, customer_ref, commodity, stage, tractor_id, trailer_id, driver_id, slider_setting_ft, articles, route,
                            jurisdictions, origin, destination, requested_departure, travel_days, notes, summary, created_by, created_at, updated_at)
         SELECT 'AM-L-' || lpad(g::text, 6, '0'),
                (ARRAY['Cedar Flats Aggregate Co.','Blue Hollow Electric Cooperative','Ridgeback Stamping Works','Larkspur Bridge & Iron',
                       'Saltmarsh Fermentation LLC','Fernhollow Paper Mill','Ironweed Process Systems','Mesquite Bend Ranch Supply',
                       'Quarrystone Cement','Tallgrass Wind Services','Harrowgate Mining','Pinecrest Modular Homes'])[1 + g % 12] || ' #' || (g % 97),
                'L-' || g, t.commodity,
                (ARRAY['requested','requested','permits_received','escorts_booked','running','delivered','delivered','delivered','cancelled'])[1 + (g * 7) % 9],
                t.tractor_id, t.trailer_id, ($2::uuid[])[1 + g % array_length($2::uuid[], 1)], t.slider_setting_ft, t.articles, t.route,
                t.jurisdictions, t.origin, t.destination, (current_date - 365 + (g * 73) % 730), t.travel_days, NULL, t.summary, $3, now(), now()
           FROM generate_series(1, $1::int) g
           JOIN (SELECT row_number() OVER (ORDER BY reference) - 1 AS k, * FROM moves WHERE id = ANY($4)) t ON t.k = g % $5`,
        [copies, drivers, dispatcher.id, templates, templates.length],
      );
      await m.query(
        `INSERT INTO audit_entries (move_id, entity, entity_id, action, actor_id, after)
         SELECT id, 'move', id::text, 'created', $1, jsonb_build_object('customer', customer, 'commodity', commodity) FROM moves WHERE reference LIKE 'AM-L-%'
           AND NOT EXISTS (SELECT 1 FROM audit_entries a WHERE a.move_id = moves.id)`,
        [dispatcher.id],
      );
    });
    await ds.query('ANALYZE');
    const [{ total }] = await ds.query(`SELECT count(*)::int AS total FROM moves`);
    return `${users.length} users, 40 tractors, 60 trailers, ${total} moves in ${((Date.now() - started) / 1000).toFixed(1)} s`;
  } finally {
    await app.close();
  }
}

if (require.main === module) {
  seedLarge()
    .then((msg) => console.log(`seed:large: ${msg}`))
    .catch((e) => {
      console.error('seed:large failed:', e);
      process.exit(1);
    });
}
