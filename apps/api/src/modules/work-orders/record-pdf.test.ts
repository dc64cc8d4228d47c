import { describe, expect, test } from 'vitest';
import { pdfText, renderSignedRecord, type SignedRecord } from './record-pdf';

const record = (over: Partial<SignedRecord> = {}): SignedRecord => ({
  orderId: 7,
  kind: 'inspection',
  title: 'Half-yearly inspection',
  siteName: 'Test site',
  siteAddress: '1 Quay',
  bankName: 'Bank A',
  bankLocation: 'Switchroom',
  dueOn: '2026-06-01',
  createdAt: new Date('2026-05-10T08:00:00Z'),
  submittedAt: new Date('2026-05-30T12:00:00Z'),
  assigneeName: 'A Technician',
  units: (['healthy', 'watch', 'replace', 'remeasure', null] as const).map((band, i) => ({
    label: `1.${i + 1}`,
    serial: `SN-${i}`,
    method: 'Pairs, third open',
    legsUF: [331.6, 331.5, 331.4],
    kvarAtRated: 49.9,
    nameplateKvar: 50,
    deviationPct: -0.2,
    band,
  })),
  otherReadings: [{ label: 'Fuses (step 1)', text: 'continuity ok / ok / ok' }],
  flags: [{ kind: 'watch', severity: 'advisory', message: 'Leg 2-3 −5.2 % ≥ limit', state: 'open' }],
  safety: { acknowledgedAt: new Date('2026-05-30T08:00:00Z'), acknowledgedByName: 'A Technician', dischargeWaitS: 180 },
  photos: [{ caption: 'Missing image', image: null }],
  signature: { signedByName: 'A Supervisor', signedAt: new Date('2026-06-01T10:00:00Z'), meaning: 'Reviewed.' },
  engineeringVersions: ['1.0.0'],
  generatedAt: new Date('2026-06-02T10:00:00Z'),
  ...over,
});

describe('the signed record PDF', () => {
  test('renders every band, a missing photo and many rows across pages', async () => {
    const many = Array.from({ length: 80 }, (_, i) => ({ ...record().units[0]!, label: `${i}.1` }));
    for (const r of [record(), record({ units: many, photos: [] })]) {
      const pdf = await renderSignedRecord(r);
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    }
  });

  test('spells out what the built-in fonts cannot show', () => {
    expect(pdfText('−5.2 % ≥ 1.08, 10 Ω, µF, 55 °C — ok')).toBe('-5.2 % >= 1.08, 10 ohm, µF, 55 °C — ok');
    expect(pdfText('漢')).toBe('?');
  });
});
