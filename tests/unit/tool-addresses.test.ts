// An address holding boxes goes to a tool's from-address twin (proxy.ts marks it, next.config.mjs rewrites it): the
// table must know every query key the page reads (a key missing from lib/http/tool-addresses.mjs would leave a shared
// link's boxes to the browser), and proxy.ts's matcher, written out literally, must ask for each of them.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { TOOL_ADDRESS_KEYS, TOOL_BOXES_HEADER, fromAddressPath, holdsBoxes, toolAddressRewrites } from '@/lib/http/tool-addresses.mjs';
import { config as proxyConfig } from '@/proxy';
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

  it("proxy.ts's matcher asks for each page and key, with a query key of its own", () => {
    const toolEntries = proxyConfig.matcher.filter(
      (m): m is { source: string; has: { type: string; key: string }[] } => typeof m === 'object' && m.source in TOOL_ADDRESS_KEYS,
    );
    const written = toolEntries.map((m) => `${m.source}?${m.has.map((h) => `${h.type}:${h.key}`).join('&')}`).sort();
    const wanted = Object.entries(TOOL_ADDRESS_KEYS).flatMap(([page, keys]) => keys.map((key) => `${page}?query:${key}`)).sort();
    expect(written).toEqual(wanted);
  });

  it("marks an address only when one of the page's keys has a value", () => {
    const holds = (page: string, query: string) => holdsBoxes(page, new URLSearchParams(query));
    expect(holds('/fits', 'q=25+H7/g6')).toBe(true);
    expect(holds('/calculators/tap-drill', 'thread=M6')).toBe(true);
    expect(holds('/calculators/tap-drill', 'target=&thread=')).toBe(false); // boxes emptied on purpose: the page built ahead
    expect(holds('/calculators/tap-drill', 'q=25')).toBe(false); // another page's key
    expect(holds('/fits', '')).toBe(false);
    expect(holds('/calculators', 'thread=M6')).toBe(false); // not a page with boxes
    expect(holds('/logs/a/entries/1', 'q=1')).toBe(false);
  });

  it('rewrites a marked request to its twin in two rules', () => {
    const rules = toolAddressRewrites();
    expect(rules).toEqual([
      { source: '/fits', has: [{ type: 'header', key: TOOL_BOXES_HEADER }], destination: fromAddressPath('/fits') },
      { source: '/calculators/:slug', has: [{ type: 'header', key: TOOL_BOXES_HEADER }], destination: '/calculators/:slug/from-address' },
    ]);
  });
});
