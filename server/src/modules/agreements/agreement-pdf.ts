// The agreement as a PDF (pdfkit), set in Work Sans from the bundled font files.
import PDFDocument from 'pdfkit';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { DateTime } from 'luxon';
import type { AgreementDto } from '../../../../shared/schemas/agreements.js';
import { agreementStateSet, amendmentTermSet } from '../../../../shared/labels/agreements.js';
import { cropSet } from '../../../../shared/labels/crops.js';
import { labelOf } from '../../../../shared/labels/label-set.js';

const require = createRequire(import.meta.url);
const fontDir = join(dirname(require.resolve('@fontsource/work-sans/package.json')), 'files');
const fonts = { regular: join(fontDir, 'work-sans-latin-400-normal.woff'), bold: join(fontDir, 'work-sans-latin-600-normal.woff') };

const money = (cents: number, currency: string) => new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(cents / 100);

export function agreementPdf(a: AgreementDto, timeZone: string): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'LETTER', margin: 56, info: { Title: `Pollination agreement: ${a.requestTitle}`, Author: 'Pollenpact' } });
  doc.registerFont('body', fonts.regular);
  doc.registerFont('bold', fonts.bold);
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });
  const day = (value: string) => DateTime.fromISO(value, { zone: timeZone }).toFormat('d LLL yyyy, HH:mm ZZZZ');
  const confirmation = (c: { byName: string | null; at: string | null }) => (c.at ? `${c.byName ?? 'a member'}, ${day(c.at)}` : 'not yet confirmed');

  doc.font('bold').fontSize(18).text('Pollination agreement');
  doc.font('body').fontSize(10).fillColor('#555').text(`${a.requestTitle} · version ${a.version} · ${labelOf(agreementStateSet, a.state)} · times in ${timeZone}`).fillColor('#000').moveDown();
  doc.font('bold').fontSize(12).text('Parties');
  doc.font('body').fontSize(10).text(`Grower: ${a.farmName}`).text(`Beekeeper: ${a.apiaryName}`).moveDown();
  doc.font('bold').fontSize(12).text('Terms');
  doc.font('body').fontSize(10)
    .text(`Blocks: ${a.blocks.map((b) => `${b.name} (${labelOf(cropSet, b.crop)})`).join(', ')}`)
    .text(`Colonies: ${a.colonies}, at least ${a.minFramesOfBees} frames of bees on average${a.minFramesOfBrood != null ? ` and ${a.minFramesOfBrood} frames of brood` : ''}`)
    .text(`On site: ${day(a.expectedOnSite.from)} to ${day(a.expectedOnSite.to)}`)
    .text(`Fee: ${money(a.pricePerColonyCents, a.currency)} per colony`)
    .text(`Spray notice: ${a.noticeHours} hours · notice before removal: ${a.removalNoticeHours} hours`)
    .moveDown();
  a.clauses.forEach((clause, i) => {
    doc.font('bold').fontSize(11).text(`${i + 1}. ${clause.title}`);
    doc.font('body').fontSize(10).text(clause.text, { align: 'left' }).moveDown(0.5);
  });
  doc.moveDown();
  doc.font('bold').fontSize(12).text('Confirmations');
  doc.font('body').fontSize(10).text(`Grower: ${confirmation(a.farmConfirmation)}`).text(`Beekeeper: ${confirmation(a.apiaryConfirmation)}`);
  const accepted = a.amendments.filter((m) => m.state === 'accepted');
  if (accepted.length) {
    doc.moveDown().font('bold').fontSize(12).text('Changes agreed since');
    for (const m of accepted) doc.font('body').fontSize(10).text(`Version ${m.versionAfter}: ${m.reason} (${Object.keys(m.changes).map((k) => labelOf(amendmentTermSet, k).toLowerCase()).join(', ')}) — ${m.decidedAt ? day(m.decidedAt) : ''}`);
  }
  doc.end();
  return done;
}
