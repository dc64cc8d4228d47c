import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import mysql from 'mysql2/promise';
import { afterAll, beforeAll, expect, test } from 'vitest';
import { createBackup, rowCounts, sha256 } from '../../apps/api/src/backup/backup';
import { restoreBackup } from '../../apps/api/src/backup/restore';
import { applyMigrations } from '../../apps/api/src/db/migrate';
import { createSite, createUser } from '../support/factories';
import { startTestApp, unique, type TestApp } from '../support/test-app';

// A backup of a database and bucket of their own, restored into an empty database and an empty
// bucket: every table's row count and every object's checksum must come back the same.
const suffix = `${process.pid}_${Date.now().toString(36)}`;
const sourceDb = `varden_backup_src_${suffix}`;
const targetDb = `varden_backup_dst_${suffix}`;
let admin: mysql.Connection;
let source: TestApp;
let target: TestApp;
let dir: string;

const urlFor = (database: string) => {
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = `/${database}`;
  return url.toString();
};

beforeAll(async () => {
  const url = new URL(process.env.DATABASE_URL!);
  admin = await mysql.createConnection({ host: url.hostname, port: Number(url.port), user: url.username, password: decodeURIComponent(url.password) });
  await admin.query(`CREATE DATABASE \`${sourceDb}\``);
  await admin.query(`CREATE DATABASE \`${targetDb}\``);
  source = await startTestApp({ DATABASE_URL: urlFor(sourceDb), S3_BUCKET: `src-${suffix}`.replace(/_/g, '-').toLowerCase() });
  target = await startTestApp({ DATABASE_URL: urlFor(targetDb), S3_BUCKET: `dst-${suffix}`.replace(/_/g, '-').toLowerCase() });
  await source.ctx.store.ensureBucket();
  await applyMigrations(source.ctx.db);
  dir = await mkdtemp(path.join(os.tmpdir(), 'varden-backup-'));
}, 120_000);

afterAll(async () => {
  await source?.close();
  await target?.close();
  await admin?.query(`DROP DATABASE IF EXISTS \`${sourceDb}\``);
  await admin?.query(`DROP DATABASE IF EXISTS \`${targetDb}\``);
  await admin?.end();
  if (dir) await rm(dir, { recursive: true, force: true });
});

test('a backup restores into an empty database and bucket with equal counts and checksums', async () => {
  await createUser(source.ctx, { roles: ['planner'] });
  await createSite(source.ctx, { name: unique('Backed-up site') });
  const files = [Buffer.from('first photo bytes'), Buffer.from(Array.from({ length: 5000 }, (_, i) => i % 251))];
  await source.ctx.store.put('photos/1/a-display.webp', files[0]!, 'image/webp');
  await source.ctx.store.put('photos/1/a-thumbnail.webp', files[1]!, 'image/webp');

  const manifest = await createBackup(source.ctx, dir);
  expect(manifest.objects.map((o) => o.key).sort()).toEqual(['photos/1/a-display.webp', 'photos/1/a-thumbnail.webp']);
  expect(manifest.database.rowCounts.users).toBeGreaterThanOrEqual(1);
  expect(manifest.database.rowCounts.sites).toBe(1);

  const restored = await restoreBackup(target.ctx, dir);
  expect(restored.rowCounts).toEqual(await rowCounts(source.ctx));
  for (const [key, expected] of [
    ['photos/1/a-display.webp', files[0]!],
    ['photos/1/a-thumbnail.webp', files[1]!],
  ] as const) {
    const { body, contentType } = await target.ctx.store.get(key);
    const chunks: Buffer[] = [];
    for await (const chunk of body) chunks.push(Buffer.from(chunk as Uint8Array));
    expect(sha256(Buffer.concat(chunks))).toBe(sha256(expected));
    expect(contentType).toBe('image/webp');
  }
  // The triggers that lock sealed orders come back with the schema.
  const [triggers] = (await admin.query('SELECT COUNT(*) AS n FROM information_schema.triggers WHERE trigger_schema = ?', [targetDb])) as unknown as [
    Array<{ n: number }>,
  ];
  expect(Number(triggers[0]!.n)).toBe(7);
});

test('a restore into a database that is not empty is refused and changes nothing', async () => {
  const before = await rowCounts(source.ctx);
  await expect(restoreBackup(source.ctx, dir)).rejects.toThrow(/not empty/);
  expect(await rowCounts(source.ctx)).toEqual(before);
});
