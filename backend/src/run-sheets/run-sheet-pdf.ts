import PDFDocument from 'pdfkit';
import { formatFeetInches, formatPounds, type RunSheetDto } from '@amberline/common';

const FONT_REGULAR = require.resolve('@expo-google-fonts/noto-sans/400Regular/NotoSans_400Regular.ttf');
const FONT_BOLD = require.resolve('@expo-google-fonts/noto-sans/700Bold/NotoSans_700Bold.ttf');
const AMBER = '#d97706';
const SLATE = '#1e293b';
const GREY = '#64748b';

type Doc = InstanceType<typeof PDFDocument>;

function heading(doc: Doc, text: string): void {
  if (doc.y > 690) doc.addPage();
  doc.moveDown(0.6).font('bold').fontSize(12).fillColor(SLATE).text(text);
  doc.moveTo(doc.page.margins.left, doc.y + 1).lineTo(doc.page.width - doc.page.margins.right, doc.y + 1).strokeColor(AMBER).lineWidth(1).stroke();
  doc.moveDown(0.3).font('regular').fontSize(9).fillColor('black');
}

function line(doc: Doc, text: string, color = 'black'): void {
  if (doc.y > 740) doc.addPage();
  doc.font('regular').fontSize(9).fillColor(color).text(text);
}

/** Side and rear views of the load on the deck, to scale, with the overall height and the flags and lamps marked. */
function diagram(doc: Doc, s: RunSheetDto): void {
  const dims = s.dimensions;
  const left = doc.page.margins.left;
  const top = doc.y + 6;
  const width = 360;
  const extent = Math.max(dims.lengthIn, ...s.move.articles.map((a) => a.positionFromTrailerFrontIn + a.lengthIn), 1);
  const scale = Math.min(width / extent, 110 / Math.max(dims.heightIn, 1));
  const ground = top + 115;
  doc.moveTo(left, ground).lineTo(left + width, ground).strokeColor(GREY).lineWidth(0.5).stroke();
  s.move.articles.forEach((a, i) => {
    const deck = dims.articles[i]?.deckHeightIn ?? 36;
    const x = left + Math.max(0, a.positionFromTrailerFrontIn) * scale;
    // the deck under the article, then dunnage and the article itself
    doc.rect(x - 6, ground - deck * scale, a.lengthIn * scale + 12, 3).fill(GREY);
    const bottom = ground - (deck + (a.dunnageIn ?? 0)) * scale;
    const h = a.heightIn * scale;
    doc.rect(x, bottom - h, a.lengthIn * scale, h).fillAndStroke('#fde68a', SLATE);
    doc.font('regular').fontSize(7).fillColor(SLATE).text(a.id, x + 2, bottom - h + 2, { lineBreak: false });
  });
  const hTop = ground - dims.heightIn * scale;
  doc.moveTo(left + width + 8, ground).lineTo(left + width + 8, hTop).strokeColor(AMBER).lineWidth(1).stroke();
  doc.font('bold').fontSize(8).fillColor(AMBER).text(formatFeetInches(dims.heightIn), left + width + 11, (ground + hTop) / 2 - 4, { lineBreak: false });
  doc.font('regular').fontSize(8).fillColor(SLATE).text(
    `side view from the trailer front · overall length ${formatFeetInches(dims.lengthIn)} · width ${formatFeetInches(dims.widthIn)} · front overhang ${formatFeetInches(dims.frontOverhangIn)} · rear overhang ${formatFeetInches(dims.rearOverhangIn)}`,
    left, ground + 6, { width: width + 60 },
  );
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
    const color = s.markings.lamps[0].color === 'red' ? '#dc2626' : '#f59e0b';
    doc.circle(rx + 4, ground - 8, 2.5).fill(color);
    doc.circle(rx + rw - 4, ground - 8, 2.5).fill(color);
  }
  doc.font('regular').fontSize(7).fillColor(GREY).text('rear view: flags red squares, lamps dots', rx - 10, ground + 6, { width: 120 });
  doc.y = ground + 30;
  doc.x = left;
}

/** The printable run sheet: route, windows, permits with their numbers, escorts, the diagram, markings, securement, weights. */
export function renderRunSheetPdf(s: RunSheetDto): Doc {
  const doc = new PDFDocument({ size: 'LETTER', margin: 40, info: { Title: `Run sheet ${s.move.reference}`, Author: 'Amberline' } });
  doc.registerFont('regular', FONT_REGULAR);
  doc.registerFont('bold', FONT_BOLD);
  const m = s.move;
  doc.font('bold').fontSize(18).fillColor(SLATE).text(`Run sheet ${m.reference}`);
  doc.font('regular').fontSize(10).fillColor('black').text(`${m.customer} · ${m.commodity}`);
  doc.text(`${m.origin} → ${m.destination} · departs ${m.requestedDeparture} · ${m.travelDays} day(s) · driver ${m.driver?.name ?? 'not assigned'}`);
  doc.text(`Tractor ${m.tractor.unitNumber} · trailer ${m.trailer.unitNumber} (${m.trailer.type.replace(/_/g, ' ')}) · sheet ${s.fingerprint.slice(0, 12)} · generated ${s.generatedAt.slice(0, 16).replace('T', ' ')} UTC`);
  doc.moveDown(0.4);
  const boxTop = doc.y;
  doc.font('regular').fontSize(8.5).fillColor('#7c2d12');
  for (const c of s.cautions) doc.text(`• ${c}`, { indent: 6 });
  doc.rect(doc.page.margins.left - 4, boxTop - 4, doc.page.width - 72, doc.y - boxTop + 8).strokeColor(AMBER).lineWidth(1).stroke();

  heading(doc, 'Route');
  for (const seg of m.route) line(doc, `${seg.order}. ${seg.jurisdiction} — ${seg.roads} — ${seg.miles} mi — ${seg.roadType}${seg.urban ? ' (urban)' : ''}${seg.place ? ` — near ${seg.place}` : ''}`);

  if (s.openQuestions.length) {
    heading(doc, 'Not on file — check the permit');
    for (const q of s.openQuestions) line(doc, `[not on file] ${q.message}`, '#92400e');
  }

  heading(doc, 'Travel windows (local time)');
  if (s.earliestDeparture) line(doc, `Earliest legal departure: ${s.earliestDeparture.replace('T', ' ').slice(0, 16)} UTC`);
  for (const j of s.travel) {
    for (const d of j.days) {
      const spans = (d.intervals.map((iv) => `${iv.startLocal}–${iv.endLocal}`).join(', ') || 'no travel') + (d.known ? '' : ` [not on file: ${d.unknownTopics.join(', ')} — check the permit]`);
      const why = d.restrictions.map((r) => r.message).join('; ');
      line(doc, `${j.jurisdiction} ${d.date}: ${spans}${why ? ` — ${why}` : ''}`);
    }
  }

  heading(doc, 'Permits');
  if (!s.permits.length) line(doc, 'No permits on record for this move.', GREY);
  for (const p of s.permits) {
    line(doc, `${p.jurisdiction}: permit ${p.number ?? '(no number yet)'} — ${p.status} — valid ${p.validFrom ?? '?'} to ${p.validTo ?? '?'}`);
    for (const c of p.conditions) line(doc, `   · ${c}`, GREY);
    if (p.warning) line(doc, `   ! ${p.warning}`, '#b91c1c');
  }

  heading(doc, 'Escorts');
  if (!s.escorts.length) line(doc, 'No escorts booked for this move.', GREY);
  for (const e of s.escorts) line(doc, `${e.position}${e.jurisdiction ? ` (${e.jurisdiction})` : ''}: ${e.status} — ${e.vendor ?? ''} ${e.operator ?? ''} ${e.phone ?? ''}${e.meetingPoint ? ` — meet at ${e.meetingPoint}` : ''}${e.meetingTime ? ` ${e.meetingTime}` : ''}`);

  heading(doc, 'Load diagram and overall dimensions');
  diagram(doc, s);
  line(doc, `Check against (${s.checkAgainst.source === 'permit' ? 'permitted' : 'planned'}): height ${formatFeetInches(s.checkAgainst.heightIn)}, width ${formatFeetInches(s.checkAgainst.widthIn)}, length ${formatFeetInches(s.checkAgainst.lengthIn)}`);

  heading(doc, 'Flags, signs and lamps');
  for (const f of s.markings.flags) line(doc, `Flag: ${f.position} — ${f.minSquareIn} in square, ${f.colors} — ${f.reason} (${f.source})`);
  for (const sg of s.markings.signs) line(doc, `Sign "${sg.text}": ${sg.position} — at least ${formatFeetInches(sg.minWidthIn)} × ${sg.minHeightIn} in, ${sg.letterHeightIn} in letters, ${sg.colors} (${sg.source})`);
  for (const l of s.markings.lamps) line(doc, `Lamps: ${l.count} ${l.color} at ${l.position}${l.visibleFt ? `, visible ${l.visibleFt} ft` : ''} — ${l.reason} (${l.source})`);
  if (!s.markings.flags.length && !s.markings.signs.length && !s.markings.lamps.length) line(doc, 'No projecting-load flags, signs or lamps required by the rules on file.', GREY);

  heading(doc, 'Securement');
  for (const sc of s.securement) {
    line(doc, `${sc.articleId}: ${sc.count} tiedowns planned, ${sc.requiredCount} required; aggregate WLL ${formatPounds(sc.aggregateLb)} against ${formatPounds(sc.requiredAggregateLb)} required — ${sc.ok ? 'meets the rule' : 'FALLS SHORT'}`, sc.ok ? 'black' : '#b91c1c');
    for (const f of sc.findings) line(doc, `   · ${f}`, GREY);
  }

  heading(doc, 'Planned axle-group weights');
  line(doc, `Steer ${formatPounds(s.axles.steerLb)} · drive ${formatPounds(s.axles.driveLb)} · trailer ${formatPounds(s.axles.trailerLb)} · gross ${formatPounds(s.axles.grossLb)}${s.axles.sliderSettingFt !== null ? ` · sliding axle ${s.axles.sliderSettingFt} ft behind the kingpin` : ''}`);
  for (const v of s.axles.federal.violations) line(doc, `   · over the federal limit: ${v.message} — the permit's limits apply`, '#b91c1c');

  heading(doc, 'Departure checks');
  const c = s.latestChecks;
  if (c) line(doc, `Last checks ${c.submittedAt.slice(0, 16).replace('T', ' ')} UTC by ${c.driver.name}: ${c.outcome} — height ${formatFeetInches(c.measuredHeightIn)}, width ${formatFeetInches(c.measuredWidthIn)}, length ${formatFeetInches(c.measuredLengthIn)}`);
  else line(doc, '☐ height   ☐ width   ☐ length   ☐ axle pins locked   ☐ tires   ☐ flags, signs, lamps   ☐ permits on board   gauge: ____ psi');
  line(doc, s.acknowledgement ? `Acknowledged ${s.acknowledgement.at.slice(0, 16).replace('T', ' ')} UTC${s.acknowledgement.current ? '' : ' — for an earlier version: acknowledge again'}` : 'Not yet acknowledged.');
  return doc;
}
