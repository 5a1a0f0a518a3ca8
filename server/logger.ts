import pino, { type Logger } from 'pino';

/** The server's one logger; JSON lines on stdout, level from LOG_LEVEL. */
export function createLogger(level: string): Logger {
  return pino({ level, redact: ['req.headers.authorization', 'req.headers.cookie'] });
}
