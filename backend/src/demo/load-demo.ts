import 'reflect-metadata';
import { NestFactory } from '@nestjs/core';
import { plainToInstance } from 'class-transformer';
import { validate } from 'class-validator';
import { DataSource } from 'typeorm';
import type { SessionUser } from '@amberline/common';
import PDFDocument from 'pdfkit';
import { DEMO_MOVES, DEMO_TRACTORS, DEMO_TRAILERS, DEMO_USERS, DEMO_VENDORS, demoDeparture, seedDemoUsers, seedVendor } from '@amberline/seed';
import { AppModule } from '../app.module';
import { AuditService } from '../audit/audit.service';
import { FleetService } from '../fleet/fleet.service';
import { TractorInputDto, TrailerInputDto } from '../fleet/dto/fleet.dto';
import { CreateMoveDto } from '../moves/dto/move.dto';
import { MovesService } from '../moves/moves.service';
import { DocumentsService } from '../permits/documents.service';
import { PermitsService } from '../permits/permits.service';
import { travelDates } from '../moves/assessment.service';

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

    for (const v of DEMO_VENDORS) await seedVendor(ds, v);
    const clerk = byEmail.get('clerk@amberline.example')!;
    const permits = app.get(PermitsService);
    const documents = app.get(DocumentsService);
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
      // the permit desk's queue: one permit per state that needs one, from the assessment
      if (stage !== 'cancelled') await permits.syncForMove(move.id, clerk, now);
      if (stage !== 'requested' && stage !== 'cancelled') {
        // later stages: the clerk has filed and received each permit and attached the state's PDF (fees left to pay)
        const dates = travelDates(move.requestedDeparture, move.travelDays);
        for (const p of await permits.forMove(move.id, clerk, now)) {
          if (p.status !== 'to_file') continue;
          const filed = await permits.update(p.id, { version: p.version, status: 'filed' } as never, clerk, now);
          const number = `${p.jurisdiction}-${now.getUTCFullYear()}-${String(100_000 + Math.floor(Math.abs(hash(move.reference + p.jurisdiction)) % 900_000))}`;
          await permits.update(
            p.id,
            { version: filed.version, status: 'issued', permitNumber: number, validFrom: `${addDays(dates[0], -1)}T00:00`, validTo: `${addDays(dates[dates.length - 1], 1)}T23:59`, actualFeeUsd: p.estimatedFeeUsd ?? 60, conditionsText: 'Travel as the permit states; carry it in the cab.' } as never,
            clerk,
            now,
          );
          await documents.upload(p.id, { originalname: `${number}.pdf`, ...(await demoPermitPdf(number, move.reference, p.jurisdiction)) }, clerk);
        }
      }
      if (stage !== 'requested') {
        await ds.transaction(async (m) => {
          // past requested, a move keeps the rule versions it was assessed with
          await m.query(
            `UPDATE moves SET stage = $2, version = version + 1, stage_changed_at = now(),
                    rule_versions = (SELECT jsonb_object_agg(j.code, j.current_version) FROM jurisdictions j WHERE j.code = ANY(moves.jurisdictions))
              WHERE id = $1`,
            [move.id, stage],
          );
          await audit.record(m, {
            moveId: move.id, entity: 'move', entityId: move.id, action: 'stage', actorId: dispatcher.id,
            before: { stage: 'requested' }, after: { stage },
            reason: stageReason ?? 'demo data: loaded at this stage without its permits and bookings',
          });
        });
      }
    }
    return `demo scenario loaded: ${DEMO_USERS.length} users, ${DEMO_TRACTORS.length} tractors, ${DEMO_TRAILERS.length} trailers, ${DEMO_VENDORS.length} escort vendors, ${DEMO_MOVES.length} moves with their permits`;
  } finally {
    await app.close();
  }
}

function hash(s: string): number {
  let h = 0;
  for (const c of s) h = (h * 31 + c.charCodeAt(0)) | 0;
  return h;
}
const addDays = (d: string, n: number) => new Date(Date.parse(`${d}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

/** A one-page stand-in for the state's permit PDF, clearly marked as demo data. */
export function demoPermitPdf(number: string, reference: string, state: string): Promise<{ buffer: Buffer; size: number }> {
  return new Promise((resolve) => {
    const doc = new PDFDocument({ size: 'LETTER', margin: 60 });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => {
      const buffer = Buffer.concat(chunks);
      resolve({ buffer, size: buffer.length });
    });
    doc.fontSize(18).text(`DEMO PERMIT ${number}`).moveDown().fontSize(11);
    doc.text(`State: ${state}. Move ${reference}. This document is demo data made by Amberline, not a permit issued by any state.`);
    doc.end();
  });
}

if (require.main === module) {
  loadDemo()
    .then((msg) => console.log(`demo: ${msg}`))
    .catch((e) => {
      console.error('demo: failed:', e.message);
      process.exit(1);
    });
}
