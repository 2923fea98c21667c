/** The printed run sheet: the same markings as the page, only glyphs the font draws, local times with their zone, drawings kept with their captions. */
import { dirname } from 'node:path';
import { markingLines, positionKey, type AssessmentDto, type MoveInput, type RunSheetDto, type Role } from '@amberline/common';
import { DEMO_MOVES, seedTractor, seedTrailer } from '@amberline/seed';
import { renderRunSheetPdf } from '../src/run-sheets/run-sheet-pdf';
import { daysFromNow, texasMove } from './fixtures/moves';
import { createTestApp, type TestApp } from './utils/create-test-app';
import { pdfText } from './utils/pdf-text';

// the library entry, not the package index (see utils/pdf-text.ts)
// eslint-disable-next-line @typescript-eslint/no-require-imports
const pdfParse: (data: Buffer, o: { pagerender: (page: { getTextContent(): Promise<{ items: { str: string }[] }> }) => Promise<string> }) => Promise<unknown> = require('pdf-parse/lib/pdf-parse.js');
// the font reader pdfkit embeds fonts with, to ask the shipped font which characters it draws
// eslint-disable-next-line @typescript-eslint/no-require-imports
const fontkit: { openSync(p: string): { hasGlyphForCodePoint(c: number): boolean } } = require(require.resolve('fontkit', { paths: [dirname(require.resolve('pdfkit'))] }));
const NOTO = ['400Regular/NotoSans_400Regular.ttf', '700Bold/NotoSans_700Bold.ttf'].map((f) => fontkit.openSync(require.resolve(`@expo-google-fonts/noto-sans/${f}`)));

/** Characters of the text that Noto Sans (regular or bold) has no glyph for; U+0000 is what a missing glyph reads back as. */
const undrawable = (text: string): string[] => [...new Set(Array.from(text.replace(/\n/g, '')).filter((c) => c === '\u0000' || !NOTO.every((f) => f.hasGlyphForCodePoint(c.codePointAt(0)!))))];

async function pagesOf(pdf: Buffer): Promise<string[]> {
  const pages: string[] = [];
  await pdfParse(pdf, {
    pagerender: async (page) => {
      const text = (await page.getTextContent()).items.map((i) => i.str).join(' ');
      pages.push(text);
      return text;
    },
  });
  return pages;
}

function bufferOf(doc: ReturnType<typeof renderRunSheetPdf>): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.end();
  });
}

/** Text as one line: wrapped lines joined, runs of spaces as one. */
const flat = (text: string): string => text.replace(/\s+/g, ' ');
const count = (text: string, part: string): number => flat(text).split(part).length - 1;
/** The short zone name of a zone at an instant, as the platform gives it ("CST"). */
const zoneAt = (iso: string, timeZone: string): string => new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(new Date(iso)).find((p) => p.type === 'timeZoneName')!.value;
const localClockOf = (iso: string, timeZone: string): string => new Intl.DateTimeFormat('en-GB', { timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).format(new Date(iso));

describe('run-sheet PDF', () => {
  let t: TestApp;
  const tokens = {} as Record<Role, string>;
  let driverId: string;
  let tractorId: string;
  let trailerId: string;
  beforeAll(async () => {
    t = await createTestApp();
    const users = await t.signedInAll();
    for (const role of Object.keys(users) as Role[]) tokens[role] = users[role].token;
    driverId = users.driver.id;
    tractorId = (await seedTractor(t.ds)).id;
    trailerId = (await seedTrailer(t.ds)).id;
  });
  afterAll(() => t.close());
  const as = (role: Role) => ({ authorization: `Bearer ${tokens[role]}` });

  /** A move assigned to the test driver, at escorts_booked, with its run sheet, assessment and PDF. */
  async function printed(input: MoveInput) {
    const created = await t.http().post('/api/moves').set(as('dispatcher')).send(input);
    expect(created.status).toBe(201);
    const id = created.body.id as string;
    await t.ds.query(`UPDATE moves SET stage = 'escorts_booked' WHERE id = $1`, [id]);
    const sheet = (await t.http().get(`/api/moves/${id}/run-sheet`).set(as('driver')).expect(200)).body as RunSheetDto;
    const assessment = (await t.http().get(`/api/moves/${id}/assessment`).set(as('dispatcher')).expect(200)).body as AssessmentDto;
    const res = await t.http().get(`/api/moves/${id}/run-sheet.pdf`).set(as('driver')).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    const pdf = res.body as Buffer;
    return { sheet, assessment, pdf, text: await pdfText(pdf) };
  }

  /** The demo's 15 ft wide excavator on Texas roads (the demo scenario's first move), on the test fleet. */
  const demoTexas = (): MoveInput => {
    const { key: _k, tractor: _tr, trailer: _tl, driver: _d, departure: _dep, stage: _s, stageReason: _r, purpose: _p, ...plan } = DEMO_MOVES.find((d) => d.key === 'excavator-tx')!;
    return { ...plan, tractorId, trailerId, driverId, requestedDeparture: daysFromNow(6) };
  };

  it('the demo Texas run sheet prints every character with a glyph of the shipped font (no empty boxes)', async () => {
    const { text } = await printed(demoTexas());
    expect(undrawable(text)).toEqual([]);
    // the route arrow and the check boxes, which the font lacks, print in words and glyphs it has
    expect(flat(text)).toContain('Katy, TX (Cedar Flats yard) to Kerrville, TX');
    expect(flat(text)).toContain('[ ] height');
  });

  it('characters the font lacks in the move\'s own words print as words (→ "to", ≥ "at least"), never as boxes', async () => {
    const { text } = await printed(texasMove(tractorId, trailerId, { driverId, commodity: 'Excavator → quarry 2, ≥14 ft wide ✓' }));
    expect(undrawable(text)).toEqual([]);
    expect(flat(text)).toContain('Excavator to quarry 2, at least 14 ft wide yes');
  });

  it('travel windows and the earliest legal departure print in the state\'s local time with its zone named, none in UTC', async () => {
    const { sheet, text } = await printed(demoTexas());
    const body = flat(text);
    expect(body).toContain('Travel windows (local time)');
    expect(body).not.toMatch(/\d{2}:\d{2} UTC/);
    let lines = 0;
    for (const j of sheet.travel) {
      for (const d of j.days) {
        expect(d.timeZone).toBe('America/Chicago');
        const spans = d.intervals.map((iv) => `${iv.startLocal} to ${iv.endLocal} ${zoneAt(iv.start, d.timeZone)}`).join(', ') || 'no travel';
        expect(spans).toMatch(/^(no travel|\d{2}:\d{2} to \d{2}:\d{2} C[SD]T)/);
        expect(body).toContain(`${j.jurisdiction} ${d.date}: ${spans}`);
        lines += 1;
      }
    }
    expect(lines).toBeGreaterThan(0);
    // the earliest legal departure is the first window's start in Texas, in Central time
    expect(sheet.earliestDeparture).not.toBeNull();
    const zone = sheet.travel[0].days[0].timeZone;
    expect(body).toMatch(new RegExp(`Earliest legal departure: \\d{4}-\\d{2}-\\d{2} ${localClockOf(sheet.earliestDeparture!, zone)} ${zoneAt(sheet.earliestDeparture!, zone)} \\(Texas\\)`));
  });

  it('keeps the load diagram with its heading and captions on one page and prints no near-blank page, wherever the diagram falls', async () => {
    const { sheet } = await printed(demoTexas());
    // longer sections above the diagram move it down the page, across the page end and onto the next page
    for (let extra = 0; extra <= 40; extra += 2) {
      const openQuestions = [...sheet.openQuestions, ...Array.from({ length: extra }, (_, i) => ({ jurisdiction: 'TX', topic: `sample.${i}`, message: `Texas: sample topic ${i} not on file — check the permit` }))];
      const pages = await pagesOf(await bufferOf(renderRunSheetPdf({ ...sheet, openQuestions })));
      const on = (part: string) => pages.findIndex((p) => flat(p).includes(part));
      const heading = on('Load diagram and overall dimensions');
      expect([extra, on('side view from the trailer front')]).toEqual([extra, heading]);
      expect([extra, on('rear view: flags red squares')]).toEqual([extra, heading]);
      // a page before the last one holds more than a stray label or caption
      for (const p of pages.slice(0, -1)) expect([extra, p.length > 600]).toEqual([extra, true]);
    }
  }, 120_000);

  it('lists the flags, signs and lamps of every state\'s assessment once per item and place, every source kept, on the page and in the PDF (49 CFR 393.87 flags, 393.11 lamps, Wyoming corner flags)', async () => {
    const { sheet, assessment, text } = await printed(
      texasMove(tractorId, trailerId, {
        driverId,
        route: [
          { order: 1, jurisdiction: 'CO', roads: 'I-25 N', miles: 45, roadType: 'interstate', zip: '80525' },
          { order: 2, jurisdiction: 'WY', roads: 'I-25 N, I-80 W', miles: 120, roadType: 'interstate', zip: '82001' },
        ],
        origin: 'Fort Collins, CO',
        destination: 'Laramie, WY',
        travelDays: 2,
      }),
    );
    const states = assessment.result.jurisdictions;
    expect(states.map((j) => j.code)).toEqual(['CO', 'WY']);
    const wy = states.find((j) => j.code === 'WY')!;
    // Wyoming asks for flags at the four corners of an oversize load; the plan-level (federal) set has none
    expect(wy.markings.flags.filter((f) => /corner/.test(f.position))).toHaveLength(4);
    expect(assessment.result.markings.flags.some((f) => /corner/.test(f.position))).toBe(false);

    const lines = markingLines(sheet.markings);
    // every item of every state's assessment is on the run sheet, on a line that names the state and keeps the source
    for (const j of states) {
      const m = j.markings;
      const asked = [
        ...m.flags.map((x) => ['flag', x.position, x.source]),
        ...m.signs.map((x) => ['sign', x.position, x.source]),
        ...m.escortSigns.map((x) => ['escort-sign', x.position, x.source]),
        ...m.lamps.map((x) => ['lamp', x.position, x.source]),
        ...m.reflectors.map((x) => ['reflector', x.position, x.source]),
      ];
      for (const [kind, position, source] of asked) {
        const line = lines.find((l) => l.kind === kind && positionKey(l.where) === positionKey(position) && l.rules.some((r) => r.source === source));
        expect([j.code, kind, position, line?.jurisdictions.includes(j.code)]).toEqual([j.code, kind, position, true]);
      }
    }
    // one line per item and place: the federal flags and lamps asked in both states print once
    const keys = lines.map((l) => `${l.kind}|${l.color ?? ''}|${positionKey(l.where)}`);
    expect(new Set(keys).size).toBe(keys.length);
    const concatenated = states.reduce((n, j) => n + j.markings.flags.length + j.markings.signs.length + j.markings.lamps.length + j.markings.escortSigns.length + j.markings.reflectors.length, 0);
    expect(lines.length).toBeLessThan(concatenated);
    // the federal side-projection lamps once for both states; Colorado's own night-travel lamps for a load over
    // 8 ft 6 in wide (2 CCR 601-4 Rule 408.3: one at the front of the vehicle, two on the extreme rear) in CO only
    const lampLines = lines.filter((l) => l.kind === 'lamp').map((l) => [l.where, l.onlyIn]);
    expect(lampLines).toHaveLength(4);
    expect(lampLines).toEqual(expect.arrayContaining([
      ['front of the side projection', null],
      ['rear of the side projection', null],
      ['front of the vehicle', 'CO'],
      ['extreme rear', 'CO'],
    ]));

    // the PDF prints exactly these lines, each once
    const section = flat(text).split('Flags, signs and lamps')[1].split('Securement')[0];
    for (const l of lines) expect([l.where, count(section, `${l.where.charAt(0).toUpperCase()}${l.where.slice(1)}${l.onlyIn ? ` [${l.onlyIn} only]` : ''}: ${l.what} — `)]).toEqual([l.where, 1]);
    expect(count(section, ' — ')).toBe(lines.length);
    expect(count(section, 'Front left corner [WY only]: Flag')).toBe(1);
    expect(section).toContain('49 CFR 393.87');
    expect(section).toContain('49 CFR 393.11');
    // Wyoming is on Mountain time, and says so
    expect(flat(text)).toMatch(/WY \d{4}-\d{2}-\d{2}: (\d{2}:\d{2} to \d{2}:\d{2} M[SD]T|no travel)/);
  });
});
