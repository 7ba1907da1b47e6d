// The rewrites that send an address holding boxes to a tool's from-address twin must know every query key the
// page reads: a key missing from lib/http/tool-addresses.mjs would leave a shared link's boxes to the browser.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { TOOL_ADDRESS_KEYS, fromAddressPath, toolAddressRewrites } from '@/lib/http/tool-addresses.mjs';
import { CALCULATOR_PAGES } from '@/lib/calculators/pages/registry';
import { entryFromSearch } from '@/components/fits/read-entry';

/** The keys a page's reader asks for, recorded as it asks. */
function keysRead(read: (search: { get(key: string): string | null }) => unknown): string[] {
  const keys = new Set<string>();
  read({ get: (key) => (keys.add(key), null) });
  return [...keys].sort();
}

describe('tool addresses', () => {
  it.each(CALCULATOR_PAGES.map((p) => [p.slug, p] as const))('every query key the %s calculator reads is rewritten to its twin', (slug, page) => {
    expect(keysRead((s) => page.fromSearch(s))).toEqual([...(TOOL_ADDRESS_KEYS[`/calculators/${slug}`] ?? [])].sort());
  });

  it('every query key the fits look-up reads is rewritten to its twin', () => {
    const keys = new Set<string>();
    const record = new Proxy({}, { get: (_t, key) => (typeof key === 'string' && keys.add(key), undefined) });
    entryFromSearch(record);
    expect([...keys].sort()).toEqual([...TOOL_ADDRESS_KEYS['/fits']].sort());
  });

  it.each(CALCULATOR_PAGES.map((p) => [p.slug] as const))('the %s calculator has its route and its from-address twin, both for that page', (slug) => {
    for (const file of ['page.tsx', 'from-address/page.tsx']) {
      const source = readFileSync(path.join('app', '(tools)', 'calculators', slug, file), 'utf8');
      expect(source).toContain(`calculatorRoute('${slug}', `);
    }
  });

  it('lists no page that does not exist', () => {
    expect(Object.keys(TOOL_ADDRESS_KEYS).sort()).toEqual(['/fits', ...CALCULATOR_PAGES.map((p) => `/calculators/${p.slug}`)].sort());
  });

  it('writes one rule per page and key, each to the page twin', () => {
    const rules = toolAddressRewrites();
    expect(rules).toContainEqual({ source: '/fits', has: [{ type: 'query', key: 'q' }], destination: '/fits/from-address' });
    expect(rules).toHaveLength(Object.values(TOOL_ADDRESS_KEYS).reduce((n, keys) => n + keys.length, 0));
    for (const rule of rules) expect(rule.destination).toBe(fromAddressPath(rule.source));
  });
});
