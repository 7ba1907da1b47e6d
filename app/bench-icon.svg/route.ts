import { BENCH_ICON_SVG } from '@/components/bench/bench-icon';

// The bench view's home-screen icon: a caliper's jaws closing on a scribed line, in layout-dye blue.
export function GET(): Response {
  return new Response(BENCH_ICON_SVG, { headers: { 'content-type': 'image/svg+xml', 'cache-control': 'public, max-age=86400' } });
}
