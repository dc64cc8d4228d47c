// The production API as a child process for the benchmarks: its own port, the bench services'
// environment, and its memory read from /proc so a part can report the process's peak.
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import path from 'node:path';

export const repoRoot = path.resolve(import.meta.dirname, '..', '..', '..');

export interface ApiProcess {
  url: string;
  pid: number;
  /** Peak resident memory of the process so far (VmHWM), in MB. */
  peakRssMB: () => number;
  /** Current resident memory (VmRSS), in MB. */
  rssMB: () => number;
  stop: () => Promise<void>;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

function statusFieldMB(pid: number, field: 'VmHWM' | 'VmRSS'): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const match = status.match(new RegExp(`^${field}:\\s+(\\d+) kB`, 'm'));
  return match ? Number(match[1]) / 1024 : Number.NaN;
}

/** Extra Node flags for the API process, e.g. BENCH_API_NODE_FLAGS="--cpu-prof --cpu-prof-dir=/tmp/prof" to profile it. */
const nodeFlags = () => (process.env.BENCH_API_NODE_FLAGS ?? '').split(' ').filter(Boolean);

/**
 * Starts apps/api/src/server.ts with NODE_ENV=production and the environment the bench
 * orchestrator passed down (DATABASE_URL, S3_*, SMTP_URL, WEB_DIST_DIR), and waits for
 * GET /api/health. Jobs are off so that nothing but the load runs.
 */
export async function startApiProcess(extraEnv: Record<string, string> = {}): Promise<ApiProcess> {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const child: ChildProcess = spawn(process.execPath, [...nodeFlags(), '--import', 'tsx', 'apps/api/src/server.ts'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      APP_ORIGIN: url,
      JOBS_ENABLED: 'false',
      LOG_LEVEL: process.env.BENCH_API_LOG_LEVEL ?? 'warn',
      BENCH_ROUTES: 'true',
      ...extraEnv,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`the API exited with code ${child.exitCode} before it answered`);
    try {
      const res = await fetch(`${url}/api/health`);
      if (res.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error('the API did not answer GET /api/health within 60 s');
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  const pid = child.pid!;
  return {
    url,
    pid,
    peakRssMB: () => statusFieldMB(pid, 'VmHWM'),
    rssMB: () => statusFieldMB(pid, 'VmRSS'),
    stop: async () => {
      if (child.exitCode === null) child.kill('SIGTERM');
      await exited;
    },
  };
}

/** Signs in through the API and returns the session cookie ("name=value") for later requests. */
export async function signIn(url: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${url}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: url, 'x-forwarded-for': `10.99.${Math.floor(Math.random() * 250)}.${Math.floor(Math.random() * 250)}` },
    body: JSON.stringify({ email, password }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`);
  const cookie = res.headers.getSetCookie().map((c) => c.split(';')[0]).find(Boolean);
  if (!cookie) throw new Error(`sign-in as ${email} set no cookie`);
  return cookie;
}
