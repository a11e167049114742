// The invoice as a PDF (pdfkit), set in Work Sans from the installed @fontsource files so
// it looks like the app. Dates in the billing business's time zone, money with Intl.
import PDFDocument from 'pdfkit';
import { createRequire } from 'node:module';
import { DateTime } from 'luxon';
import type { InvoiceDto } from '../../../../shared/schemas/invoices.js';
import { formatMoney } from '../../../../shared/domain/money.js';
import { invoiceTotals } from '../../../../shared/domain/invoice-totals.js';

const require = createRequire(import.meta.url);
const fonts = {
  regular: require.resolve('@fontsource/work-sans/files/work-sans-latin-400-normal.woff'),
  bold: require.resolve('@fontsource/work-sans/files/work-sans-latin-600-normal.woff'),
};

const statusWords: Record<InvoiceDto['status'], string> = {
  draft: 'DRAFT — not yet issued', issued: 'Issued', 'partly-paid': 'Partly paid', paid: 'Paid', overdue: 'Overdue', void: 'VOID',
};

function day(iso: string | null, zone: string, fallback: string) {
  return iso ? DateTime.fromISO(iso, { zone }).toLocaleString(DateTime.DATE_MED, { locale: 'en-US' }) : fallback;
}

export function renderInvoicePdf(invoice: InvoiceDto, balanceDueDays?: number): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const doc = new PDFDocument({ size: 'LETTER', margin: 54, info: { Title: `Invoice ${invoice.number ?? '(draft)'}`, Author: invoice.apiary.name } });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont('WorkSans', fonts.regular);
    doc.registerFont('WorkSans-SemiBold', fonts.bold);
    const money = (cents: number) => formatMoney(cents, invoice.currency);
    const zone = invoice.timeZone;

    doc.font('WorkSans-SemiBold').fontSize(22).text(`Invoice ${invoice.number ?? '(draft)'}`);
    doc.font('WorkSans').fontSize(11).fillColor('#444').text(statusWords[invoice.status]);
    doc.moveDown();
    doc.fillColor('#000').font('WorkSans-SemiBold').text('From', { continued: true }).font('WorkSans').text(`  ${invoice.apiary.name}`);
    doc.font('WorkSans-SemiBold').text('To', { continued: true }).font('WorkSans').text(`  ${invoice.farm.name}`);
    doc.text(`Pollination season ${invoice.season}`);
    if (invoice.issuedAt) doc.text(`Issued ${DateTime.fromISO(invoice.issuedAt, { zone }).toLocaleString(DateTime.DATE_MED, { locale: 'en-US' })}`);
    doc.moveDown();

    const columns = { description: 54, quantity: 340, unit: 400, amount: 480 };
    const header = doc.y;
    doc.font('WorkSans-SemiBold').fontSize(10);
    doc.text('Description', columns.description, header).text('Qty', columns.quantity, header).text('Unit', columns.unit, header).text('Amount', columns.amount, header);
    doc.font('WorkSans');
    for (const line of invoice.lines) {
      const y = doc.y + 6;
      doc.text(line.description, columns.description, y, { width: 280 });
      const after = doc.y;
      doc.text(String(line.quantity), columns.quantity, y).text(money(line.unitCents), columns.unit, y).text(money(line.amountCents), columns.amount, y);
      doc.y = Math.max(after, doc.y);
    }
    doc.moveDown();
    doc.fontSize(11);
    for (const { label, cents, strong } of invoiceTotals(invoice)) {
      const y = doc.y + 2;
      doc.font(strong ? 'WorkSans-SemiBold' : 'WorkSans').text(label, columns.unit - 140, y, { width: 200, lineBreak: false }).text(money(cents), columns.amount, y);
    }
    doc.moveDown(2);
    doc.font('WorkSans-SemiBold').text('Payment terms', columns.description);
    doc.font('WorkSans').fontSize(10);
    doc.text(`Deposit ${money(invoice.depositCents)} due ${day(invoice.depositDueOn, zone, 'at delivery')}.`);
    doc.text(`Balance ${money(invoice.netTotalCents - invoice.depositCents)} due ${day(invoice.balanceDueOn, zone, `${balanceDueDays ?? 'the agreed number of'} days after pickup`)}.`);
    doc.text(`Late interest as agreed: ${invoice.lateInterestBpPerMonth / 100}% per started month on amounts overdue (simple interest).`);
    if (invoice.accruedInterestCents > 0) doc.text(`Late interest accrued to date: ${money(invoice.accruedInterestCents)}.`);
    if (invoice.notes) doc.moveDown().text(invoice.notes);
    doc.end();
  });
}
