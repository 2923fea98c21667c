import PDFDocument from 'pdfkit';
import { formatFeetInches, formatPounds, markingLines, type MarkingLine, type RunSheetDto } from '@amberline/common';

const FONT_REGULAR = require.resolve('@expo-google-fonts/noto-sans/400Regular/NotoSans_400Regular.ttf');
const FONT_BOLD = require.resolve('@expo-google-fonts/noto-sans/700Bold/NotoSans_700Bold.ttf');
const AMBER = '#d97706';
const SLATE = '#1e293b';
const GREY = '#64748b';

type Doc = InstanceType<typeof PDFDocument>;

// ---- glyphs: only characters the shipped font draws -------------------------------------------------------------

type GlyphSource = { hasGlyphForCodePoint(codePoint: number): boolean };
// the font reader pdfkit embeds the font with (a dependency of pdfkit, resolved from it)
// eslint-disable-next-line @typescript-eslint/no-require-imports
const fontkit: { openSync(path: string): GlyphSource } = require('fontkit');
let shipped: GlyphSource[] | undefined;
const covered = new Map<number, boolean>();

/** True when both weights of the shipped font have a glyph for the character. */
function drawable(codePoint: number): boolean {
  let hit = covered.get(codePoint);
  if (hit === undefined) {
    shipped ??= [FONT_REGULAR, FONT_BOLD].map((f) => fontkit.openSync(f));
    hit = codePoint < 0x20 ? codePoint === 0x0a : shipped.every((f) => f.hasGlyphForCodePoint(codePoint));
    covered.set(codePoint, hit);
  }
  return hit;
}

/** Characters the font lacks said in words (spaced as words) or in glyphs it has. */
const IN_WORDS: Record<string, string> = { '→': 'to', '⟶': 'to', '⇒': 'then', '≥': 'at least', '⩾': 'at least', '≤': 'at most', '⩽': 'at most', '≠': 'not', '✓': 'yes', '✔': 'yes', '✗': 'no', '✘': 'no' };
const IN_GLYPHS: Record<string, string> = { '☐': '[ ]', '□': '[ ]', '☑': '[x]', '☒': '[x]', '⚠': '!', '≈': '~', '←': '<-', '↔': '<->' };

/**
 * Text as the PDF can print it with Noto Sans: a character the font has no glyph for (it would print as an empty
 * box) becomes words or glyphs it has (`→` to "to", `≥` to "at least", `☐` to "[ ]"), a space if it is one, else its
 * letter without the accent, else "?".
 */
export function printable(text: string): string {
  const chars = Array.from(text);
  let out = '';
  chars.forEach((ch, i) => {
    if (drawable(ch.codePointAt(0)!)) {
      out += ch;
      return;
    }
    const word = IN_WORDS[ch];
    if (word) {
      const next = chars[i + 1] ?? '';
      out += `${out === '' || /[\s([]$/.test(out) ? '' : ' '}${word}${next === '' || /[\s).,;:\]]/.test(next) ? '' : ' '}`;
      return;
    }
    const glyphs = IN_GLYPHS[ch] ?? (/\s/.test(ch) ? ' ' : ch.normalize('NFKD').replace(/\p{M}/gu, ''));
    out += glyphs !== '' && Array.from(glyphs).every((c) => drawable(c.codePointAt(0)!)) ? glyphs : '?';
  });
  return out;
}

// ---- times: local, with the zone named ---------------------------------------------------------------------------

/** The zone's short name at an instant ("CST", "MDT"), else its IANA name. */
function zoneName(at: Date, timeZone: string): string {
  try {
    const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' }).formatToParts(at).find((p) => p.type === 'timeZoneName')?.value;
    return name && !/^GMT[+-]/.test(name) ? name : timeZone;
  } catch {
    return timeZone;
  }
}

/** `2026-12-12 07:14 CST`: an instant in a zone, named; UTC when no zone is known. */
function zoned(iso: string, timeZone: string | undefined): string {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return iso;
  if (timeZone) {
    try {
      const p = Object.fromEntries(
        new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).formatToParts(at).map((x) => [x.type, x.value]),
      );
      return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute} ${zoneName(at, timeZone)}`;
    } catch {
      // an unknown zone: UTC below
    }
  }
  return `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/** `07:12 to 17:40 CST` (each end's zone named when a clock change falls inside). */
function windowText(iv: { start: string; end: string; startLocal: string; endLocal: string }, timeZone: string): string {
  const a = zoneName(new Date(iv.start), timeZone);
  const b = zoneName(new Date(iv.end), timeZone);
  return a === b ? `${iv.startLocal} to ${iv.endLocal} ${a}` : `${iv.startLocal} ${a} to ${iv.endLocal} ${b}`;
}

/** A state's zone: its travel days' zone, else that of its first route segment. */
function zoneOf(s: RunSheetDto, code: string | null): string | undefined {
  if (!code) return undefined;
  return s.travel.find((t) => t.jurisdiction === code)?.days[0]?.timeZone ?? s.move.route.find((r) => r.jurisdiction === code)?.timeZone;
}

// ---- layout: nothing starts where it cannot finish ---------------------------------------------------------------

const bottomOf = (doc: Doc): number => doc.page.height - doc.page.margins.bottom;
const widthOf = (doc: Doc): number => doc.page.width - doc.page.margins.left - doc.page.margins.right;
/** A heading's height: the space before it, the 12 pt title and the rule under it. */
const HEADING_H = 32;
/** One 9 pt line. */
const LINE_H = 13;

/** A new page unless `height` fits in what is left of this one. */
function keepRoom(doc: Doc, height: number): void {
  if (doc.y + height > bottomOf(doc)) doc.addPage();
}

/** A heading, kept on one page with the `keepWith` points that follow it (its first line by default). */
function heading(doc: Doc, text: string, keepWith = LINE_H): void {
  keepRoom(doc, HEADING_H + keepWith);
  doc.moveDown(0.6).font('bold').fontSize(12).fillColor(SLATE).text(printable(text), doc.page.margins.left);
  doc.moveTo(doc.page.margins.left, doc.y + 1).lineTo(doc.page.width - doc.page.margins.right, doc.y + 1).strokeColor(AMBER).lineWidth(1).stroke();
  doc.moveDown(0.3).font('regular').fontSize(9).fillColor('black');
}

/** One entry, on a new page when it would not fit whole on this one. */
function line(doc: Doc, text: string, color = 'black'): void {
  const t = printable(text);
  doc.font('regular').fontSize(9);
  keepRoom(doc, doc.heightOfString(t, { width: widthOf(doc) }));
  doc.fillColor(color).text(t, doc.page.margins.left, doc.y, { width: widthOf(doc) });
}

// ---- the load diagram --------------------------------------------------------------------------------------------

const DIAGRAM_W = 360;
const DIAGRAM_H = 115;

function sideCaption(s: RunSheetDto): string {
  const d = s.dimensions;
  return printable(
    `side view from the trailer front · overall length ${formatFeetInches(d.lengthIn)} · width ${formatFeetInches(d.widthIn)} · front overhang ${formatFeetInches(d.frontOverhangIn)} · rear overhang ${formatFeetInches(d.rearOverhangIn)}`,
  );
}
const REAR_CAPTION = 'rear view: flags red squares, lamps dots';

/** The drawing and its captions, in points from the current position: what must fit on the page before drawing. */
function diagramHeight(doc: Doc, s: RunSheetDto): number {
  doc.font('regular').fontSize(8);
  const side = doc.heightOfString(sideCaption(s), { width: DIAGRAM_W + 60 });
  doc.fontSize(7);
  const rear = doc.heightOfString(REAR_CAPTION, { width: 120 });
  doc.fontSize(9);
  return 6 + DIAGRAM_H + 6 + Math.max(side, rear) + 6;
}

/** Side and rear views of the load on the deck, to scale, with the overall height and the flags and lamps marked. */
function diagram(doc: Doc, s: RunSheetDto): void {
  const height = diagramHeight(doc, s);
  keepRoom(doc, height);
  const start = doc.y;
  const dims = s.dimensions;
  const left = doc.page.margins.left;
  const top = start + 6;
  const width = DIAGRAM_W;
  const extent = Math.max(dims.lengthIn, ...s.move.articles.map((a) => a.positionFromTrailerFrontIn + a.lengthIn), 1);
  const scale = Math.min(width / extent, (DIAGRAM_H - 5) / Math.max(dims.heightIn, 1));
  const ground = top + DIAGRAM_H;
  doc.moveTo(left, ground).lineTo(left + width, ground).strokeColor(GREY).lineWidth(0.5).stroke();
  s.move.articles.forEach((a, i) => {
    const deck = dims.articles[i]?.deckHeightIn ?? 36;
    const x = left + Math.max(0, a.positionFromTrailerFrontIn) * scale;
    // the deck under the article, then dunnage and the article itself
    doc.rect(x - 6, ground - deck * scale, a.lengthIn * scale + 12, 3).fill(GREY);
    const bottom = ground - (deck + (a.dunnageIn ?? 0)) * scale;
    const h = a.heightIn * scale;
    doc.rect(x, bottom - h, a.lengthIn * scale, h).fillAndStroke('#fde68a', SLATE);
    doc.font('regular').fontSize(7).fillColor(SLATE).text(printable(a.id), x + 2, bottom - h + 2, { lineBreak: false });
  });
  const hTop = ground - dims.heightIn * scale;
  doc.moveTo(left + width + 8, ground).lineTo(left + width + 8, hTop).strokeColor(AMBER).lineWidth(1).stroke();
  doc.font('bold').fontSize(8).fillColor(AMBER).text(formatFeetInches(dims.heightIn), left + width + 11, (ground + hTop) / 2 - 4, { lineBreak: false });
  doc.font('regular').fontSize(8).fillColor(SLATE).text(sideCaption(s), left, ground + 6, { width: width + 60 });
  // rear view: the load's width, flags at its extremities, lamps low at the corners
  const rx = left + width + 70;
  const rs = 90 / Math.max(dims.widthIn, 102);
  const rw = dims.widthIn * rs;
  const rh = dims.heightIn * rs;
  doc.rect(rx, ground - rh, rw, rh).strokeColor(SLATE).lineWidth(0.8).stroke();
  if (s.markings.sideFlags || s.markings.rearFlags > 0 || s.markings.flags.length) {
    doc.rect(rx - 4, ground - rh, 6, 6).fill('#dc2626');
    doc.rect(rx + rw - 2, ground - rh, 6, 6).fill('#dc2626');
  }
  if (s.markings.lamps.length) {
    const color = s.markings.lamps.some((l) => l.color === 'red') ? '#dc2626' : '#f59e0b';
    doc.circle(rx + 4, ground - 8, 2.5).fill(color);
    doc.circle(rx + rw - 4, ground - 8, 2.5).fill(color);
  }
  doc.font('regular').fontSize(7).fillColor(GREY).text(REAR_CAPTION, rx - 10, ground + 6, { width: 120 });
  doc.font('regular').fontSize(9).fillColor('black');
  doc.x = left;
  doc.y = start + height;
}

// ---- markings ----------------------------------------------------------------------------------------------------

/** One item at one place: where, the states asking it when not all, what, and every rule with its source. */
function markingText(l: MarkingLine): string {
  const where = l.where.charAt(0).toUpperCase() + l.where.slice(1);
  const rules = l.rules.map((r) => `${r.reason ? `${r.reason} ` : ''}${r.asks ? `(asks ${r.asks}) ` : ''}${r.onlyIn ? `[${r.onlyIn}] ` : ''}(${r.source})`).join('; ');
  return `${where}${l.onlyIn ? ` [${l.onlyIn} only]` : ''}: ${l.what} — ${rules}`;
}

// ---- the document ------------------------------------------------------------------------------------------------

/** The printable run sheet: route, windows, permits with their numbers, escorts, the diagram, markings, securement, weights. */
export function renderRunSheetPdf(s: RunSheetDto): Doc {
  const doc = new PDFDocument({ size: 'LETTER', margin: 40, info: { Title: `Run sheet ${s.move.reference}`, Author: 'Amberline' } });
  doc.registerFont('regular', FONT_REGULAR);
  doc.registerFont('bold', FONT_BOLD);
  const m = s.move;
  const originZone = zoneOf(s, s.travel[0]?.jurisdiction ?? null) ?? m.route.slice().sort((a, b) => a.order - b.order)[0]?.timeZone;
  doc.font('bold').fontSize(18).fillColor(SLATE).text(printable(`Run sheet ${m.reference}`));
  doc.font('regular').fontSize(10).fillColor('black').text(printable(`${m.customer} · ${m.commodity}`));
  doc.text(printable(`${m.origin} to ${m.destination} · departs ${m.requestedDeparture} · ${m.travelDays} day(s) · driver ${m.driver?.name ?? 'not assigned'}`));
  doc.text(printable(`Tractor ${m.tractor.unitNumber} · trailer ${m.trailer.unitNumber} (${m.trailer.type.replace(/_/g, ' ')}) · sheet ${s.fingerprint.slice(0, 12)} · generated ${zoned(s.generatedAt, originZone)}`));
  doc.moveDown(0.4);
  const boxTop = doc.y;
  doc.font('regular').fontSize(8.5).fillColor('#7c2d12');
  for (const c of s.cautions) doc.text(printable(`• ${c}`), { indent: 6 });
  doc.rect(doc.page.margins.left - 4, boxTop - 4, doc.page.width - 72, doc.y - boxTop + 8).strokeColor(AMBER).lineWidth(1).stroke();

  heading(doc, 'Route');
  for (const seg of m.route) line(doc, `${seg.order}. ${seg.jurisdiction} — ${seg.roads} — ${seg.miles} mi — ${seg.roadType}${seg.urban ? ' (urban)' : ''}${seg.place ? ` — near ${seg.place}` : ''}`);

  if (s.openQuestions.length) {
    heading(doc, 'Not on file — check the permit');
    for (const q of s.openQuestions) line(doc, `[not on file] ${q.message}`, '#92400e');
  }

  heading(doc, 'Travel windows (local time)');
  if (s.earliestDeparture) {
    line(doc, `Earliest legal departure: ${zoned(s.earliestDeparture, originZone)}${s.travel[0] ? ` (${s.travel[0].name})` : ''}${s.earliestDepartureKnown ? '' : ' [not on file: travel rules of the first state — check the permit]'}`);
  } else {
    line(doc, 'No legal travel window on the planned dates: call your dispatcher before leaving.', '#b91c1c');
  }
  for (const j of s.travel) {
    for (const d of j.days) {
      const spans = (d.intervals.map((iv) => windowText(iv, d.timeZone)).join(', ') || 'no travel') + (d.known ? '' : ` [not on file: ${d.unknownTopics.join(', ')} — check the permit]`);
      const why = d.restrictions.map((r) => r.message).join('; ');
      line(doc, `${j.jurisdiction} ${d.date}: ${spans}${why ? ` — ${why}` : ''}`);
    }
  }

  heading(doc, 'Permits');
  if (!s.permits.length) line(doc, 'No permits on record for this move.', GREY);
  for (const p of s.permits) {
    const tz = zoneOf(s, p.jurisdiction);
    line(doc, `${p.jurisdiction}: permit ${p.number ?? '(no number yet)'} — ${p.status} — valid ${p.validFrom ? zoned(p.validFrom, tz) : '?'} to ${p.validTo ? zoned(p.validTo, tz) : '?'}`);
    for (const c of p.conditions) line(doc, `   · ${c}`, GREY);
    if (p.warning) line(doc, `   ! ${p.warning}`, '#b91c1c');
  }

  heading(doc, 'Escorts');
  if (!s.escorts.length) line(doc, 'No escorts booked for this move.', GREY);
  for (const e of s.escorts) {
    const tz = zoneOf(s, e.jurisdiction) ?? originZone;
    const at = e.meetingTime ? ` ${e.meetingTime} local time${tz ? ` (${zoneName(new Date(`${m.requestedDeparture}T12:00:00Z`), tz)})` : ''}` : '';
    line(doc, `${e.position}${e.jurisdiction ? ` (${e.jurisdiction})` : ''}: ${e.status} — ${[e.vendor, e.operator, e.phone].filter(Boolean).join(' ')}${e.meetingPoint ? ` — meet at ${e.meetingPoint}` : ''}${at}`);
  }

  // the heading, the drawing and its captions on one page
  heading(doc, 'Load diagram and overall dimensions', diagramHeight(doc, s));
  diagram(doc, s);
  line(doc, `Check against (${s.checkAgainst.source === 'permit' ? 'permitted' : 'planned'}): height ${formatFeetInches(s.checkAgainst.heightIn)}, width ${formatFeetInches(s.checkAgainst.widthIn)}, length ${formatFeetInches(s.checkAgainst.lengthIn)}`);

  heading(doc, 'Flags, signs and lamps');
  const marks = markingLines(s.markings);
  if (s.markings.jurisdictions && s.markings.jurisdictions.length > 1) line(doc, `Asked in every state of the move (${s.markings.jurisdictions.join(', ')}) unless a state is named.`, GREY);
  for (const l of marks) line(doc, markingText(l));
  if (!marks.length) line(doc, 'No flags, signs or lamps are asked for on this load by the rules on file.', GREY);

  heading(doc, 'Securement');
  for (const sc of s.securement) {
    line(doc, `${sc.articleId}: ${sc.count} tiedowns planned, ${sc.requiredCount} required; aggregate WLL ${formatPounds(sc.aggregateLb)} against ${formatPounds(sc.requiredAggregateLb)} required — ${sc.ok ? 'meets the rule' : 'FALLS SHORT'}`, sc.ok ? 'black' : '#b91c1c');
    for (const f of sc.findings) line(doc, `   · ${f}`, GREY);
  }

  heading(doc, 'Planned axle-group weights');
  line(doc, `Steer ${formatPounds(s.axles.steerLb)} · drive ${formatPounds(s.axles.driveLb)} · trailer ${formatPounds(s.axles.trailerLb)} · gross ${formatPounds(s.axles.grossLb)}${s.axles.sliderSettingFt !== null ? ` · sliding axle ${s.axles.sliderSettingFt} ft behind the kingpin` : ''}`);
  for (const v of s.axles.federal.violations) line(doc, `   · over the federal limit: ${v.message} — the permit's limits apply`, '#b91c1c');

  heading(doc, 'Departure checks', LINE_H * 2);
  const c = s.latestChecks;
  if (c) line(doc, `Last checks ${zoned(c.submittedAt, originZone)} by ${c.driver.name}: ${c.outcome} — height ${formatFeetInches(c.measuredHeightIn)}, width ${formatFeetInches(c.measuredWidthIn)}, length ${formatFeetInches(c.measuredLengthIn)}`);
  else line(doc, '[ ] height   [ ] width   [ ] length   [ ] axle pins locked   [ ] tires   [ ] flags, signs, lamps   [ ] permits on board   gauge: ____ psi');
  line(doc, s.acknowledgement ? `Acknowledged ${zoned(s.acknowledgement.at, originZone)}${s.acknowledgement.current ? '' : ' — for an earlier version: acknowledge again'}` : 'Not yet acknowledged.');
  return doc;
}
