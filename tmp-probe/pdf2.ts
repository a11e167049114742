import PDFDocument from 'pdfkit';
import { readFileSync } from 'node:fs';
const reg = readFileSync('node_modules/@fontsource/work-sans/files/work-sans-latin-400-normal.woff');
async function run(useFont: boolean) {
  return new Promise<number>((resolve) => {
    const doc = new PDFDocument();
    const chunks: Buffer[] = [];
    doc.on('data', (c) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks).length));
    if (useFont) { doc.registerFont('W', reg); doc.font('W'); }
    doc.text('Hello invoice 123 $1,234.00');
    doc.end();
  });
}
for (const f of [false, true, true, true]) { console.time(String(f)); await run(f); console.timeEnd(String(f)); }
