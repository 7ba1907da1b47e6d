// The tools (app/(tools)) are prerendered whole at build, with empty boxes. An address that holds boxes, such as
// /fits?q=25+H7/g6 or a saved result's "Reopen in the calculator", is sent by next.config.mjs's rewrites to the
// page's from-address twin, which renders those boxes on the server, so a shared link shows its result before
// the page's script has run. These are the query keys each page reads its boxes from (tests/unit/tool-addresses.test.ts
// checks them against the pages); a key with an empty value, or one missing here, still reaches the boxes, in
// the browser (components/hooks/use-query-state.ts).

/** @type {Record<string, readonly string[]>} page path → the query keys its boxes come from */
export const TOOL_ADDRESS_KEYS = {
  '/fits': ['q', 'size', 'fit', 'zone', 'unit', 'round'],
  '/calculators/tap-drill': ['thread', 'mode', 'target', 'drill', 'drills'],
  '/calculators/clearance-holes': ['size', 'fit', 'edge', 'spacing', 'unit'],
  '/calculators/drills': ['mode', 'name', 'd', 'unit', 'side'],
  '/calculators/bolt-circle': ['d', 'unit', 'holes', 'start', 'midway'],
  '/calculators/indexing': ['n', 'ratio', 'circles', 'plate'],
  '/calculators/spur-gear': ['teeth', 'by', 'm', 'dp', 'pa'],
  '/calculators/speeds': ['d', 'unit', 'v', 'vunit', 'material', 'tool'],
};

/** The twin that renders an address's boxes on the server. */
export const fromAddressPath = (page) => `${page}/from-address`;

/** One rewrite per page and key: a request whose query holds any of the page's keys goes to its twin. */
export function toolAddressRewrites() {
  return Object.entries(TOOL_ADDRESS_KEYS).flatMap(([page, keys]) =>
    keys.map((key) => ({ source: page, has: [{ type: 'query', key }], destination: fromAddressPath(page) })),
  );
}
