import pino, { type Logger } from 'pino';

export type { Logger };

/** JSON lines with UTC timestamps; user input lands in fields, never in the message, so it cannot forge a line. */
export function createLogger(level: pino.LevelWithSilent = 'info'): Logger {
  return pino({
    level,
    timestamp: pino.stdTimeFunctions.isoTime,
    redact: {
      paths: ['req.headers.cookie', 'req.headers["x-csrf-token"]', 'req.headers.authorization', 'res.headers["set-cookie"]', '*.accessToken', '*.token'],
      censor: '[redacted]',
    },
  });
}
