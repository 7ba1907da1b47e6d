import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

import { errorMessage } from './http';
import { requestListener } from './router';
import { parseToken, type Credentials } from './signing';
import { createState } from './state';
import { FileStore } from './store';

export type { UploadResponseBody } from './handlers/ingest';

/**
 * Local stand-in for the hosted upload service, spoken to by the app's
 * unmodified uploadthing SDK in development and tests. See README.md.
 * This file starts and stops it (and is its command line); router.ts sends each request to its
 * endpoint's handler in handlers/, which share the running service's state (state.ts).
 */

export interface UploadServiceOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  dataDir: string;
  /** The same base64 token the app uses; or give apiKey and appId. */
  token?: string;
  apiKey?: string;
  appId?: string;
  /** Base URL put in file URLs and in the callback `origin`; defaults to http://host:port. */
  publicUrl?: string;
  /** Upper bound on waiting for the app's upload-complete callback and its result. */
  callbackTimeoutMs?: number;
  /** How long a PUT waits for the app's /route-metadata registration to arrive. */
  registrationWaitMs?: number;
  /** How long a dev-mode /route-metadata stream may stay open with uploads outstanding. */
  registrationTtlMs?: number;
  /** Reported by getUsageInfo. */
  limitBytes?: number;
  /**
   * The ACL of a file uploaded without one (the hosted service takes the app's default). 'private'
   * (the default here): reads need a signed, unexpired URL. 'public-read': anyone with the URL.
   */
  defaultAcl?: 'private' | 'public-read';
  log?: (line: string) => void;
}

export interface UploadService {
  url: string;
  port: number;
  dataDir: string;
  close(): Promise<void>;
  /** Removes leftovers of uploads that never completed; returns the paths removed. */
  sweepAbandoned(olderThanMs: number): Promise<string[]>;
}

const DEFAULT_CALLBACK_TIMEOUT_MS = 15_000;
const DEFAULT_REGISTRATION_WAIT_MS = 5_000;
const DEFAULT_REGISTRATION_TTL_MS = 60 * 60 * 1000;
const DEFAULT_LIMIT_BYTES = 100 * 1024 ** 3;

function credentialsFrom(options: UploadServiceOptions): Credentials {
  if (options.token) return parseToken(options.token);
  if (options.apiKey && options.appId) return { apiKey: options.apiKey, appId: options.appId };
  throw new Error('startUploadService needs `token`, or `apiKey` and `appId`');
}

export async function startUploadService(options: UploadServiceOptions): Promise<UploadService> {
  const host = options.host ?? '127.0.0.1';
  const store = new FileStore(path.resolve(options.dataDir));
  const state = createState({
    creds: credentialsFrom(options),
    store,
    registrationTtlMs: options.registrationTtlMs ?? DEFAULT_REGISTRATION_TTL_MS,
    callbackTimeoutMs: options.callbackTimeoutMs ?? DEFAULT_CALLBACK_TIMEOUT_MS,
    registrationWaitMs: options.registrationWaitMs ?? DEFAULT_REGISTRATION_WAIT_MS,
    limitBytes: options.limitBytes ?? DEFAULT_LIMIT_BYTES,
    defaultAcl: options.defaultAcl ?? 'private',
    log: options.log ?? ((): void => undefined),
  });
  await store.init();

  const server: Server = createServer(requestListener(state));
  // Each request is short except uploads and dev streams, which must not be cut.
  server.requestTimeout = 0;

  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  const port = (server.address() as AddressInfo).port;
  const hostForUrl = host.includes(':') ? `[${host}]` : host;
  state.baseUrl = (options.publicUrl ?? `http://${hostForUrl}:${port}`).replace(/\/$/, '');
  state.log(`listening on ${state.baseUrl}, storing in ${store.dataDir}`);

  let closing: Promise<void> | null = null;
  return {
    url: state.baseUrl,
    port,
    dataDir: store.dataDir,
    sweepAbandoned: (olderThanMs) => store.sweep(olderThanMs, state.activeKeys),
    close: () => {
      closing ??= new Promise<void>((resolve) => {
        state.callbackResults.cancelAll('the upload service is shutting down');
        state.registrations.closeAll();
        server.close(() => resolve());
        server.closeIdleConnections();
        // In-flight uploads cannot finish once we stop; drop them.
        setTimeout(() => server.closeAllConnections(), 100).unref();
      });
      return closing;
    },
  };
}

/** Removes leftovers of uploads that never completed, for use while no service runs on `dataDir`. */
export function sweepAbandoned(dataDir: string, olderThanMs: number): Promise<string[]> {
  return new FileStore(path.resolve(dataDir)).sweep(olderThanMs);
}

// ---- command line -------------------------------------------------------------

async function main(): Promise<void> {
  const token = process.env.UPLOADTHING_TOKEN;
  if (!token) {
    console.error('UPLOADTHING_TOKEN is not set: the upload service needs the same token as the app (see uploads-fake/README.md)');
    process.exit(1);
  }
  const port = Number(process.env.UPLOADS_FAKE_PORT ?? 3100);
  const dataDir = path.resolve(process.env.UPLOADS_FAKE_DIR ?? '.data/uploads');
  const acl = process.env.UPLOADS_FAKE_DEFAULT_ACL;
  if (acl !== undefined && acl !== 'private' && acl !== 'public-read') {
    console.error('UPLOADS_FAKE_DEFAULT_ACL must be private or public-read');
    process.exit(1);
  }
  const service = await startUploadService({
    port,
    dataDir,
    token,
    defaultAcl: acl,
    log: (line) => console.log(`[uploads] ${line}`),
  });
  console.log(`upload service on ${service.url}`);

  const hour = 60 * 60 * 1000;
  const sweep = (): void => {
    service.sweepAbandoned(hour).then(
      (removed) => removed.length > 0 && console.log(`[uploads] swept ${removed.length} abandoned file(s)`),
      (err: unknown) => console.error(`[uploads] sweep failed: ${errorMessage(err)}`),
    );
  };
  sweep();
  setInterval(sweep, hour).unref();

  const stop = (signal: string): void => {
    console.log(`[uploads] ${signal}: stopping`);
    service.close().then(
      () => process.exit(0),
      () => process.exit(1),
    );
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}

const invokedPath = process.argv[1] ? path.resolve(process.argv[1]) : '';
if (invokedPath === fileURLToPath(import.meta.url)) {
  main().catch((err: unknown) => {
    console.error(`upload service failed to start: ${errorMessage(err)}`);
    process.exit(1);
  });
}
