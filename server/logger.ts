import { pino, type Logger } from 'pino';

export function createLogger(level: string): Logger {
  return pino({ level, redact: ['req.headers.cookie', 'res.headers["set-cookie"]'] });
}
