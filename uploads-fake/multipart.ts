import { createHash } from 'node:crypto';
import type { Readable, Writable } from 'node:stream';

/**
 * Streaming reader for a multipart/form-data body that carries one file in
 * the field `file`. Clips can be gigabytes, so the file part goes straight to
 * a writable (a temp file) with backpressure; nothing is held in memory but a
 * chunk and a delimiter-sized tail.
 */

export class MultipartError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
    this.name = 'MultipartError';
  }
}

export interface ReceivedFile {
  size: number;
  sha256: string;
  fileName: string | null;
  contentType: string | null;
}

export function boundaryOf(contentType: string | undefined): string | null {
  if (!contentType || !/^multipart\/form-data\s*;/i.test(contentType)) return null;
  const match = /;\s*boundary=(?:"([^"]+)"|([^\s;]+))/i.exec(contentType);
  const boundary = match?.[1] ?? match?.[2];
  // RFC 2046 caps boundaries at 70 characters.
  return boundary && boundary.length <= 70 ? boundary : null;
}

const CRLF = Buffer.from('\r\n');
const HEADER_END = Buffer.from('\r\n\r\n');
const MAX_HEADER_BYTES = 16 * 1024;

interface PartHeaders {
  name: string | null;
  fileName: string | null;
  contentType: string | null;
}

function parsePartHeaders(raw: string): PartHeaders {
  let name: string | null = null;
  let fileName: string | null = null;
  let contentType: string | null = null;
  for (const line of raw.split('\r\n')) {
    const colon = line.indexOf(':');
    if (colon < 0) continue;
    const header = line.slice(0, colon).trim().toLowerCase();
    const value = line.slice(colon + 1).trim();
    if (header === 'content-type') contentType = value;
    if (header === 'content-disposition') {
      name = /;\s*name="([^"]*)"/i.exec(value)?.[1] ?? null;
      fileName = /;\s*filename="([^"]*)"/i.exec(value)?.[1] ?? null;
    }
  }
  return { name, fileName, contentType };
}

async function writeWithBackpressure(sink: Writable, chunk: Buffer): Promise<void> {
  if (sink.errored) throw sink.errored;
  if (sink.write(chunk)) return;
  await new Promise<void>((resolve, reject) => {
    const onDrain = (): void => {
      sink.off('error', onSinkError);
      resolve();
    };
    const onSinkError = (err: Error): void => {
      sink.off('drain', onDrain);
      reject(err);
    };
    sink.once('drain', onDrain);
    sink.once('error', onSinkError);
  });
}

type ParserState = 'preamble' | 'after-delimiter' | 'headers' | 'body' | 'epilogue';

/**
 * Incremental parser: feed it chunks with push(), then call finish(). The
 * bytes of the `file` part are written to `sink`; other parts are skipped.
 * Throws MultipartError with 413 as soon as the file exceeds `maxFileBytes`,
 * and with 400 for a malformed or truncated body. Does not end `sink`: the
 * caller owns it.
 */
export class FilePartParser {
  // Starting with a CRLF lets the first boundary be matched by the same
  // "CRLF--boundary" delimiter as every later one.
  private buf: Buffer = CRLF;
  private state: ParserState = 'preamble';
  private readonly delimiter: Buffer;
  private readonly keep: number;
  private inFilePart = false;
  private part: PartHeaders = { name: null, fileName: null, contentType: null };
  private file: { fileName: string | null; contentType: string | null } | null = null;
  private seenFile = false;
  private size = 0;
  private readonly hash = createHash('sha256');

  constructor(
    boundary: string,
    private readonly sink: Writable,
    private readonly maxFileBytes: number,
  ) {
    this.delimiter = Buffer.from(`\r\n--${boundary}`);
    this.keep = this.delimiter.length - 1;
  }

  async push(chunk: Buffer): Promise<void> {
    this.buf = this.buf.length === 0 ? chunk : Buffer.concat([this.buf, chunk]);
    while (await this.step()) {
      /* keep consuming what is buffered */
    }
  }

  finish(): ReceivedFile {
    if (this.state !== 'epilogue') throw new MultipartError(400, 'multipart body ended before its closing boundary');
    if (!this.file) throw new MultipartError(400, 'no file field in the multipart body');
    return { size: this.size, sha256: this.hash.digest('hex'), ...this.file };
  }

  private async emit(bytes: Buffer): Promise<void> {
    if (!this.inFilePart || bytes.length === 0) return;
    this.size += bytes.length;
    if (this.size > this.maxFileBytes) {
      throw new MultipartError(413, `file is larger than the declared ${this.maxFileBytes} bytes`);
    }
    this.hash.update(bytes);
    await writeWithBackpressure(this.sink, bytes);
  }

  private async step(): Promise<boolean> {
    switch (this.state) {
      case 'preamble': {
        const at = this.buf.indexOf(this.delimiter);
        if (at < 0) {
          this.buf = this.buf.subarray(Math.max(0, this.buf.length - this.keep));
          return false;
        }
        this.buf = this.buf.subarray(at + this.delimiter.length);
        this.state = 'after-delimiter';
        return true;
      }
      case 'after-delimiter': {
        if (this.buf.length < 2) return false;
        if (this.buf[0] === 0x2d && this.buf[1] === 0x2d) {
          this.state = 'epilogue';
          this.buf = Buffer.alloc(0);
          return false;
        }
        if (this.buf[0] === 0x0d && this.buf[1] === 0x0a) {
          this.buf = this.buf.subarray(2);
          this.state = 'headers';
          return true;
        }
        throw new MultipartError(400, 'malformed multipart boundary');
      }
      case 'headers': {
        const at = this.buf.indexOf(HEADER_END);
        if (at < 0) {
          if (this.buf.length > MAX_HEADER_BYTES) throw new MultipartError(400, 'multipart part headers too large');
          return false;
        }
        this.part = parsePartHeaders(this.buf.subarray(0, at).toString('utf8'));
        this.buf = this.buf.subarray(at + HEADER_END.length);
        this.inFilePart = this.part.name === 'file';
        if (this.inFilePart) {
          if (this.seenFile) throw new MultipartError(400, 'more than one file field');
          this.seenFile = true;
        }
        this.state = 'body';
        return true;
      }
      case 'body': {
        const at = this.buf.indexOf(this.delimiter);
        if (at < 0) {
          const flushable = this.buf.length - this.keep;
          if (flushable > 0) {
            await this.emit(this.buf.subarray(0, flushable));
            this.buf = this.buf.subarray(flushable);
          }
          return false;
        }
        await this.emit(this.buf.subarray(0, at));
        this.buf = this.buf.subarray(at + this.delimiter.length);
        if (this.inFilePart) {
          this.inFilePart = false;
          this.file = { fileName: this.part.fileName, contentType: this.part.contentType };
        }
        this.state = 'after-delimiter';
        return true;
      }
      case 'epilogue':
        this.buf = Buffer.alloc(0);
        return false;
    }
  }
}

/**
 * Reads `body` through the parser with flow control (paused while a chunk
 * is being written). On failure the listeners are removed and the stream is
 * left paused rather than destroyed, so the caller can still send a reply
 * on the same connection.
 */
export function receiveFilePart(
  body: Readable,
  boundary: string,
  sink: Writable,
  maxFileBytes: number,
): Promise<ReceivedFile> {
  const parser = new FilePartParser(boundary, sink, maxFileBytes);
  return new Promise<ReceivedFile>((resolve, reject) => {
    let settled = false;
    let ended = false;
    // 'end' can be emitted right after the last 'data' even while paused, so
    // the end of the body is handled only once the last chunk is written.
    let writing: Promise<void> = Promise.resolve();

    const cleanup = (): void => {
      body.off('data', onData);
      body.off('end', onEnd);
      body.off('error', onError);
      body.off('close', onClose);
    };
    const fail = (err: unknown): void => {
      if (settled) return;
      settled = true;
      cleanup();
      body.pause();
      reject(err);
    };
    const onData = (chunk: Buffer | string): void => {
      body.pause();
      const bytes = typeof chunk === 'string' ? Buffer.from(chunk) : chunk;
      writing = writing
        .then(() => (settled ? undefined : parser.push(bytes)))
        .then(() => {
          if (!settled && !ended) body.resume();
        });
      writing.catch(fail);
    };
    const onEnd = (): void => {
      ended = true;
      writing.then(() => {
        if (settled) return;
        try {
          const received = parser.finish();
          settled = true;
          cleanup();
          resolve(received);
        } catch (err) {
          fail(err);
        }
      }, fail);
    };
    const onError = (err: Error): void => fail(new MultipartError(400, `upload aborted: ${err.message}`));
    // 'close' without 'end' means the client went away mid-body.
    const onClose = (): void => {
      if (!ended) fail(new MultipartError(400, 'upload aborted before the body was complete'));
    };

    body.on('data', onData);
    body.once('end', onEnd);
    body.once('error', onError);
    body.once('close', onClose);
    body.resume();
  });
}
