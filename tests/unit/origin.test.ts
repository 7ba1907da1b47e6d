import { describe, expect, test } from 'vitest';
import { checkOrigin, normalizeOrigin } from '@/lib/http/origin';
import { isJsonContentType } from '@/lib/http/body';
import { contentSecurityPolicy } from '@/lib/http/security-headers.mjs';

const SELF = 'http://127.0.0.1:3000';
const FOREIGN = 'https://attacker.example';
const check = (method: string, origin: string | null, secFetchSite: string | null = null, allowed: string[] = []) =>
  checkOrigin({ method, selfOrigin: SELF, origin, secFetchSite, allowed }).ok;

// The rules follow the Fetch standard's Origin and Sec-Fetch-Site headers (fetch.spec.whatwg.org, W3C Fetch Metadata).
describe('checkOrigin', () => {
  test.each([
    ['GET from anywhere (safe method)', 'GET', FOREIGN, 'cross-site', true],
    ['POST same origin', 'POST', SELF, 'same-origin', true],
    ['POST with neither header (curl, a server callback)', 'POST', null, null, true],
    ['POST typed into the address bar (none)', 'POST', null, 'none', true],
    ['POST from a foreign origin', 'POST', FOREIGN, null, false],
    ['DELETE cross-site by Sec-Fetch-Site alone', 'DELETE', null, 'cross-site', false],
    ['PATCH from another port of the same host (same-site)', 'PATCH', 'http://127.0.0.1:4000', 'same-site', false],
    ['PUT from a subdomain', 'PUT', 'http://evil.127.0.0.1.nip.example', 'same-site', false],
    ['POST with Origin null (sandboxed frame)', 'POST', 'null', null, false],
    ['POST from another scheme of the same host', 'POST', 'https://127.0.0.1:3000', null, false],
    ['POST with a same origin but cross-site fetch metadata', 'POST', SELF, 'cross-site', false],
  ])('%s', (_, method, origin, site, ok) => {
    expect(check(method as string, origin as string | null, site as string | null)).toBe(ok);
  });

  test('the configured app URL is allowed too', () => {
    expect(check('POST', 'https://scribeline.example', null, ['https://scribeline.example'])).toBe(true);
    expect(check('POST', 'https://scribeline.example.attacker.example', null, ['https://scribeline.example'])).toBe(false);
  });

  test('origins are compared normalized (RFC 6454: scheme, host, port)', () => {
    expect(normalizeOrigin('HTTP://127.0.0.1:3000/')).toBe(SELF);
    expect(normalizeOrigin('https://a.example:443')).toBe('https://a.example');
    expect(normalizeOrigin('javascript:alert(1)')).toBeNull();
  });
});

// RFC 8259 §11 registers application/json; RFC 6839 §3.1 the +json suffix.
describe('isJsonContentType', () => {
  test.each([
    ['application/json', true],
    ['application/json; charset=utf-8', true],
    ['Application/JSON', true],
    ['application/merge-patch+json', true],
    ['text/plain', false],
    ['application/x-www-form-urlencoded', false],
    ['multipart/form-data; boundary=x', false],
    ['text/json', false],
    [null, false],
  ])('%s → %s', (type, ok) => expect(isJsonContentType(type)).toBe(ok));
});

// Directives from CSP Level 3 (w3.org/TR/CSP3).
describe('content security policy', () => {
  const csp = contentSecurityPolicy({ NODE_ENV: 'production', UPLOADTHING_INGEST_URL: 'http://127.0.0.1:3110/' });
  const directive = (name: string) => csp.split('; ').find((d: string) => d.startsWith(`${name} `)) ?? '';
  test('forbids framing, plugins, base rewrites and posting forms elsewhere', () => {
    expect(directive('frame-ancestors')).toBe("frame-ancestors 'none'");
    expect(directive('object-src')).toBe("object-src 'none'");
    expect(directive('base-uri')).toBe("base-uri 'self'");
    expect(directive('form-action')).toBe("form-action 'self'");
  });
  test('media, images and uploads only from the app and the upload service', () => {
    expect(directive('media-src')).toBe("media-src 'self' blob: http://127.0.0.1:3110");
    expect(directive('img-src')).toBe("img-src 'self' data: blob: http://127.0.0.1:3110");
    expect(directive('connect-src')).toBe("connect-src 'self' http://127.0.0.1:3110");
  });
  test('no eval in production; scripts only from the app', () => {
    expect(directive('script-src')).toBe("script-src 'self' 'unsafe-inline'");
  });
});
