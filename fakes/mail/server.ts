// Local mail catcher: an SMTP server that accepts everything and delivers nowhere, plus a web view and a
// JSON API of what it caught. Started by `npm start` and by the API/browser tests (see
// docs/decisions/004-mail-catcher.md for why it is built from smtp-server + mailparser in-process).
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject, type ParsedMail } from 'mailparser';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { extractLinks } from './links';
import { createMailStore, DEFAULT_MAX_MESSAGES, type CaughtMail, type MailStore } from './store';
import { createWebHandler } from './web';

export type { CaughtMail } from './store';

export type MailCatcher = {
  smtpPort: number;
  webPort: number;
  webUrl: string;
  close(): Promise<void>;
  /** Newest first, the same order as `GET /api/messages`. */
  messages(): CaughtMail[];
  clear(): void;
};

export type MailCatcherOptions = {
  /** 0 picks a free port. */
  smtpPort?: number;
  /** 0 picks a free port. */
  webPort?: number;
  /** Loopback by default: the catcher has no auth and must not be reachable from the network. */
  host?: string;
  /** Oldest messages are dropped beyond this many. */
  maxMessages?: number;
  /** Largest message accepted, in bytes; bigger ones get SMTP 552. */
  maxMessageBytes?: number;
};

/** 10 MB: far above any mail the app sends (it links to files, never attaches stems). */
export const DEFAULT_MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

/** An error whose responseCode smtp-server sends to the client as the SMTP reply code. */
function smtpError(responseCode: number, message: string): Error & { responseCode: number } {
  return Object.assign(new Error(message), { responseCode });
}

function addressesOf(field: AddressObject | AddressObject[] | undefined): string[] {
  const objects = field === undefined ? [] : Array.isArray(field) ? field : [field];
  // Groups ("Team: a@x, b@y;") carry their members one level down.
  return objects
    .flatMap((object) => object.value)
    .flatMap((entry) => (entry.group ? entry.group : [entry]))
    .map((entry) => entry.address ?? '')
    .filter((address) => address !== '');
}

function envelopeRecipients(session: SMTPServerSession): string[] {
  return session.envelope.rcptTo.map((recipient) => recipient.address);
}

function envelopeSender(session: SMTPServerSession): string {
  const from = session.envelope.mailFrom;
  return from ? from.address : '';
}

/** Turns a parsed message and its SMTP session into what the store keeps. */
export function toCaughtMail(parsed: ParsedMail, session: SMTPServerSession, size: number, receivedAt: Date): Omit<CaughtMail, 'id'> {
  const envelopeTo = envelopeRecipients(session);
  const headerTo = addressesOf(parsed.to);
  const html = typeof parsed.html === 'string' ? parsed.html : null;
  const text = typeof parsed.text === 'string' ? parsed.text : null;
  return {
    from: addressesOf(parsed.from)[0] ?? envelopeSender(session),
    to: headerTo.length > 0 ? headerTo : envelopeTo,
    cc: addressesOf(parsed.cc),
    envelopeTo,
    subject: parsed.subject ?? '',
    date: receivedAt.toISOString(),
    sentDate: parsed.date && !Number.isNaN(parsed.date.getTime()) ? parsed.date.toISOString() : null,
    messageId: parsed.messageId ?? null,
    text,
    html,
    links: extractLinks(html, text),
    size,
  };
}

/** Reads the DATA stream whole; memory is bounded because smtp-server stops counting us in at `size`. */
function readMessage(stream: SMTPServerDataStream): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let kept = 0;
    stream.on('data', (chunk: Buffer) => {
      // Past the limit the message is refused anyway; stop buffering so an endless DATA cannot fill memory.
      if (stream.sizeExceeded) return;
      chunks.push(chunk);
      kept += chunk.length;
    });
    stream.on('end', () => resolve(Buffer.concat(chunks, kept)));
    stream.on('error', reject);
  });
}

function createSmtpServer(store: MailStore, maxMessageBytes: number): SMTPServer {
  const server = new SMTPServer({
    name: 'kitlane-mail-catcher',
    banner: 'Kitlane local mail catcher, nothing leaves this machine',
    // No TLS at all: STARTTLS disabled means smtp-server never loads its published test certificate.
    secure: false,
    disabledCommands: ['STARTTLS'],
    // Accept mail without AUTH, and accept any credentials from clients configured with some.
    authOptional: true,
    allowInsecureAuth: true,
    onAuth: (auth, _session, callback) => callback(null, { user: auth.username ?? 'anonymous' }),
    size: maxMessageBytes,
    rejectOversized: true,
    logger: false,
    // A test run closes the catcher while pooled clients may still be connected: do not wait long.
    closeTimeout: 1000,
    onData(stream, session, callback) {
      readMessage(stream)
        .then(async (raw) => {
          if (stream.sizeExceeded) {
            callback(smtpError(552, `Message exceeds the catcher's limit of ${maxMessageBytes} bytes`));
            return;
          }
          const parsed = await simpleParser(raw);
          store.add(toCaughtMail(parsed, session, raw.length, new Date()));
          callback(null, 'Caught; nothing leaves this machine');
        })
        .catch((error: unknown) => {
          const reason = error instanceof Error ? error.message : String(error);
          callback(smtpError(451, `Could not read the message: ${reason}`));
        });
    },
  });
  // Clients dropping the connection mid-session (ECONNRESET) are routine for a catcher: the session is
  // simply gone, there is nothing to report or recover.
  server.on('error', () => {});
  return server;
}

function listen(server: { listen: (port: number, host: string, cb: () => void) => unknown; once: (event: 'error', cb: (error: Error) => void) => unknown }, port: number, host: string): Promise<void> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => resolve());
  });
}

function portOf(server: http.Server | SMTPServer['server']): number {
  return (server.address() as AddressInfo).port;
}

function closeSmtp(server: SMTPServer): Promise<void> {
  return new Promise((resolve) => {
    server.close(() => resolve());
    // Say goodbye to idle pooled clients now rather than after closeTimeout.
    for (const connection of server.connections) {
      connection.send(421, 'Mail catcher shutting down');
      connection.close();
    }
  });
}

function closeWeb(server: http.Server): Promise<void> {
  return new Promise((resolve, reject) => {
    server.close((error) => (error ? reject(error) : resolve()));
    // Browsers keep connections alive; without this close() would wait for them to time out.
    server.closeAllConnections();
  });
}

export async function startMailCatcher(opts: MailCatcherOptions = {}): Promise<MailCatcher> {
  const host = opts.host ?? '127.0.0.1';
  const store = createMailStore(opts.maxMessages ?? DEFAULT_MAX_MESSAGES);
  const smtp = createSmtpServer(store, opts.maxMessageBytes ?? DEFAULT_MAX_MESSAGE_BYTES);
  const web = http.createServer(createWebHandler(store));

  await listen(smtp.server, opts.smtpPort ?? 1025, host);
  try {
    await listen(web, opts.webPort ?? 1080, host);
  } catch (error) {
    await closeSmtp(smtp);
    throw error;
  }

  const webPort = portOf(web);
  const urlHost = host.includes(':') ? `[${host}]` : host;
  let closing: Promise<void> | undefined;
  return {
    smtpPort: portOf(smtp.server),
    webPort,
    webUrl: `http://${urlHost}:${webPort}`,
    close() {
      // Idempotent, so a test's afterAll and a signal handler may both call it.
      closing ??= Promise.all([closeSmtp(smtp), closeWeb(web)]).then(() => undefined);
      return closing;
    },
    messages: () => store.list(),
    clear: () => {
      store.clear();
    },
  };
}
