// The return path after signing in (issue 11, open redirect): only paths of this site survive.
// Hostile forms from the issue and from the WHATWG URL Standard's parsing rules (backslash as slash in
// special schemes, tab and newline removal, dot segments).
import { describe, expect, test } from 'vitest';
import { safeNextPath } from '@/lib/auth/safe-redirect';

describe('safeNextPath', () => {
  test.each([
    ['/\\evil.test', 'backslash read as a slash: //evil.test (URL Standard)'],
    ['//evil.test', 'protocol-relative URL'],
    ['https://evil.test', 'absolute URL of another site'],
    ['http://evil.test/projects', 'absolute URL of another site'],
    ['/\t/evil.test', 'tab removed by the parser (URL Standard)'],
    ['/\n/evil.test', 'newline removed by the parser (URL Standard)'],
    ['/.//evil.test', 'dot segment leaving a path that starts with //'],
    ['javascript:alert(1)', 'script URL'],
    ['JaVaScRiPt:alert(1)', 'script URL, mixed case'],
    ['data:text/html,<script>alert(1)</script>', 'data URL'],
    ['evil.test/projects', 'not a path'],
    ['\\\\evil.test', 'two backslashes'],
    ['', 'empty'],
  ])('%j → fallback (%s)', (target) => {
    expect(safeNextPath(target, '/projects')).toBe('/projects');
  });

  test.each([
    ['/projects', '/projects'],
    ['/invitations/accept?token=abc.def', '/invitations/accept?token=abc.def'],
    ['/logs/backplate/entries/12#t=42', '/logs/backplate/entries/12#t=42'],
    ['/%5Cevil', '/%5Cevil'],
  ])('%j stays on the site as %j', (target, expected) => {
    expect(safeNextPath(target, '/projects')).toBe(expected);
  });

  test('%5C stays percent-encoded: it names a local path, never a host', () => {
    expect(safeNextPath('/%5Cevil.test', '/')).toBe('/%5Cevil.test');
    expect(new URL(safeNextPath('/%5Cevil.test', '/'), 'http://127.0.0.1:3000').host).toBe('127.0.0.1:3000');
  });

  test("an absolute URL of the site's own origin is kept as its path; another port is not the same site", () => {
    expect(safeNextPath('http://127.0.0.1:3000/settings?x=1', '/', 'http://127.0.0.1:3000')).toBe('/settings?x=1');
    expect(safeNextPath('http://127.0.0.1:3001/settings', '/', 'http://127.0.0.1:3000')).toBe('/');
  });

  test('non-strings fall back', () => {
    expect(safeNextPath(undefined, '/x')).toBe('/x');
    expect(safeNextPath(null, '/x')).toBe('/x');
    expect(safeNextPath(['/a'], '/x')).toBe('/x');
  });
});
