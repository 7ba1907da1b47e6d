import { errorMessage } from './http';
import type { CallbackOutcome, Registration } from './registrations';
import { sign } from './signing';
import { urlsFor, type ServiceState } from './state';
import type { StoredFile } from './store';

// Upload-complete delivery: running the app's onUploadComplete (or onUploadError) for a stored file,
// by a signed POST in production mode or a line on the dev-mode /route-metadata stream.

const callbackPayload = (state: ServiceState, reg: Registration, file: StoredFile): string =>
  JSON.stringify({
    status: 'uploaded',
    metadata: reg.metadata,
    origin: state.baseUrl,
    file: {
      name: file.name,
      size: file.size,
      type: file.type,
      customId: file.customId,
      key: file.key,
      ...urlsFor(state, file.key),
      fileHash: file.fileHash,
      lastModified: file.uploadedAt,
    },
  });

async function postToApp(state: ServiceState, reg: Registration, hook: 'callback' | 'error', payload: string): Promise<void> {
  const target = new URL(reg.callbackUrl);
  target.searchParams.set('slug', reg.callbackSlug);
  const response = await fetch(target, {
    method: 'POST',
    headers: {
      'content-type': 'application/json',
      'uploadthing-hook': hook,
      'x-uploadthing-signature': sign(payload, state.creds.apiKey),
    },
    body: payload,
    signal: AbortSignal.timeout(state.callbackTimeoutMs),
  });
  await response.arrayBuffer().catch(() => undefined);
  if (!response.ok) throw new Error(`the app answered the ${hook} hook with ${response.status}`);
}

/** Runs the app's onUploadComplete one way or the other; never waits past the timeout. */
export async function deliverCallback(state: ServiceState, reg: Registration, file: StoredFile): Promise<CallbackOutcome> {
  const payload = callbackPayload(state, reg, file);
  const result = reg.awaitServerData ? state.callbackResults.expect(file.key, state.callbackTimeoutMs) : null;
  if (reg.isDev) {
    const written = state.registrations.writeLine(reg, { payload, signature: sign(payload, state.creds.apiKey), hook: 'callback' });
    if (!written) {
      state.callbackResults.deliver(file.key, { ok: false, error: 'cancelled' });
      return { ok: false, error: 'the app closed its /route-metadata stream before the upload finished' };
    }
  } else {
    try {
      await postToApp(state, reg, 'callback', payload);
    } catch (err) {
      state.callbackResults.deliver(file.key, { ok: false, error: 'cancelled' });
      return { ok: false, error: `upload-complete callback failed: ${errorMessage(err)}` };
    }
  }
  return result ? await result : { ok: true, serverData: null };
}

/** Lets the app's onUploadError run for a verified upload that failed. */
export function reportUploadError(state: ServiceState, key: string, error: string): void {
  const reg = state.registrations.get(key);
  if (!reg) return;
  const payload = JSON.stringify({ fileKey: key, error });
  if (reg.isDev) {
    state.registrations.writeLine(reg, { payload, signature: sign(payload, state.creds.apiKey), hook: 'error' });
    state.registrations.finish(reg, key);
    return;
  }
  state.registrations.finish(reg, key);
  postToApp(state, reg, 'error', payload).catch((err: unknown) => state.log(`error hook for ${key} failed: ${errorMessage(err)}`));
}
