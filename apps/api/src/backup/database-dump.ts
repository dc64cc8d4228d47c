import { spawn } from 'node:child_process';
import { createReadStream, createWriteStream } from 'node:fs';
import { pipeline } from 'node:stream/promises';

/** Connection arguments for the MariaDB command-line tools from a mysql:// URL. */
export function clientArgs(databaseUrl: string): { args: string[]; database: string; password: string } {
  const url = new URL(databaseUrl);
  const database = decodeURIComponent(url.pathname.replace(/^\//, ''));
  if (!database) throw new Error('DATABASE_URL names no database.');
  return {
    args: [`--host=${url.hostname}`, `--port=${url.port || '3306'}`, `--user=${decodeURIComponent(url.username)}`],
    database,
    password: decodeURIComponent(url.password),
  };
}

function run(command: string, args: string[], password: string, io: { stdin?: string; stdout?: string }): Promise<void> {
  return new Promise((resolve, reject) => {
    // The password goes through the environment, never the command line (visible in ps); the
    // child inherits this process's environment, which is not a setting read here.
    // eslint-disable-next-line no-restricted-properties
    const child = spawn(command, args, { env: { ...process.env, MYSQL_PWD: password }, stdio: ['pipe', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (c: Buffer) => (stderr += c.toString()));
    child.once('error', reject);
    const done = new Promise<void>((res, rej) =>
      child.once('exit', (code) => (code === 0 ? res() : rej(new Error(`${command} exited with ${code}: ${stderr.trim().slice(0, 500)}`)))),
    );
    const piping: Promise<void>[] = [];
    if (io.stdout) piping.push(pipeline(child.stdout, createWriteStream(io.stdout)));
    else child.stdout.resume();
    if (io.stdin) piping.push(pipeline(createReadStream(io.stdin), child.stdin));
    else child.stdin.end();
    Promise.all([done, ...piping]).then(() => resolve(), reject);
  });
}

/** A consistent dump (one transaction, triggers included) of the database into `file`. */
export async function dumpDatabase(databaseUrl: string, file: string): Promise<void> {
  const { args, database, password } = clientArgs(databaseUrl);
  await run('mariadb-dump', [...args, '--single-transaction', '--triggers', '--routines', '--hex-blob', '--skip-lock-tables', database], password, {
    stdout: file,
  });
}

/** Loads a dump into the (empty) database of `databaseUrl`. */
export async function loadDatabase(databaseUrl: string, file: string): Promise<void> {
  const { args, database, password } = clientArgs(databaseUrl);
  await run('mariadb', [...args, database], password, { stdin: file });
}
