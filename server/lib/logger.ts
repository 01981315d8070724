import pino, { type Logger } from 'pino';

export type { Logger };

/** JSON lines with UTC timestamps; user input lands in fields, never in the message, so it cannot forge a line. */
export function createLogger(level: pino.LevelWithSilent = 'info', destination?: pino.DestinationStream): Logger {
  const options: pino.LoggerOptions = {
    level,
    timestamp: pino.stdTimeFunctions.isoTime,
    redact: {
      paths: [
        'req.headers.cookie',
        'req.headers["x-csrf-token"]',
        'req.headers.authorization',
        'res.headers["set-cookie"]',
        '*.accessToken',
        '*.token',
      ],
      censor: '[redacted]',
    },
  };
  return destination ? pino(options, destination) : pino(options);
}

// OAuth codes, state and tokens travel in query strings (the callback, the authorize page's redirect);
// they are credentials for a few minutes and never belong in a log line.
const secretParams = new Set(['code', 'state', 'token', 'access_token', 'refresh_token', 'client_secret']);
const secretInQuery = /([?&](?:code|state|token|access_token|refresh_token|client_secret)=)[^&#]*/gi;

export const scrubUrl = (url: string) => url.replace(secretInQuery, '$1[redacted]');

type SerializedReq = { url?: unknown; query?: unknown };
type SerializedRes = { headers?: Record<string, unknown> };

/** pino-http's request and response serializers, applied after its standard ones. */
export const httpLogSerializers = {
  req(req: SerializedReq) {
    if (typeof req.url === 'string') req.url = scrubUrl(req.url);
    if (req.query && typeof req.query === 'object') {
      req.query = Object.fromEntries(
        Object.entries(req.query).map(([k, v]) => [k, secretParams.has(k.toLowerCase()) ? '[redacted]' : v]),
      );
    }
    return req;
  },
  res(res: SerializedRes) {
    const location = res.headers?.location;
    if (typeof location === 'string') res.headers = { ...res.headers, location: scrubUrl(location) };
    return res;
  },
};
