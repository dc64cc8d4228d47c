import { pino, type DestinationStream, type Logger } from 'pino';
import type { Config } from './config';

export type { Logger };

/** The API's logger: JSON lines on stdout, or on `destination` (a test reads what it writes). */
export function createLogger(config: Pick<Config, 'LOG_LEVEL'>, destination?: DestinationStream): Logger {
  const options = {
    level: config.LOG_LEVEL,
    base: { service: 'varden-api' },
    redact: { paths: ['req.headers.cookie', 'req.headers.authorization', 'password', '*.password'], remove: true },
  };
  return destination ? pino(options, destination) : pino(options);
}
