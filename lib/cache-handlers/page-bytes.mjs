// A cached page's HTML handed back to Next as bytes rather than as a string. Next writes a string answer with
// res.end(string), which encodes the whole page to UTF-8 again on every read: for the heavy entry (310 KB) that
// was about 1 ms of the server's 2–2.8 ms per cached read, and a string costs the same whether it is ASCII or not.
// Next's page result takes a Buffer as well (it streams it instead of sending a Content-Length), so the page
// cache handlers give the bytes: encoded once per stored page, never per read. DEVELOPERS.md, "Reading a page".

const APP_PAGE = 'APP_PAGE';

/** A page value with its HTML as a Buffer, made once per stored value (the in-memory cache hands back the same one). */
const encoded = new WeakMap();

/** `data` ({ value, ... } from a route cache handler's get) with a page's HTML as a Buffer; anything else as it was. */
export function withPageBytes(data) {
  const value = data?.value;
  if (!holdsText(value)) return data;
  let bytes = encoded.get(value);
  if (!bytes) {
    bytes = pageValueAsBytes(value);
    encoded.set(value, bytes);
  }
  return { ...data, value: bytes };
}

/** A page value about to be stored, its HTML as a Buffer (a store that serializes keeps the bytes, not the string). */
export function pageValueAsBytes(value) {
  if (!holdsText(value)) return value;
  return { ...value, html: Buffer.from(value.html, 'utf8') };
}

function holdsText(value) {
  return value?.kind === APP_PAGE && typeof value.html === 'string';
}
