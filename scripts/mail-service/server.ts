import { randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/**
 * The local mail service for development and tests: an SMTP server on loopback that keeps every
 * message it is given (parsed JSON beside the raw .eml) and a small HTTP API to read them back.
 * Nothing is relayed anywhere.
 */

export interface MailServiceOptions {
  /** 0 picks a free port. */
  smtpPort: number;
  /** 0 picks a free port. */
  httpPort: number;
  dataDir: string;
  host?: string;
  /** Largest message accepted, in bytes. */
  maxBytes?: number;
  log?: (line: string) => void;
}

export interface MailService {
  smtpPort: number;
  httpUrl: string;
  dataDir: string;
  close(): Promise<void>;
}

export interface CapturedMessage {
  id: string;
  receivedAt: string;
  /** What the client said in MAIL FROM / RCPT TO. */
  envelope: { from: string | null; to: string[] };
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  messageId: string | null;
  /** A few headers worth checking in tests; not every header. */
  headers: Record<string, string>;
  sizeBytes: number;
}

const DEFAULT_MAX_BYTES = 10 * 1024 * 1024;
const ID_PATTERN = /^[0-9]{13}-[0-9a-f]{8}$/;
const KEPT_HEADERS = ['message-id', 'date', 'x-scribeline-kind', 'x-scribeline-outbox-id', 'list-unsubscribe', 'content-type'];

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

function headerText(value: unknown): string {
  if (typeof value === 'string') return value;
  if (value instanceof Date) return value.toISOString();
  if (value && typeof value === 'object' && 'text' in value && typeof (value as { text: unknown }).text === 'string') return (value as { text: string }).text;
  if (value && typeof value === 'object' && 'value' in value) return String((value as { value: unknown }).value);
  return String(value ?? '');
}

// Ids sort by arrival: a millisecond timestamp then random hex against ties.
function newId(): string {
  return `${Date.now().toString().padStart(13, '0')}-${randomBytes(4).toString('hex')}`;
}

async function readMessages(dataDir: string): Promise<CapturedMessage[]> {
  let names: string[];
  try {
    names = await readdir(dataDir);
  } catch {
    return [];
  }
  const out: CapturedMessage[] = [];
  for (const name of names) {
    if (!name.endsWith('.json')) continue;
    try {
      out.push(JSON.parse(await readFile(path.join(dataDir, name), 'utf8')) as CapturedMessage);
    } catch {
      // A file being written right now, or not ours: skip it.
    }
  }
  return out.sort((a, b) => (a.id < b.id ? 1 : a.id > b.id ? -1 : 0));
}

function sendJson(res: ServerResponse, status: number, body: unknown): void {
  const text = JSON.stringify(body);
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'content-length': Buffer.byteLength(text), 'cache-control': 'no-store' });
  res.end(text);
}

async function handleHttp(dataDir: string, req: IncomingMessage, res: ServerResponse): Promise<void> {
  const url = new URL(req.url ?? '/', 'http://127.0.0.1');
  const parts = url.pathname.split('/').filter(Boolean);
  if (parts.length === 1 && parts[0] === 'health' && req.method === 'GET') return sendJson(res, 200, { ok: true });
  if (parts[0] !== 'messages') return sendJson(res, 404, { error: 'not_found', message: 'Try GET /messages.' });

  if (parts.length === 1) {
    if (req.method === 'GET') {
      let messages = await readMessages(dataDir);
      const to = url.searchParams.get('to')?.toLowerCase();
      if (to) messages = messages.filter((m) => m.envelope.to.some((r) => r.toLowerCase() === to));
      return sendJson(res, 200, { messages });
    }
    if (req.method === 'DELETE') {
      const names = await readdir(dataDir).catch(() => [] as string[]);
      await Promise.all(names.filter((n) => n.endsWith('.json') || n.endsWith('.eml')).map((n) => rm(path.join(dataDir, n), { force: true })));
      res.writeHead(204).end();
      return;
    }
    return sendJson(res, 405, { error: 'method_not_allowed', message: 'GET or DELETE /messages.' });
  }

  const id = parts[1];
  if (parts.length > 3 || !ID_PATTERN.test(id) || (parts.length === 3 && parts[2] !== 'raw')) return sendJson(res, 404, { error: 'not_found', message: 'No such message.' });
  if (req.method !== 'GET') return sendJson(res, 405, { error: 'method_not_allowed', message: 'GET only.' });
  try {
    if (parts.length === 3) {
      const raw = await readFile(path.join(dataDir, `${id}.eml`));
      res.writeHead(200, { 'content-type': 'message/rfc822', 'content-length': raw.length, 'cache-control': 'no-store' });
      res.end(raw);
      return;
    }
    return sendJson(res, 200, JSON.parse(await readFile(path.join(dataDir, `${id}.json`), 'utf8')));
  } catch {
    return sendJson(res, 404, { error: 'not_found', message: 'No such message.' });
  }
}

function listen(server: Server, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once('error', onError);
    server.listen(port, host, () => {
      server.removeListener('error', onError);
      resolve((server.address() as AddressInfo).port);
    });
  });
}

export async function startMailService(options: MailServiceOptions): Promise<MailService> {
  const host = options.host ?? '127.0.0.1';
  const dataDir = path.resolve(options.dataDir);
  const log = options.log ?? (() => {});
  await mkdir(dataDir, { recursive: true });

  const smtp = new SMTPServer({
    // Loopback only, no TLS and no sign-in: the built-in STARTTLS certificate is long expired,
    // and a client offered STARTTLS would try it.
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    banner: 'Scribeline local mail service',
    size: options.maxBytes ?? DEFAULT_MAX_BYTES,
    closeTimeout: 1_000,
    // Addresses in the reserved .invalid domain (RFC 2606) are refused for good, as a real server
    // refuses a mailbox that does not exist: a way to try how the app treats a permanent bounce.
    onRcptTo(address, _session, callback) {
      if (/\.invalid$/i.test(address.address)) {
        callback(Object.assign(new Error('No such mailbox here'), { responseCode: 550 }));
        return;
      }
      callback();
    },
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', (err) => callback(err));
      stream.on('end', () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          const err = Object.assign(new Error('Message is too large'), { responseCode: 552 });
          callback(err);
          return;
        }
        const raw = Buffer.concat(chunks);
        void store(raw, session.envelope).then(
          (id) => {
            log(`captured ${id} for ${session.envelope.rcptTo.map((r) => r.address).join(', ')}`);
            callback(null, `Kept as ${id}`);
          },
          (err: unknown) => {
            log(`could not keep a message: ${err instanceof Error ? err.message : String(err)}`);
            callback(Object.assign(new Error('Could not store the message'), { responseCode: 451 }));
          },
        );
      });
    },
  });
  smtp.on('error', (err) => log(`smtp error: ${err.message}`));

  async function store(raw: Buffer, envelope: { mailFrom: false | { address: string }; rcptTo: { address: string }[] }): Promise<string> {
    const parsed = await simpleParser(raw);
    const id = newId();
    const headers: Record<string, string> = {};
    for (const name of KEPT_HEADERS) {
      if (parsed.headers.has(name)) headers[name] = headerText(parsed.headers.get(name));
    }
    const message: CapturedMessage = {
      id,
      receivedAt: new Date().toISOString(),
      envelope: { from: envelope.mailFrom ? envelope.mailFrom.address : null, to: envelope.rcptTo.map((r) => r.address) },
      from: addressText(parsed.from),
      to: addressText(parsed.to),
      subject: parsed.subject ?? '',
      text: parsed.text ?? '',
      html: typeof parsed.html === 'string' ? parsed.html : null,
      messageId: parsed.messageId ?? null,
      headers,
      sizeBytes: raw.length,
    };
    // The .eml first: a listed JSON file always has its raw message beside it.
    await writeFile(path.join(dataDir, `${id}.eml`), raw);
    await writeFile(path.join(dataDir, `${id}.json.tmp`), JSON.stringify(message, null, 2));
    await rename(path.join(dataDir, `${id}.json.tmp`), path.join(dataDir, `${id}.json`));
    return id;
  }

  const http = createServer((req, res) => {
    handleHttp(dataDir, req, res).catch((err: unknown) => {
      log(`http error: ${err instanceof Error ? err.message : String(err)}`);
      if (!res.headersSent) sendJson(res, 500, { error: 'internal', message: 'The mail service could not answer.' });
      else res.destroy();
    });
  });

  let smtpPort: number;
  let httpPort: number;
  try {
    // smtp-server listens through its net.Server; listening on that directly surfaces EADDRINUSE to us.
    smtpPort = await listen((smtp as unknown as { server: Server }).server, options.smtpPort, host);
  } catch (err) {
    throw new Error(`mail service: SMTP port ${options.smtpPort} on ${host} is not free (${err instanceof Error ? err.message : String(err)})`);
  }
  try {
    httpPort = await listen(http, options.httpPort, host);
  } catch (err) {
    await new Promise<void>((r) => smtp.close(() => r()));
    throw new Error(`mail service: HTTP port ${options.httpPort} on ${host} is not free (${err instanceof Error ? err.message : String(err)})`);
  }

  let closing: Promise<void> | undefined;
  return {
    smtpPort,
    httpUrl: `http://${host}:${httpPort}`,
    dataDir,
    close() {
      closing ??= Promise.all([
        new Promise<void>((r) => smtp.close(() => r())),
        new Promise<void>((r) => {
          http.close(() => r());
          http.closeAllConnections();
        }),
      ]).then(() => undefined);
      return closing;
    },
  };
}

function port(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isInteger(n) || n < 0 || n > 65535) throw new Error(`${name} must be a port number, not "${raw}"`);
  return n;
}

async function main(): Promise<void> {
  const service = await startMailService({
    smtpPort: port('MAIL_SMTP_PORT', 2525),
    httpPort: port('MAIL_HTTP_PORT', 2580),
    dataDir: process.env.MAIL_DIR || path.join(process.cwd(), '.data', 'mail'),
    log: (line) => console.log(`[mail] ${line}`),
  });
  console.log(`[mail] SMTP on 127.0.0.1:${service.smtpPort}, messages at ${service.httpUrl}/messages, kept in ${service.dataDir}`);
  const stop = () => {
    void service.close().then(() => process.exit(0));
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

const invokedPath = process.argv[1] ? path.resolve(process.argv[1]) : '';
if (invokedPath === fileURLToPath(import.meta.url)) {
  main().catch((err: unknown) => {
    console.error(`mail service failed to start: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
