/** The page benchmark seeds and serves its own database only: never the app's or the tests'. */
export function guardBenchDatabase(name = process.env.DB_NAME ?? '', host = process.env.DB_HOST ?? '127.0.0.1'): void {
  if (!/^[a-z0-9_]+_bench$/.test(name) || !['127.0.0.1', 'localhost'].includes(host)) {
    throw new Error(`Refusing to run the page benchmark against database "${name}" on ${host}: it needs its own database ending in _bench on 127.0.0.1 (scribeline_bench).`);
  }
}
