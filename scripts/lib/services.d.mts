// Types for the parts of services.mjs that TypeScript tests import.
export function freePort(): Promise<number>;
export function startStandaloneMariaDb(options: { dataDir: string; port: number; database?: string }): Promise<{
  url: string;
  stop(): Promise<void>;
  restart(): Promise<void>;
}>;
