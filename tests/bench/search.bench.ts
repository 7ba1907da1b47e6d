/**
 * Times of search on a database (the page benchmark's scale data set: npm run bench:pages leaves it in
 * scribeline_bench): a common word, a two-word query, a fit query, page 5 of the common word, signed
 * out and as the demo builder. Prints a table of median and slowest times; no targets are checked here.
 *
 * Usage: DB_NAME=scribeline_bench npm run bench:search   (BENCH_RUNS, default 15). The react-server condition
 * lets lib/server's server-only guard load outside Next.
 */
import { performance } from 'node:perf_hooks';
import { initModels, User } from '../../db/models';
import { closeSequelize } from '../../db/connection';
import { DEMO_ACCOUNTS } from '../../db/seeders/demo-accounts';
import { search } from '../../lib/server/search';
import type { Actor } from '../../lib/auth/policy';

const RUNS = Number(process.env.BENCH_RUNS ?? 15);
const QUERIES: [string, Record<string, string>][] = [
  ['common word', { q: 'readings' }],
  ['two words', { q: 'fitting readings' }],
  ['common word, page 5', { q: 'readings', page: '5' }],
  ['fit: k6 spigot 130 mm', { q: 'k6 spigot 130 mm' }],
  ['fit: H7 bores between 100 and 150 mm', { q: 'H7 bores between 100 and 150 mm' }],
  ['rare word', { q: 'chatter' }],
];

async function main() {
  if (!(process.env.DB_NAME ?? '').endsWith('_bench')) throw new Error('DB_NAME must name a *_bench database');
  initModels();
  const builder = await User.findOne({ where: { email: DEMO_ACCOUNTS[0].email } });
  const viewers: [string, Actor][] = [['signed out', null], ['demo builder', builder ? { id: builder.id, siteRole: 'member', emailVerified: true } : null]];
  console.log(`search on ${process.env.DB_NAME}, ${RUNS} runs each (after one warm-up)`);
  console.log(['query', 'viewer', 'hits', 'median ms', 'max ms'].join('\t'));
  for (const [name, input] of QUERIES) {
    for (const [who, actor] of viewers) {
      const first = await search(actor, input);
      const times: number[] = [];
      for (let i = 0; i < RUNS; i++) {
        const t = performance.now();
        await search(actor, input);
        times.push(performance.now() - t);
      }
      times.sort((a, b) => a - b);
      console.log([name, who, `${first.hits.length}${first.hasMore ? '+' : ''}`, times[Math.floor(times.length / 2)]!.toFixed(1), times[times.length - 1]!.toFixed(1)].join('\t'));
    }
  }
  await closeSequelize();
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
