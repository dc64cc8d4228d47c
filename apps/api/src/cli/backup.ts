import path from 'node:path';
import { createBackup } from '../backup/backup';
import { restoreBackup } from '../backup/restore';
import { loadConfig } from '../config';
import { closeContext, createContext } from '../context';

/** `backup <dir>` or `restore <dir>` against the configured database and bucket. */
const [command, dirArg] = process.argv.slice(2);
if ((command !== 'backup' && command !== 'restore') || !dirArg) {
  console.error('usage: backup <dir> | restore <dir>');
  process.exit(2);
}
const dir = path.resolve(dirArg);
const ctx = createContext(loadConfig());
try {
  if (command === 'backup') {
    const manifest = await createBackup(ctx, dir);
    const rows = Object.values(manifest.database.rowCounts).reduce((a, b) => a + b, 0);
    console.log(`varden: backup written to ${dir}: ${rows} rows in ${Object.keys(manifest.database.rowCounts).length} tables, ${manifest.objects.length} files.`);
  } else {
    const result = await restoreBackup(ctx, dir);
    console.log(`varden: restored ${dir}: ${Object.keys(result.rowCounts).length} tables and ${result.objects} files, every count and checksum matching.`);
  }
} catch (error) {
  console.error(`varden: ${command} failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = 1;
} finally {
  await closeContext(ctx);
}
