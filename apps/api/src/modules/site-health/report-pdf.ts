import type { SiteHealth } from '@varden/schemas';
import PDFDocument from 'pdfkit';

type Band = 'healthy' | 'watch' | 'replace' | 'remeasure';
const bandColour: Record<Band, string> = { healthy: '#1f7a6d', watch: '#8a6100', replace: '#a33a2c', remeasure: '#6b46a8' };

/** The condition glyph drawn as a shape (never colour alone): circle, triangle, square, diamond. */
function glyph(doc: PDFKit.PDFDocument, band: Band, x: number, y: number, size = 7): void {
  const h = size / 2;
  doc.save().fillColor(bandColour[band]);
  if (band === 'healthy') doc.circle(x + h, y + h, h).fill();
  else if (band === 'watch') doc.polygon([x + h, y], [x + size, y + size], [x, y + size]).fill();
  else if (band === 'replace') doc.rect(x, y, size, size).fill();
  else doc.polygon([x + h, y], [x + size, y + h], [x + h, y + size], [x, y + h]).fill();
  doc.restore();
}

const f = (n: number | null, digits = 1) => (n === null ? '—' : n.toFixed(digits));

/** The site health report as a PDF: the same figures as the page, for filing and mailing. */
export function siteHealthPdf(health: SiteHealth, generatedAt: Date): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: 48, info: { Title: `${health.siteName}: site health`, Author: 'Varden' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  doc.fontSize(18).text(`${health.siteName}`, { continued: false });
  doc.fontSize(10).fillColor('#555').text(`Site health report · ${health.voltageV} V ${health.frequencyHz} Hz · generated ${generatedAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`);
  doc.text(health.newestReadingAt ? `From each unit's latest reading; the newest taken ${health.newestReadingAt.slice(0, 10)}.` : 'No reading recorded yet: every unit counts at its nameplate kvar.');
  doc.moveDown().fillColor('#000').fontSize(12);
  doc.text(`Installed correction: ${f(health.installedKvar)} kvar`);
  doc.text(`Effective correction: ${f(health.effectiveKvar)} kvar`);
  doc.text(`Lost: ${f(health.lostKvar)} kvar (${f(health.lostPct)} %)`);
  if (health.reachedPf !== null) {
    doc.text(`Power factor reached at the load: ${f(health.reachedPf, 3)}${health.leading ? ' (leading: over-corrected)' : ''}; target ${f(health.targetPf, 2)}`);
    doc.text(`Missing to reach the target: ${f(health.missingKvar)} kvar`);
  } else {
    doc.text('No load is recorded for this site: the power factor reached is not known.');
  }
  if (health.load) doc.fontSize(9).fillColor('#555').text(health.load.note).fillColor('#000').fontSize(12);
  if (health.cost) {
    doc.moveDown(0.5).text(`Estimated cost of the lost correction: ${health.cost.currency} ${health.cost.lostMonthlyCost.toFixed(2)} per month (estimate)`);
    doc.fontSize(9).fillColor('#555');
    for (const a of health.cost.assumptions) doc.text(`· ${a}`);
    doc.fillColor('#000').fontSize(12);
  }

  doc.moveDown().fontSize(13).text('Units by condition');
  doc.fontSize(11);
  for (const band of ['replace', 'watch', 'remeasure', 'healthy'] as const) {
    const y = doc.y + 2;
    glyph(doc, band, doc.page.margins.left, y);
    doc.text(`${health.bands[band]} ${band}`, doc.page.margins.left + 14, doc.y);
    doc.x = doc.page.margins.left;
  }
  doc.text(`${health.bands.noReading} without a reading yet`);

  for (const bank of health.banks) {
    doc.moveDown().fontSize(13).text(`${bank.name}${bank.detuned ? ` (detuned ${f((bank.detuningFactor ?? 0) * 100)} %)` : ''}`);
    doc.fontSize(10);
    for (const step of bank.steps) {
      const tuning = step.tuning
        ? ` · tuned ${f(step.tuning.tuningHz)} Hz (design ${f(step.tuning.designTuningHz)} Hz, 5th at ${step.tuning.fifthHarmonicHz} Hz)`
        : '';
      doc.text(`Step ${step.number}: ${f(step.effectiveKvar)} of ${f(step.installedKvar)} kvar${tuning}`);
      for (const r of step.reasons) doc.fillColor('#555').text(`   ${r}`).fillColor('#000');
    }
    const warned = bank.resonance.filter((r) => r.warning);
    if (warned.length) {
      const steps = (numbers: number[]) => (numbers.length === 1 ? `step ${numbers[0]}` : `steps ${numbers[0]}–${numbers[numbers.length - 1]}`);
      doc.text(
        `Resonance with the supply near a harmonic: ${warned.map((r) => `${steps(r.stepNumbers)} in, ${f(r.kvar, 0)} kvar → h ${f(r.order, 2)} (${r.nearestHarmonic}th)`).join('; ')}`,
      );
    }
  }

  doc.moveDown().fontSize(13).text(`Open flags (${health.openFlags.length})`);
  doc.fontSize(10);
  if (health.openFlags.length === 0) doc.text('None: every finding of this site is cleared.');
  for (const flag of health.openFlags) {
    doc.text(`${flag.severity === 'action' ? 'Action' : 'Advisory'} · ${flag.kind.replace(/-/g, ' ')} · ${flag.bankName} · raised ${flag.raisedAt.slice(0, 10)}${flag.state === 'in-hand' ? ` · in hand${flag.correctiveOrderId ? `, order #${flag.correctiveOrderId}` : ''}` : ''}`);
    doc.fillColor('#555').text(`   ${flag.message}`).fillColor('#000');
  }
  if (health.overdueOrders.length > 0) {
    doc.moveDown().fontSize(13).text(`Overdue orders (${health.overdueOrders.length})`);
    doc.fontSize(10);
    for (const order of health.overdueOrders) doc.text(`#${order.id} ${order.title} · due ${order.dueOn} · ${order.state.replace(/-/g, ' ')}`);
  }
  doc.moveDown().fontSize(8).fillColor('#555').text(
    'Capacitors hold charge after isolation. Any work on a bank follows the site’s safety rules, its arc-flash assessment, local codes and licensed practice.',
  );
  doc.end();
  return done;
}
