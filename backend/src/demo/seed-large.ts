import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import { plainToInstance } from 'class-transformer';
import { DataSource } from 'typeorm';
import type { SessionUser } from '@amberline/common';
import { DEMO_MOVES, DEMO_TRACTORS, DEMO_TRAILERS, demoDeparture, seedTractor, seedTrailer, seedUsersBulk, seedVendor, type DemoMove } from '@amberline/seed';
import { AppModule } from '../app.module';
import { CreateMoveDto } from '../moves/dto/move.dto';
import { MovesService } from '../moves/moves.service';
import { FILE_STORE, type FileStore } from '../permits/storage/file-store';
import { demoPermitPdf } from './load-demo';

export const LARGE = { moves: 10_000, bookings: 5_000, vendors: 20, users: { driver: 150, dispatcher: 30, permit_clerk: 15, admin: 5 } } as const;

/**
 * Long-haul templates through four or five states (invented customers), so the permit desk holds several permits
 * per move (about four on average over the dataset).
 */
const excavator = DEMO_MOVES[0];
const LONG_HAULS: DemoMove[] = [
  { ...excavator, key: 'long-plains', customer: 'Harrowgate Mining', origin: 'Katy, TX', destination: 'Grand Island, NE', departure: 14, travelDays: 4,
    route: [
      { order: 1, jurisdiction: 'TX', roads: 'I-45 N, US 287', miles: 390, roadType: 'multilane', zip: '76301' },
      { order: 2, jurisdiction: 'OK', roads: 'I-44 E, I-35 N', miles: 210, roadType: 'interstate', zip: '73102' },
      { order: 3, jurisdiction: 'KS', roads: 'I-35 N, US 81', miles: 250, roadType: 'multilane', zip: '67401' },
      { order: 4, jurisdiction: 'NE', roads: 'US 81, US 30', miles: 120, roadType: 'two-lane', zip: '68801' },
    ] },
  { ...DEMO_MOVES[1], key: 'long-east', customer: 'Tallgrass Wind Services', origin: 'Danville, VA', destination: 'Albany, NY', departure: 20, travelDays: 3,
    route: [
      { order: 1, jurisdiction: 'VA', roads: 'US 29 N, I-66 E', miles: 190, roadType: 'multilane', zip: '22030' },
      { order: 2, jurisdiction: 'MD', roads: 'I-270 N, US 15', miles: 70, roadType: 'interstate', zip: '21701' },
      { order: 3, jurisdiction: 'PA', roads: 'US 15 N, I-81 N', miles: 240, roadType: 'interstate', zip: '17101' },
      { order: 4, jurisdiction: 'NY', roads: 'I-88 E', miles: 150, roadType: 'interstate', zip: '12203' },
    ] },
  { ...DEMO_MOVES[4], key: 'long-coast', customer: 'Pinecrest Modular Homes', origin: 'Lakeland, FL', destination: 'Richmond, VA', departure: 25, travelDays: 4,
    route: [
      { order: 1, jurisdiction: 'FL', roads: 'I-4 E, I-95 N', miles: 230, roadType: 'interstate', zip: '32202' },
      { order: 2, jurisdiction: 'GA', roads: 'I-95 N', miles: 112, roadType: 'interstate', zip: '31401' },
      { order: 3, jurisdiction: 'SC', roads: 'I-95 N', miles: 198, roadType: 'interstate', zip: '29501' },
      { order: 4, jurisdiction: 'NC', roads: 'I-95 N', miles: 182, roadType: 'interstate', zip: '27801' },
      { order: 5, jurisdiction: 'VA', roads: 'I-95 N', miles: 90, roadType: 'interstate', zip: '23219' },
    ] },
  { ...DEMO_MOVES[2], key: 'long-gulf', customer: 'Larkspur Bridge & Iron', origin: 'Baytown, TX', destination: 'Atlanta, GA', departure: 18, travelDays: 4,
    route: [
      { order: 1, jurisdiction: 'TX', roads: 'I-10 E', miles: 120, roadType: 'interstate', zip: '77002' },
      { order: 2, jurisdiction: 'LA', roads: 'I-10 E, I-12 E', miles: 300, roadType: 'interstate', zip: '70601' },
      { order: 3, jurisdiction: 'MS', roads: 'I-10 E', miles: 80, roadType: 'interstate', zip: '39501' },
      { order: 4, jurisdiction: 'AL', roads: 'I-65 N, I-85 N', miles: 270, roadType: 'interstate', zip: '36602' },
      { order: 5, jurisdiction: 'GA', roads: 'I-85 N', miles: 85, roadType: 'interstate', zip: '30303' },
    ] },
  { ...excavator, key: 'long-national-road', customer: 'Ridgeback Stamping Works', origin: 'Kansas City, MO', destination: 'Washington, PA', departure: 22, travelDays: 4,
    route: [
      { order: 1, jurisdiction: 'MO', roads: 'I-70 E', miles: 250, roadType: 'interstate', zip: '64106' },
      { order: 2, jurisdiction: 'IL', roads: 'I-70 E', miles: 160, roadType: 'interstate', zip: '62401' },
      { order: 3, jurisdiction: 'IN', roads: 'I-70 E', miles: 155, roadType: 'interstate', zip: '46204' },
      { order: 4, jurisdiction: 'OH', roads: 'I-70 E', miles: 225, roadType: 'interstate', zip: '43215' },
      { order: 5, jurisdiction: 'PA', roads: 'I-70 E', miles: 35, roadType: 'interstate', zip: '15301' },
    ] },
];

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
    for (const d of [...DEMO_MOVES, ...LONG_HAULS]) {
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
           JOIN moves t ON t.id = ($4::uuid[])[1 + CASE WHEN g % 5 = 0 THEN g % $5 ELSE $5 + (g - g / 5 - 1) % $6 END]`,
        [copies, drivers, dispatcher.id, templates, DEMO_MOVES.length, LONG_HAULS.length],
      );
      await m.query(
        `INSERT INTO audit_entries (move_id, entity, entity_id, action, actor_id, after)
         SELECT id, 'move', id::text, 'created', $1, jsonb_build_object('customer', customer, 'commodity', commodity) FROM moves WHERE reference LIKE 'AM-L-%'
           AND NOT EXISTS (SELECT 1 FROM audit_entries a WHERE a.move_id = moves.id)`,
        [dispatcher.id],
      );
    });
    // permits: one per state that needs one, in statuses that follow the move's stage
    const clerks = users.filter((u) => u.role === 'permit_clerk').map((u) => u.id);
    await ds.query(
      `INSERT INTO permits (move_id, jurisdiction, status, permit_number, filed_at, issued_at, valid_from, valid_to, estimated_fee_cents,
                            actual_fee_cents, lead_time_days, assignee_id, rule_version)
       SELECT m.id, j.code, s.status,
              CASE WHEN s.status = 'issued' THEN j.code || '-L-' || substr(md5(m.id::text || j.code), 1, 8) END,
              CASE WHEN s.status IN ('filed', 'issued') THEN now() END, CASE WHEN s.status = 'issued' THEN now() END,
              CASE WHEN s.status = 'issued' THEN m.requested_departure - 1 END, CASE WHEN s.status = 'issued' THEN m.requested_departure + m.travel_days + 1 END,
              6000 + (abs(hashtext(m.id::text || j.code)) % 30000), CASE WHEN s.status = 'issued' THEN 6000 + (abs(hashtext(m.id::text || j.code)) % 30000) END,
              2 + abs(hashtext(j.code)) % 4,
              CASE WHEN abs(hashtext(m.id::text || j.code)) % 4 = 0 THEN NULL ELSE ($1::uuid[])[1 + abs(hashtext(m.id::text)) % array_length($1::uuid[], 1)] END,
              1
         FROM moves m
         CROSS JOIN LATERAL unnest(m.jurisdictions) AS j(code)
         CROSS JOIN LATERAL (SELECT CASE
              WHEN m.stage IN ('permits_received','escorts_booked','running','delivered') THEN 'issued'
              WHEN m.stage = 'cancelled' THEN 'void'
              ELSE (ARRAY['to_file','to_file','filed','issued','needs_amendment','rejected'])[1 + abs(hashtext(m.id::text || j.code)) % 6] END AS status) s
        WHERE m.reference LIKE 'AM-L-%' AND (m.summary->'permitsNeeded') ? j.code`,
      [clerks],
    );
    // each issued permit carries its PDF: one stand-in file in the store, a document row per permit
    const pdf = await demoPermitPdf('BENCH-SAMPLE', 'AM-L', 'any');
    const stored = await app.get<FileStore>(FILE_STORE).put(pdf.buffer);
    await ds.query(
      `INSERT INTO permit_documents (permit_id, version, file_name, sha256, size_bytes, storage_key, uploaded_by)
       SELECT p.id, 1, p.permit_number || '.pdf', $1, $2, $3, p.assignee_id FROM permits p
        WHERE p.status = 'issued' AND p.permit_number IS NOT NULL AND NOT EXISTS (SELECT 1 FROM permit_documents d WHERE d.permit_id = p.id)`,
      [stored.sha256, pdf.size, stored.key],
    );
    // escort bookings for moves whose assessment asks for escorts, with invented vendors
    const vendors: string[] = [];
    for (let i = 0; i < LARGE.vendors; i++) vendors.push((await seedVendor(ds, { company: `Bench Escort Co ${i + 1} ${tag}`, states: ['TX', 'OK', 'KS', 'NE', 'VA', 'MD', 'PA', 'NY', 'FL', 'GA', 'SC', 'NC', 'WA'] })).id);
    await ds.query(
      `INSERT INTO escort_bookings (move_id, vendor_id, position, seat, jurisdictions, start_date, end_date, meeting_point, meeting_time, status,
                                    request_summary, requested_by, plan_revision)
       SELECT m.id, ($1::uuid[])[1 + abs(hashtext(m.id::text)) % array_length($1::uuid[], 1)], 'lead', 1, m.jurisdictions,
              m.requested_departure, m.requested_departure + m.travel_days - 1, m.origin, '06:30',
              CASE WHEN m.stage IN ('escorts_booked','running','delivered') THEN 'confirmed' WHEN m.stage = 'cancelled' THEN 'cancelled' ELSE 'requested' END,
              jsonb_build_object('reference', m.reference), $2, m.plan_revision
         FROM moves m WHERE m.reference LIKE 'AM-L-%' AND (m.summary->>'escorts')::int > 0
        ORDER BY m.reference LIMIT $3`,
      [vendors, dispatcher.id, LARGE.bookings],
    );
    await ds.query('ANALYZE');
    const [c] = await ds.query(`SELECT (SELECT count(*) FROM moves)::int AS moves, (SELECT count(*) FROM permits)::int AS permits,
      (SELECT count(*) FROM permit_documents)::int AS documents, (SELECT count(*) FROM escort_bookings)::int AS bookings`);
    return `${users.length} users, 40 tractors, 60 trailers, ${LARGE.vendors} vendors, ${c.moves} moves, ${c.permits} permits (${c.documents} PDFs), ${c.bookings} escort bookings in ${((Date.now() - started) / 1000).toFixed(1)} s`;
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
