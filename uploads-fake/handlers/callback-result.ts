import type { IncomingMessage, ServerResponse } from 'node:http';

import { HttpError, isRecord, readJson, sendJson } from '../http';
import type { CallbackOutcome } from '../registrations';
import { requireApiKey, type ServiceState } from '../state';

/** POST /callback-result: the app reporting what its onUploadComplete returned (or its error). */
export async function handleCallbackResult(state: ServiceState, req: IncomingMessage, res: ServerResponse): Promise<void> {
  requireApiKey(state, req);
  const body = await readJson(req);
  if (!isRecord(body) || typeof body.fileKey !== 'string') throw new HttpError(400, 'expected {fileKey, callbackData}');
  const outcome: CallbackOutcome =
    typeof body.error === 'string' ? { ok: false, error: body.error } : { ok: true, serverData: body.callbackData ?? null };
  const waited = state.callbackResults.deliver(body.fileKey, outcome);
  if (!waited && !(await state.store.read(body.fileKey))) throw new HttpError(404, 'no upload is waiting for this file key');
  sendJson(res, 200, { ok: true });
}
