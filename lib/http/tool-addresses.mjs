// The tools (app/(tools)) are prerendered whole at build, with empty boxes. An address that holds boxes, such as
// /fits?q=25+H7/g6 or a saved result's "Reopen in the calculator", goes to the page's from-address twin, which
// renders those boxes on the server, so a shared link shows its result before the page's script has run. These
// are the query keys each page reads its boxes from (tests/unit/tool-addresses.test.ts checks them against the
// pages, and proxy.ts's matcher, which must be written out literally, against this table); a key with an empty
// value, or one missing here, still reaches the boxes, in the browser (components/hooks/use-query-state.ts).
// Two steps, because a rewrite can ask for one query key only and Next reads every rewrite again (compiling its
// path) while preparing each page's render, so one rule per page and key (41) cost every cached read of every
// page about a tenth of its time: proxy.ts, run only for a tool's address with one of its keys, marks the request
// with TOOL_BOXES_HEADER, and two rewrites in next.config.mjs send a marked request to its twin. (A rewrite
// returned by the proxy itself is the slow kind: DEVELOPERS.md, "Trap: rewriting from proxy.ts".)

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

/** The request header proxy.ts sets on a tool's address that holds boxes (its value does not matter). */
export const TOOL_BOXES_HEADER = 'x-scribeline-boxes';

/** Whether a read of `page` holds boxes: one of the page's keys with a value. */
export function holdsBoxes(page, search) {
  const keys = TOOL_ADDRESS_KEYS[page];
  return Boolean(keys?.some((key) => search.getAll(key).some((value) => value !== '')));
}

/** The rewrites of a marked request to its page's twin (an unknown calculator's twin is the site's 404). */
export function toolAddressRewrites() {
  const has = [{ type: 'header', key: TOOL_BOXES_HEADER }];
  return [
    { source: '/fits', has, destination: fromAddressPath('/fits') },
    { source: '/calculators/:slug', has, destination: fromAddressPath('/calculators/:slug') },
  ];
}
