import type { IncomingMessage } from 'node:http';

import { HttpError } from './http';
import { CallbackResults, RegistrationTable } from './registrations';
import { safeEqual, sign, type Credentials } from './signing';
import type { FileStore } from './store';

/** What one running service holds, shared by its endpoint handlers (uploads-fake/handlers/*). */
export interface ServiceState {
  creds: Credentials;
  store: FileStore;
  registrations: RegistrationTable;
  callbackResults: CallbackResults;
  /** Keys with an upload in flight; sweeping leaves them alone. */
  activeKeys: Set<string>;
  /** Known once the server listens: put in file URLs and in the callback `origin`. */
  baseUrl: string;
  callbackTimeoutMs: number;
  registrationWaitMs: number;
  limitBytes: number;
  defaultAcl: 'private' | 'public-read';
  log: (line: string) => void;
}

export function createState(fields: Omit<ServiceState, 'registrations' | 'callbackResults' | 'activeKeys' | 'baseUrl'> & { registrationTtlMs: number }): ServiceState {
  const { registrationTtlMs, ...rest } = fields;
  return { ...rest, registrations: new RegistrationTable(registrationTtlMs), callbackResults: new CallbackResults(), activeKeys: new Set(), baseUrl: '' };
}

export const fileUrl = (state: ServiceState, key: string): string => `${state.baseUrl}/f/${encodeURIComponent(key)}`;

export const urlsFor = (state: ServiceState, key: string): { url: string; appUrl: string; ufsUrl: string } => {
  const url = fileUrl(state, key);
  return { url, appUrl: url, ufsUrl: url };
};

/** A read URL for a private file, signed the way the SDK's generateSignedURL signs one. */
export function signedFileUrl(state: ServiceState, key: string, ttlMs: number): string {
  const url = new URL(fileUrl(state, key));
  url.searchParams.append('expires', String(Date.now() + ttlMs));
  url.searchParams.append('signature', sign(url.toString(), state.creds.apiKey));
  return url.href;
}

export function requireApiKey(state: ServiceState, req: IncomingMessage): void {
  const given = req.headers['x-uploadthing-api-key'];
  if (typeof given !== 'string' || !safeEqual(given, state.creds.apiKey)) throw new HttpError(401, 'invalid or missing x-uploadthing-api-key');
}

/** What the SDK may have used as the ingest base when it signed a URL. */
export function signingOrigins(state: ServiceState, req: IncomingMessage): string[] {
  const origins = new Set<string>([state.baseUrl]);
  if (req.headers.host) {
    origins.add(`http://${req.headers.host}`);
    origins.add(`https://${req.headers.host}`);
  }
  return [...origins];
}
