import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { AppContext } from '../context';
import { rowCounts, sha256, type BackupManifest } from './backup';
import { loadDatabase } from './database-dump';

/**
 * Restores a backup made by createBackup into the database and bucket of `ctx`, which must be
 * empty (no tables, no objects); checks every checksum first and the row counts afterwards.
 */
export async function restoreBackup(ctx: AppContext, dir: string): Promise<{ rowCounts: Record<string, number>; objects: number }> {
  const manifest = JSON.parse(await readFile(path.join(dir, 'manifest.json'), 'utf8')) as BackupManifest;
  const dump = path.join(dir, manifest.database.file);
  if (sha256(await readFile(dump)) !== manifest.database.sha256) throw new Error('The database dump does not match its checksum.');
  const files = await Promise.all(
    manifest.objects.map(async (o) => {
      const data = await readFile(path.join(dir, o.file));
      if (sha256(data) !== o.sha256) throw new Error(`Object ${o.key} does not match its checksum.`);
      return { ...o, data };
    }),
  );
  if (Object.keys(await rowCounts(ctx)).length > 0) throw new Error('The target database is not empty; restore only into an empty database.');

  await loadDatabase(ctx.config.DATABASE_URL, dump);
  await ctx.store.ensureBucket();
  for (const o of files) await ctx.store.put(o.key, o.data, o.contentType);

  const restored = await rowCounts(ctx);
  for (const [table, n] of Object.entries(manifest.database.rowCounts)) {
    if (restored[table] !== n) throw new Error(`Table ${table} has ${restored[table] ?? 0} rows after the restore, the backup had ${n}.`);
  }
  return { rowCounts: restored, objects: files.length };
}
