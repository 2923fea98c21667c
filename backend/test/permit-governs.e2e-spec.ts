/**
 * The permit governs: validity checked window by window to the minute in the state's zone, the issued permit's
 * recorded travel hours and escorts replacing the rulebook's on the assessment and the run sheet, assessments that
 * keep their rule versions once the move has left requested, and reopening with a reason.
 */
import { RULEBOOK_DATA, type AssessmentDto, type MoveDto, type PermitDto, type Role, type RunSheetDto } from '@amberline/common';
import { seedTractor, seedTrailer } from '@amberline/seed';
import { daysFromNow, texasMove } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';

describe('the permit governs', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  let tractorId: string;
  let trailerId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) tokens[role] = users[role].token;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });

  const newMove = async (over = {}): Promise<MoveDto> => {
    const res = await t.http().post('/api/moves').set(as('dispatcher')).send(texasMove(tractorId, trailerId, over));
    expect(res.status).toBe(201);
    return res.body;
  };
  const permitOf = async (moveId: string, code: string): Promise<PermitDto> => {
    await t.http().post(`/api/moves/${moveId}/permits/sync`).set(as('permit_clerk')).expect(200);
    const list: PermitDto[] = (await t.http().get(`/api/moves/${moveId}/permits`).set(as('permit_clerk'))).body;
    return list.find((p) => p.jurisdiction === code)!;
  };
  const patch = (id: string, body: object) => t.http().patch(`/api/permits/${id}`).set(as('permit_clerk')).send(body);
  const issue = async (p: PermitDto, body: object): Promise<PermitDto> => {
    const filed = await patch(p.id, { version: p.version, status: 'filed' });
    expect(filed.status).toBe(200);
    const issued = await patch(p.id, { version: filed.body.version, status: 'issued', permitNumber: `P-${Date.now()}`, ...body });
    expect(issued.status).toBe(200);
    return issued.body;
  };
  const assessmentOf = async (moveId: string): Promise<AssessmentDto> => (await t.http().get(`/api/moves/${moveId}/assessment`).set(as('dispatcher'))).body;
  const unmetFor = async (moveId: string, to: string) => {
    const res = await t.http().post(`/api/moves/${moveId}/stage`).set(as('dispatcher')).send({ to });
    return (res.body.details?.unmet ?? []) as { code: string; jurisdiction?: string; message: string }[];
  };

  describe('validity, to the minute, in the state\'s zone', () => {
    // Virginia: "Normal times of travel for permitted loads are sunrise to sunset" (24VAC20-82-110(B)), on file.
    const virginia = { route: [{ order: 1, jurisdiction: 'VA', roads: 'US 360', miles: 90, roadType: 'two-lane', zip: '23219' }], origin: 'Richmond, VA', destination: 'Danville, VA', travelDays: 2 };

    it('a permit valid 00:01 on the first day to 23:59 on the last covers sunrise-to-sunset travel', async () => {
      const move = await newMove(virginia);
      const p = await permitOf(move.id, 'VA');
      await issue(p, { validFrom: `${daysFromNow(10)}T00:01`, validTo: `${daysFromNow(11)}T23:59` });
      const unmet = await unmetFor(move.id, 'permits_received');
      expect(unmet.filter((u) => u.code === 'permit_validity')).toEqual([]);
      // what is still missing is named (PDF, fee), not the validity
      expect(unmet.map((u) => u.code)).toEqual(expect.arrayContaining(['permit_pdf_missing', 'permit_unpaid']));
    });

    it('a permit valid only from 09:30 does not cover the first day\'s window from sunrise, and says which window', async () => {
      const move = await newMove(virginia);
      const p = await permitOf(move.id, 'VA');
      await issue(p, { validFrom: `${daysFromNow(10)}T09:30`, validTo: `${daysFromNow(11)}T23:59` });
      const gaps = (await unmetFor(move.id, 'permits_received')).filter((u) => u.code === 'permit_validity');
      expect(gaps).toHaveLength(1);
      expect(gaps[0].message).toMatch(new RegExp(`^VA permit: valid ${daysFromNow(10)} 09:30 E[SD]T to ${daysFromNow(11)} 23:59 E[SD]T: travel window ${daysFromNow(10)} 0\\d:\\d\\d–\\d\\d:\\d\\d America/New_York starts before the permit is valid \\(from ${daysFromNow(10)} 09:30 E[SD]T\\)$`));
    });

    it('where the state\'s travel hours are not on file (TX), a 00:01 start is accepted and a day outside the validity is named', async () => {
      expect(RULEBOOK_DATA.TX.travel.daylight.status).toBe('unknown');
      const move = await newMove({ travelDays: 2 });
      const p = await permitOf(move.id, 'TX');
      const issued = await issue(p, { validFrom: `${daysFromNow(10)}T00:01`, validTo: `${daysFromNow(10)}T23:59` });
      const gaps = (await unmetFor(move.id, 'permits_received')).filter((u) => u.code === 'permit_validity');
      expect(gaps.map((g) => g.message)).toEqual([expect.stringMatching(new RegExp(`travel day ${daysFromNow(11)} lies outside the permit's validity .*; travel hours not on file$`))]);
      const longer = await patch(issued.id, { version: issued.version, validTo: `${daysFromNow(11)}T23:59` });
      expect(longer.status).toBe(200);
      expect((await unmetFor(move.id, 'permits_received')).filter((u) => u.code === 'permit_validity')).toEqual([]);
    });
  });

  describe('the issued permit\'s conditions replace the rulebook\'s', () => {
    it('travel hours and escorts from the permit reach the assessment and the driver\'s run sheet, with the differences named', async () => {
      const move = await newMove({ travelDays: 2 });
      const p = await permitOf(move.id, 'TX');
      const before = (await assessmentOf(move.id)).result.jurisdictions.find((j) => j.code === 'TX')!;
      expect(before.governedBy).toBeNull();
      await issue(p, {
        validFrom: `${daysFromNow(9)}T00:00`,
        validTo: `${daysFromNow(12)}T23:59`,
        conditions: { escortsFront: 2, escortsRear: 1, travel: { hours: { kind: 'clock', start: '09:00', end: '15:00' }, weekendBans: [] } },
      });
      const tx = (await assessmentOf(move.id)).result.jurisdictions.find((j) => j.code === 'TX')!;
      expect(tx.governedBy!.topics).toEqual(['travel.hours', 'travel.weekends', 'escorts']);
      expect(tx.governedBy!.differences).toContain('travel hours — permit: 09:00–15:00 local time; rulebook: not on file');
      expect(tx.escorts).toMatchObject({ known: true, front: 2, rear: 1 });
      expect(tx.escorts.reasons[0].source).toMatch(/^TX permit P-\d+ \(issued \d{4}-\d\d-\d\d\)$/);
      expect(tx.openQuestions.filter((q) => q.topic === 'escorts' || q.topic === 'travel.daylight' || q.topic === 'travel.weekends')).toEqual([]);
      for (const d of tx.travel) {
        // holidays in Texas stay not on file: a holiday could only take time away, never add it
        expect(d.intervals.map((i) => `${i.startLocal}–${i.endLocal}`)).toEqual(['09:00–15:00']);
        expect(d.restrictions.find((r) => r.code === 'permit-hours')!.source).toMatch(/^TX permit P-/);
      }
      const sheet: RunSheetDto = (await t.http().get(`/api/moves/${move.id}/run-sheet`).set(as('dispatcher'))).body;
      const days = sheet.travel.find((x) => x.jurisdiction === 'TX')!.days;
      expect(days.every((d) => d.intervals.length === 1 && d.intervals[0].startLocal === '09:00' && d.intervals[0].endLocal === '15:00')).toBe(true);
      expect(sheet.permits.find((x) => x.jurisdiction === 'TX')!.conditions).toEqual(expect.arrayContaining(['escorts: 2 front, 1 rear', 'travel hours: 09:00–15:00 local time', 'weekends: weekend travel allowed']));
    });

    it('refuses a condition with an unknown topic or hours that end before they start, naming the field, and writes nothing', async () => {
      const move = await newMove();
      const p = await permitOf(move.id, 'TX');
      const bad = await patch(p.id, { version: p.version, conditions: { travel: { nightHours: true } } });
      expect(bad.status).toBe(400);
      expect(bad.body.details).toEqual([expect.objectContaining({ field: 'conditions.travel.nightHours' })]);
      const backwards = await patch(p.id, { version: p.version, conditions: { travel: { hours: { kind: 'clock', start: '19:00', end: '07:00' } } } });
      expect(backwards.status).toBe(400);
      expect(backwards.body.details[0].field).toBe('conditions.travel.hours.end');
      const topLevel = await patch(p.id, { version: p.version, conditions: { nightTravel: true } });
      expect(topLevel.status).toBe(400);
      expect(topLevel.body.details[0].field).toBe('conditions.nightTravel');
      const reversed = await patch(p.id, { version: p.version, validFrom: `${daysFromNow(10)}T08:00`, validTo: `${daysFromNow(9)}T08:00` });
      expect(reversed.status).toBe(400);
      expect(reversed.body.details[0].field).toBe('validTo');
      const same: PermitDto = (await t.http().get(`/api/permits/${p.id}`).set(as('permit_clerk'))).body;
      expect(same.version).toBe(p.version);
      expect(same.conditions.travel).toBeUndefined();
    });
  });

  describe('assessments keep their rule versions once the move has left requested', () => {
    // South Dakota is used by no other test here: its record is edited below
    const southDakota = { route: [{ order: 1, jurisdiction: 'SD', roads: 'US 14', miles: 120, roadType: 'two-lane', zip: '57501' }], origin: 'Pierre, SD', destination: 'Huron, SD' };
    const editSouthDakota = async (note: string) => {
      const current = (await t.http().get('/api/rulebook/jurisdictions/SD').set(as('admin'))).body;
      const record = JSON.parse(JSON.stringify(current.record));
      record.travel.daylight = { status: 'unknown', note: `test: ${note}` };
      const res = await t.http().put('/api/rulebook/jurisdictions/SD').set(as('admin')).send({ record, note });
      expect(res.status).toBe(200);
      return res.body.version as number;
    };

    it('a running move keeps its versions after a rule edit, shows the differences, and moves to the new rules only when re-assessed', async () => {
      const move = await newMove(southDakota);
      const used = (await assessmentOf(move.id)).ruleVersions.SD;
      // the earlier stages are covered by their own guards; this puts the move past requested as they would
      await t.ds.query(`UPDATE moves SET stage = 'escorts_booked', rule_versions = $2, version = version + 1 WHERE id = $1`, [move.id, JSON.stringify({ SD: used })]);
      const newer = await editSouthDakota('daylight rule under review');
      const kept = await assessmentOf(move.id);
      expect(kept.ruleVersions.SD).toBe(used);
      expect(kept.pinned).toBe(true);
      expect(kept.newerRules).toEqual([{ code: 'SD', used, current: newer }]);
      const preview = (await t.http().get(`/api/moves/${move.id}/reassessment`).set(as('dispatcher'))).body;
      expect(preview).toMatchObject({ allowed: true, used: { SD: used }, current: { SD: newer } });
      expect(preview.differences.some((d: string) => /^SD: travel windows /.test(d))).toBe(true);
      expect(preview.differences).toContain('SD: new open question — South Dakota: travel hours not on file — check the permit');
      const stale = await t.http().post(`/api/moves/${move.id}/reassess`).set(as('dispatcher')).send({ version: 1 });
      expect(stale.status).toBe(409);
      const moved = await t.http().post(`/api/moves/${move.id}/reassess`).set(as('dispatcher')).send({ version: preview.moveVersion, reason: 'new South Dakota rules' });
      expect(moved.status).toBe(201);
      const after = await assessmentOf(move.id);
      expect(after.ruleVersions.SD).toBe(newer);
      expect(after.newerRules).toEqual([]);
      const history = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; reason: string | null; after: { ruleVersions: Record<string, number> } }[];
      expect(history.find((h) => h.action === 'reassessed')).toMatchObject({ reason: 'new South Dakota rules', after: { ruleVersions: { SD: newer } } });
      expect((await t.http().post(`/api/moves/${move.id}/reassess`).set(as('driver')).send({ version: moved.body.version })).status).toBe(403);
    });

    it('a cancelled move never changes: no re-assessment; reopening needs a reason and brings it back to requested on the current rules', async () => {
      const move = await newMove(southDakota);
      const cancelled = await t.http().post(`/api/moves/${move.id}/stage`).set(as('dispatcher')).send({ to: 'cancelled', reason: 'customer postponed' });
      expect(cancelled.status).toBe(201);
      const used = (await assessmentOf(move.id)).ruleVersions.SD;
      const newer = await editSouthDakota('second review');
      expect((await assessmentOf(move.id)).ruleVersions.SD).toBe(used);
      const preview = (await t.http().get(`/api/moves/${move.id}/reassessment`).set(as('dispatcher'))).body;
      expect(preview.allowed).toBe(false);
      const refused = await t.http().post(`/api/moves/${move.id}/reassess`).set(as('dispatcher')).send({ version: cancelled.body.version });
      expect(refused.status).toBe(409);
      const noReason = await t.http().post(`/api/moves/${move.id}/reopen`).set(as('dispatcher')).send({ version: cancelled.body.version });
      expect(noReason.status).toBe(400);
      expect(noReason.body.details[0].field).toBe('reason');
      const reopened = await t.http().post(`/api/moves/${move.id}/reopen`).set(as('dispatcher')).send({ version: cancelled.body.version, reason: 'customer confirmed new dates' });
      expect(reopened.status).toBe(201);
      expect(reopened.body.stage).toBe('requested');
      const now = await assessmentOf(move.id);
      expect(now.ruleVersions.SD).toBe(newer);
      expect(now.pinned).toBe(false);
      const history = (await t.http().get(`/api/moves/${move.id}/history`).set(as('dispatcher'))).body as { action: string; reason: string | null }[];
      expect(history.find((h) => h.action === 'reopened')).toMatchObject({ reason: 'customer confirmed new dates' });
    });

    it('a delivered move reopens to running within 7 days of delivery, not after', async () => {
      const move = await newMove(southDakota);
      await t.ds.query(`UPDATE moves SET stage = 'delivered', stage_changed_at = now() - interval '8 days', version = version + 1 WHERE id = $1`, [move.id]);
      const late = await t.http().post(`/api/moves/${move.id}/reopen`).set(as('dispatcher')).send({ version: move.version + 1, reason: 'delivery note wrong' });
      expect(late.status).toBe(409);
      expect(late.body.message).toMatch(/more than 7 days ago/);
      await t.ds.query(`UPDATE moves SET stage_changed_at = now() - interval '2 days' WHERE id = $1`, [move.id]);
      const ok = await t.http().post(`/api/moves/${move.id}/reopen`).set(as('dispatcher')).send({ version: move.version + 1, reason: 'delivery note wrong' });
      expect(ok.status).toBe(201);
      expect(ok.body.stage).toBe('running');
    });
  });

  describe('the day plan and the schedule check', () => {
    const texasNewMexico = {
      route: [
        { order: 1, jurisdiction: 'TX', roads: 'I-10 W', miles: 180, roadType: 'interstate', zip: '78624' },
        { order: 2, jurisdiction: 'NM', roads: 'I-10 W to Las Cruces', miles: 45, roadType: 'interstate', zip: '88001' },
      ],
      destination: 'Las Cruces, NM',
      travelDays: 2,
    };

    it('puts each state on the days it is driven, from the daily distance, and refuses a distance that needs more days', async () => {
      const move = await newMove(texasNewMexico);
      const spread = (await t.http().get(`/api/moves/${move.id}/schedule`).set(as('dispatcher'))).body;
      // 225 mi over 2 days: 113 mi a day (the route's own miles; no outside source involved)
      expect(spread).toMatchObject({ dailyMilesSet: false, plan: { dailyMiles: 113, daysNeeded: 2 } });
      expect(spread.days.map((d: { states: { jurisdiction: string }[] }) => d.states.map((x) => x.jurisdiction))).toEqual([['TX'], ['TX', 'NM']]);
      const tooShort = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, dailyMiles: 100 });
      expect(tooShort.status).toBe(400);
      expect(tooShort.body.details[0]).toMatchObject({ field: 'dailyMiles', reason: expect.stringMatching(/take 3 days; the move plans 2/) });
      const long = await t.http().patch(`/api/moves/${move.id}`).set(as('dispatcher')).send({ version: move.version, dailyMiles: 250 });
      expect(long.status).toBe(200);
      const plan = (await t.http().get(`/api/moves/${move.id}/schedule`).set(as('dispatcher'))).body;
      expect(plan.days[0].states.map((x: { jurisdiction: string }) => x.jurisdiction)).toEqual(['TX', 'NM']);
      expect(plan.days[1].states).toEqual([]);
    });

    it('a permit that does not cover a planned day in its state holds the run, named by day and window', async () => {
      const move = await newMove({ route: [{ order: 1, jurisdiction: 'VA', roads: 'US 360', miles: 200, roadType: 'two-lane', zip: '23219' }], origin: 'Richmond, VA', destination: 'Danville, VA', travelDays: 2 });
      const p = await permitOf(move.id, 'VA');
      await issue(p, { validFrom: `${daysFromNow(10)}T00:01`, validTo: `${daysFromNow(10)}T23:59` });
      const schedule = (await t.http().get(`/api/moves/${move.id}/schedule`).set(as('dispatcher'))).body;
      expect(schedule.ok).toBe(false);
      expect(schedule.findings).toEqual([expect.objectContaining({ code: 'permit_validity', jurisdiction: 'VA', date: daysFromNow(11), blocking: true })]);
      await t.ds.query(`UPDATE moves SET stage = 'escorts_booked', version = version + 1 WHERE id = $1`, [move.id]);
      const unmet = await unmetFor(move.id, 'running');
      expect(unmet.find((u) => u.code === 'schedule_permit_validity')?.message).toMatch(new RegExp(`^schedule: VA permit on ${daysFromNow(11)}: travel window ${daysFromNow(11)} .* lies outside the permit's validity`));
    });
  });

  describe('stages with dates', () => {
    it('a move cannot run before its earliest legal departure, and the refusal says when that is, with its zone', async () => {
      const move = await newMove();
      await t.ds.query(`UPDATE moves SET stage = 'escorts_booked', version = version + 1 WHERE id = $1`, [move.id]);
      const unmet = await unmetFor(move.id, 'running');
      const early = unmet.find((u) => u.code === 'before_earliest_departure');
      expect(early?.message).toMatch(new RegExp(`^the move cannot run before its earliest legal departure, ${daysFromNow(10)} 00:00 C[SD]T`));
    });
  });
});
