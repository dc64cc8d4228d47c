import type { Readable } from 'node:stream';
import PDFDocument from 'pdfkit';
import sharp from 'sharp';

/**
 * The signed record of a sealed work order as a PDF (A4): header, each unit's results with its
 * condition glyph, the other readings, the flags, the safety acknowledgement, photo thumbnails
 * and the signature block. Drawn with pdfkit's built-in Helvetica, so it needs no font files.
 */

export type BandName = 'healthy' | 'watch' | 'replace' | 'remeasure';

export interface RecordUnitRow {
  label: string;
  serial: string;
  method: string;
  legsUF: number[] | null;
  kvarAtRated: number | null;
  nameplateKvar: number;
  deviationPct: number | null;
  band: BandName | null;
}

export interface SignedRecord {
  orderId: number;
  kind: string;
  title: string;
  siteName: string;
  siteAddress: string;
  bankName: string;
  bankLocation: string;
  dueOn: string;
  createdAt: Date;
  submittedAt: Date | null;
  assigneeName: string | null;
  units: RecordUnitRow[];
  otherReadings: Array<{ label: string; text: string }>;
  flags: Array<{ kind: string; severity: string; message: string; state: string }>;
  safety: { acknowledgedAt: Date | null; acknowledgedByName: string | null; dischargeWaitS: number };
  photos: Array<{ caption: string; image: Buffer | null }>;
  signature: { signedByName: string; signedAt: Date; meaning: string };
  engineeringVersions: string[];
  generatedAt: Date;
}

// The condition colours of the light theme (tailwind.config.ts), always drawn with shape and word.
const bandColour: Record<BandName, string> = { healthy: '#17706A', watch: '#8A5A00', replace: '#A83A26', remeasure: '#6E43A6' };
const ink = '#1C2A38';
const muted = '#4B5867';
const rule = '#DDD6C8';
const copper = '#9C4A1A';

// Characters outside WinAnsi (the encoding of the built-in fonts) in their plain spelling.
const spelled: Record<string, string> = { '−': '-', '≥': '>=', '≤': '<=', 'Ω': 'ohm', 'φ': 'phi', 'Δ': 'delta', '≈': '~', '√': 'sqrt', '→': '->' };
const winAnsiExtras = new Set('€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ');

/** Text the built-in fonts can show: known symbols spelled out, anything else outside WinAnsi as '?'. */
export function pdfText(text: string): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0) ?? 0;
    if (code === 0x0a || (code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff) || winAnsiExtras.has(ch)) out += ch;
    else out += spelled[ch] ?? '?';
  }
  return out;
}

const fmt = (v: number | null, digits: number) => (v === null ? '–' : v.toFixed(digits));
const when = (d: Date | null) => (d ? `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC` : '–');

/** pdfkit embeds JPEG and PNG; anything else (a WebP thumbnail, say) is converted first. */
async function embeddable(image: Buffer): Promise<Buffer | null> {
  const jpeg = image[0] === 0xff && image[1] === 0xd8;
  const png = image[0] === 0x89 && image[1] === 0x50;
  if (jpeg || png) return image;
  try {
    return await sharp(image, { limitInputPixels: 4096 * 4096 }).jpeg({ quality: 80 }).toBuffer();
  } catch {
    return null;
  }
}

export async function readAll(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(typeof chunk === 'string' ? Buffer.from(chunk) : (chunk as Buffer));
  return Buffer.concat(chunks);
}

function glyph(doc: PDFKit.PDFDocument, band: BandName, x: number, y: number, size = 8): void {
  const h = size / 2;
  doc.save();
  doc.fillColor(bandColour[band]);
  if (band === 'healthy') doc.circle(x + h, y + h, h).fill();
  else if (band === 'watch') doc.polygon([x + h, y], [x + size, y + size], [x, y + size]).fill();
  else if (band === 'replace') doc.rect(x, y, size, size).fill();
  else doc.polygon([x + h, y], [x + size, y + h], [x + h, y + size], [x, y + h]).fill();
  doc.restore();
}

export async function renderSignedRecord(record: SignedRecord): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: 48,
    info: {
      Title: pdfText(`Work order ${record.orderId}: signed record`),
      Author: 'Varden',
      Subject: pdfText(`${record.siteName}, ${record.bankName}`),
      CreationDate: record.generatedAt,
    },
  });
  const done = new Promise<Buffer>((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const left = doc.page.margins.left;
  const width = doc.page.width - left - doc.page.margins.right;
  const bottom = () => doc.page.height - doc.page.margins.bottom - 24;
  const room = (h: number) => {
    if (doc.y + h > bottom()) doc.addPage();
  };
  const heading = (text: string) => {
    room(40);
    doc.moveDown(0.8);
    doc.font('Helvetica-Bold').fontSize(12).fillColor(ink).text(pdfText(text), left, doc.y);
    const y = doc.y + 2;
    doc.moveTo(left, y).lineTo(left + width, y).lineWidth(0.5).strokeColor(rule).stroke();
    doc.y = y + 6;
  };
  const line = (label: string, value: string) => {
    room(16);
    const y = doc.y;
    doc.font('Helvetica').fontSize(9).fillColor(muted).text(pdfText(label), left, y, { width: 130 });
    doc.font('Helvetica').fontSize(9).fillColor(ink).text(pdfText(value), left + 135, y, { width: width - 135 });
    doc.y = Math.max(doc.y, y + 13);
  };

  // Header.
  doc.font('Helvetica-Bold').fontSize(20).fillColor(copper).text('Varden', left, doc.y);
  doc.font('Helvetica').fontSize(10).fillColor(muted).text('Signed maintenance record of a capacitor bank');
  doc.moveDown(0.6);
  doc.font('Helvetica-Bold').fontSize(14).fillColor(ink).text(pdfText(`Work order ${record.orderId}: ${record.title}`), { width });
  doc.moveDown(0.4);
  line('Site', [record.siteName, record.siteAddress].filter(Boolean).join(', '));
  line('Bank', [record.bankName, record.bankLocation].filter(Boolean).join(', '));
  line('Kind', record.kind);
  line('Due on', record.dueOn);
  line('Created', when(record.createdAt));
  line('Submitted', when(record.submittedAt));
  line('Technician', record.assigneeName ?? '–');

  // Capacitor units.
  heading('Capacitor units');
  const cols = [
    { title: 'Unit', w: 44 },
    { title: 'Serial', w: 74 },
    { title: 'Method', w: 92 },
    { title: 'Legs (µF)', w: 110 },
    { title: 'kvar at rated', w: 60 },
    { title: 'Deviation', w: 50 },
    { title: 'Band', w: width - 430 },
  ];
  const tableHeader = () => {
    room(30);
    let x = left;
    const y = doc.y;
    doc.font('Helvetica-Bold').fontSize(8).fillColor(muted);
    for (const c of cols) {
      doc.text(pdfText(c.title), x, y, { width: c.w - 4, lineBreak: false });
      x += c.w;
    }
    doc.y = y + 13;
  };
  if (record.units.length === 0) {
    doc.font('Helvetica').fontSize(9).fillColor(muted).text('No capacitor unit was measured on this order.', left, doc.y);
  } else {
    tableHeader();
    for (const u of record.units) {
      if (doc.y + 16 > bottom()) {
        doc.addPage();
        tableHeader();
      }
      const y = doc.y;
      const cells = [
        u.label,
        u.serial || '–',
        u.method,
        u.legsUF ? u.legsUF.map((v) => v.toFixed(1)).join(' / ') : '–',
        u.kvarAtRated === null ? '–' : `${fmt(u.kvarAtRated, 1)} of ${fmt(u.nameplateKvar, 1)}`,
        u.deviationPct === null ? '–' : `${u.deviationPct > 0 ? '+' : ''}${fmt(u.deviationPct, 1)} %`,
      ];
      let x = left;
      doc.font('Helvetica').fontSize(8).fillColor(ink);
      cells.forEach((text, i) => {
        doc.text(pdfText(text), x, y, { width: cols[i]!.w - 4, height: 10, lineBreak: false, ellipsis: true });
        x += cols[i]!.w;
      });
      if (u.band) {
        glyph(doc, u.band, x, y);
        doc.font('Helvetica-Bold').fontSize(8).fillColor(bandColour[u.band]).text(u.band.toUpperCase(), x + 12, y, { lineBreak: false });
      } else {
        doc.font('Helvetica').fontSize(8).fillColor(muted).text('no result', x, y, { lineBreak: false });
      }
      doc.y = y + 15;
    }
  }

  if (record.otherReadings.length > 0) {
    heading('Other readings');
    for (const r of record.otherReadings) line(r.label, r.text);
  }

  heading('Flags');
  if (record.flags.length === 0) doc.font('Helvetica').fontSize(9).fillColor(muted).text('No flags were raised by this order.', left, doc.y);
  for (const f of record.flags) line(`${f.kind} (${f.severity})`, `${f.message} [${f.state}]`);

  heading('Safety');
  line(
    'Safety card',
    record.safety.acknowledgedAt
      ? `Acknowledged by ${record.safety.acknowledgedByName ?? 'the technician'} at ${when(record.safety.acknowledgedAt)}`
      : 'Not acknowledged',
  );
  line('Discharge wait', `${record.safety.dischargeWaitS} s (longest rated discharge time of the bank's units)`);

  if (record.photos.length > 0) {
    const size = 110;
    const gap = 12;
    room(size + 70); // the heading stays with its first row
    heading('Photos');
    const perRow = Math.max(1, Math.floor((width + gap) / (size + gap)));
    for (let i = 0; i < record.photos.length; i += perRow) {
      room(size + 28);
      const y = doc.y;
      record.photos.slice(i, i + perRow).forEach((p, j) => {
        const x = left + j * (size + gap);
        if (p.image) doc.image(p.image, x, y, { fit: [size, size], align: 'center', valign: 'center' });
        else doc.rect(x, y, size, size).lineWidth(0.5).strokeColor(rule).stroke();
        doc.font('Helvetica').fontSize(7).fillColor(muted).text(pdfText(p.caption || 'Photo'), x, y + size + 3, { width: size, lineBreak: false, ellipsis: true });
      });
      doc.y = y + size + 18;
    }
  }

  // Signature block.
  heading('Signature');
  room(70);
  line('Signed by', record.signature.signedByName);
  line('Signed at', when(record.signature.signedAt));
  line('Meaning', record.signature.meaning);
  doc.moveDown(1);
  doc
    .font('Helvetica')
    .fontSize(7)
    .fillColor(muted)
    .text(
      pdfText(
        `Sealed record: it can no longer change. Results computed by Varden's engineering package ${record.engineeringVersions.join(', ') || '–'}. Generated ${when(record.generatedAt)}.`,
      ),
      left,
      doc.y,
      { width },
    );
  doc.end();
  return done;
}

/** Reads photos through the store and makes them embeddable; a photo that fails stays a blank frame. */
export async function thumbnailsFor(
  store: { get(key: string): Promise<{ body: Readable }> },
  keys: Array<{ caption: string; thumbnailKey: string }>,
): Promise<Array<{ caption: string; image: Buffer | null }>> {
  return Promise.all(
    keys.map(async (k) => {
      try {
        const { body } = await store.get(k.thumbnailKey);
        return { caption: k.caption, image: await embeddable(await readAll(body)) };
      } catch {
        return { caption: k.caption, image: null };
      }
    }),
  );
}
