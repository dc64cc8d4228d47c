import { createHash } from 'node:crypto';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import type { AppContext } from '../context';
import { dumpDatabase } from './database-dump';

export interface BackupManifest {
  createdAt: string;
  database: { file: string; sha256: string; rowCounts: Record<string, number> };
  objects: Array<{ key: string; file: string; sha256: string; bytes: number; contentType: string }>;
}

export const sha256 = (data: Buffer) => createHash('sha256').update(data).digest('hex');

/** Row counts of every base table, for the manifest and for checking a restore. */
export async function rowCounts(ctx: AppContext): Promise<Record<string, number>> {
  const [tables] = (await ctx.db.execute(
    sql`SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name`,
  )) as unknown as [Array<{ name: string }>];
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    const [rows] = (await ctx.db.execute(sql.raw(`SELECT COUNT(*) AS n FROM \`${name.replace(/`/g, '')}\``))) as unknown as [Array<{ n: number }>];
    counts[name] = Number(rows[0]!.n);
  }
  return counts;
}

/**
 * Writes a consistent database dump and every stored object into `dir`, with a manifest of row
 * counts and SHA-256 checksums that `restoreBackup` verifies.
 */
export async function createBackup(ctx: AppContext, dir: string): Promise<BackupManifest> {
  await mkdir(path.join(dir, 'objects'), { recursive: true });
  const dumpFile = path.join(dir, 'database.sql');
  const counts = await rowCounts(ctx);
  await dumpDatabase(ctx.config.DATABASE_URL, dumpFile);
  const objects: BackupManifest['objects'] = [];
  for (const [i, key] of (await ctx.store.list()).entries()) {
    const { body, contentType } = await ctx.store.get(key);
    const chunks: Buffer[] = [];
    for await (const chunk of body) chunks.push(Buffer.from(chunk as Uint8Array));
    const data = Buffer.concat(chunks);
    const file = path.join('objects', `${String(i).padStart(6, '0')}.bin`);
    await writeFile(path.join(dir, file), data);
    objects.push({ key, file, sha256: sha256(data), bytes: data.length, contentType: contentType ?? 'application/octet-stream' });
  }
  const manifest: BackupManifest = {
    createdAt: new Date().toISOString(),
    database: { file: 'database.sql', sha256: sha256(await readFile(dumpFile)), rowCounts: counts },
    objects,
  };
  await writeFile(path.join(dir, 'manifest.json'), JSON.stringify(manifest, null, 2));
  return manifest;
}
