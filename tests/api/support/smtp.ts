import net from 'node:net';
import { SMTPServer } from 'smtp-server';

export type ReceivedMail = { messageId: string; to: string[]; subject: string; raw: string };

export type TestSmtp = {
  port: number;
  received: ReceivedMail[];
  close: () => Promise<void>;
};

type Options = {
  /** listen here (a port a test kept free while "the mail server was down"); any free port by default */
  port?: number;
  /** answer end-of-data only after this long (a slow server) */
  dataDelayMs?: number;
  /** called as soon as a message's data starts arriving */
  onDataStart?: () => void;
  /** refuse every recipient with this 5xx answer */
  rejectRecipients?: string;
};

const header = (raw: string, name: string) =>
  new RegExp(`^${name}:\\s*(.+)$`, 'im').exec(raw.split(/\r?\n\r?\n/)[0])?.[1].trim() ?? '';

/** A real SMTP server (the `smtp-server` package) on loopback that keeps what it receives. */
export async function startSmtp(options: Options = {}): Promise<TestSmtp> {
  const received: ReceivedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onRcptTo(_address, _session, callback) {
      if (!options.rejectRecipients) return callback();
      const err = new Error(options.rejectRecipients) as Error & { responseCode: number };
      err.responseCode = 550;
      callback(err);
    },
    onData(stream, session, callback) {
      options.onDataStart?.();
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const raw = Buffer.concat(chunks).toString('utf8');
        const done = () => {
          received.push({
            messageId: header(raw, 'Message-ID'),
            to: session.envelope.rcptTo.map((r) => r.address),
            subject: header(raw, 'Subject'),
            raw,
          });
          callback();
        };
        if (options.dataDelayMs) setTimeout(done, options.dataDelayMs);
        else done();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, '127.0.0.1', () => resolve());
  });
  const port = (server.server.address() as net.AddressInfo).port;
  return { port, received, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** A "mail server" that accepts the connection and then never says a word. */
export async function startStalledSmtp(): Promise<{ port: number; connections: () => number; close: () => Promise<void> }> {
  const sockets = new Set<net.Socket>();
  let count = 0;
  const server = net.createServer((socket) => {
    count++;
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
    socket.on('error', () => undefined);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  return {
    port: (server.address() as net.AddressInfo).port,
    connections: () => count,
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
