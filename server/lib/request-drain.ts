import type { Server, ServerResponse } from 'node:http';

/**
 * Keeps count of the requests in flight on a server, so that stopping can let them finish: `drain(ms)`
 * stops accepting connections, closes idle keep-alive ones, asks busy ones to close after their answer,
 * waits until no request is left or `ms` have passed, then cuts whatever remains. Resolves with how
 * many requests were cut off.
 */
export function trackRequests(server: Server) {
  const inFlight = new Set<ServerResponse>();
  let draining = false;
  let idle: (() => void) | null = null;

  server.on('request', (_req, res: ServerResponse) => {
    inFlight.add(res);
    if (draining && !res.headersSent) res.setHeader('Connection', 'close');
    res.once('close', () => {
      inFlight.delete(res);
      if (inFlight.size === 0) idle?.();
    });
  });

  return {
    get inFlight() {
      return inFlight.size;
    },
    async drain(ms: number): Promise<number> {
      draining = true;
      server.close();
      for (const res of inFlight) if (!res.headersSent) res.setHeader('Connection', 'close');
      server.closeIdleConnections();
      if (inFlight.size > 0) {
        await new Promise<void>((resolve) => {
          idle = resolve;
          setTimeout(resolve, ms).unref();
        });
      }
      const cut = inFlight.size;
      server.closeAllConnections();
      return cut;
    },
  };
}
