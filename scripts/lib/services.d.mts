// Types for the parts of services.mjs that TypeScript tests import.
export function freePort(): Promise<number>;
export function startStandaloneMariaDb(options: { dataDir: string; port: number; database?: string }): Promise<{
  url: string;
  stop(): Promise<void>;
  restart(): Promise<void>;
}>;
export function startStandaloneS3(options: { dataDir: string; port: number; bucket?: string }): Promise<{
  endpoint: string;
  bucket: string;
  stop(): Promise<void>;
  restart(): Promise<void>;
}>;
export function startStandaloneMail(options: { smtpPort: number; webPort: number }): Promise<{
  smtpUrl: string;
  webUrl: string;
  stop(): Promise<void>;
  restart(): Promise<void>;
}>;
