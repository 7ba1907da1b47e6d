// Drives the real uploadthing SDK from Node in integration tests: serves WHATWG route handlers on
// node:http, and gives the browser client the XMLHttpRequest it expects, on top of fetch.
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';

export type FetchHandler = (request: Request) => Promise<Response>;

/** Serves WHATWG handlers (like the SDK's route handler) on node:http, by path. */
export async function serveApp(handlers: () => Record<string, FetchHandler>): Promise<{ url: string; close(): Promise<void> }> {
  const server: Server = createServer(async (req, res) => {
    try {
      const chunks: Buffer[] = [];
      for await (const chunk of req) chunks.push(chunk as Buffer);
      const headers = new Headers();
      for (let i = 0; i < req.rawHeaders.length; i += 2) headers.append(req.rawHeaders[i] ?? '', req.rawHeaders[i + 1] ?? '');
      const url = new URL(req.url ?? '/', `http://${req.headers.host}`);
      const handler = handlers()[url.pathname];
      if (!handler) {
        res.writeHead(404).end();
        return;
      }
      const hasBody = req.method !== 'GET' && req.method !== 'HEAD';
      const response = await handler(
        new Request(url, { method: req.method, headers, body: hasBody ? Buffer.concat(chunks) : undefined }),
      );
      const body = Buffer.from(await response.arrayBuffer());
      res.writeHead(response.status, Object.fromEntries(response.headers));
      res.end(body);
    } catch (err) {
      res.writeHead(500).end(String(err));
    }
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        server.closeAllConnections();
      }),
  };
}

/**
 * Minimal XMLHttpRequest over fetch, covering what uploadthing/client's
 * browser upload path uses (open, setRequestHeader, responseType 'json',
 * upload progress, load/error, send(FormData), abort).
 */
export class FetchXhr {
  status = 0;
  statusText = '';
  response: unknown = null;
  responseType = '';
  readonly upload = new EventTarget();
  private readonly events = new EventTarget();
  private readonly headers = new Headers();
  private readonly controller = new AbortController();
  private method = 'GET';
  private url = '';

  open(method: string, url: string): void {
    this.method = method;
    this.url = url;
  }
  setRequestHeader(name: string, value: string): void {
    this.headers.set(name, value);
  }
  addEventListener(type: string, listener: (event: Event) => void): void {
    this.events.addEventListener(type, listener);
  }
  abort(): void {
    this.controller.abort();
  }
  send(body: FormData): void {
    let total = 0;
    for (const [, value] of body) total += typeof value === 'string' ? value.length : value.size;
    fetch(this.url, { method: this.method, headers: this.headers, body, signal: this.controller.signal }).then(
      async (res) => {
        this.upload.dispatchEvent(Object.assign(new Event('progress'), { loaded: total }));
        this.status = res.status;
        this.statusText = res.statusText;
        const text = await res.text();
        if (this.responseType === 'json') {
          try {
            this.response = JSON.parse(text) as unknown;
          } catch {
            this.response = null;
          }
        } else {
          this.response = text;
        }
        this.events.dispatchEvent(new Event('load'));
      },
      () => this.events.dispatchEvent(new Event('error')),
    );
  }
}

/** Puts FetchXhr in place of the browser's XMLHttpRequest; returns the function that takes it away again. */
export function installFetchXhr(): () => void {
  const g = globalThis as Record<string, unknown>;
  const previous = g.XMLHttpRequest;
  g.XMLHttpRequest = FetchXhr;
  return () => {
    g.XMLHttpRequest = previous;
  };
}
