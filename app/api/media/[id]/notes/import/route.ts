import { NextResponse } from 'next/server';
import { route, readJson, created, idParam } from '@/lib/http/route';
import { CAPTION_FILE_MAX_BYTES } from '@/lib/validations/notes';
import { importNotes } from '@/lib/server/notes';


type Params = { id: string };

// JSON escaping can grow a file's text; past this the body is refused unread.
const BODY_LIMIT = CAPTION_FILE_MAX_BYTES * 2;
const tooLarge = () =>
  NextResponse.json(
    { error: 'too_large', message: 'The file is larger than 1 MB; a chapter or caption file is far smaller. Check that you picked the right file.', fieldErrors: { text: ['The file is larger than 1 MB.'] } },
    { status: 413 },
  );

/** { fileName, text } (the browser reads the .vtt/.srt file) → 201 { created: NoteView[], problems: {line, reason}[], problemsNotListed }. */
export const POST = route<Params>({ maxBytes: BODY_LIMIT }, async ({ req, user, params }) => {
  const id = idParam(params);
  if (Number(req.headers.get('content-length') ?? 0) > BODY_LIMIT) return tooLarge();
  const body = user ? await readJson(req) : {};
  const { fileName, text } = (body && typeof body === 'object' ? body : {}) as { fileName?: unknown; text?: unknown };
  if (typeof text === 'string' && Buffer.byteLength(text, 'utf8') > CAPTION_FILE_MAX_BYTES) return tooLarge();
  return created(await importNotes(user, id, fileName, text));
});
