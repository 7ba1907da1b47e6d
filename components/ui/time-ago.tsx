'use client';

import { useEffect, useState } from 'react';
import { formatDistanceStrict } from 'date-fns';
import { formatDay } from '@/lib/format';

/**
 * "3 days ago", worked out in the browser: a page kept in the cache for everyone would otherwise say what was
 * true when it was built. Before that (and in the HTML) the day itself, by its UTC date so the server and
 * the browser agree.
 */
export function TimeAgo({ iso }: { iso: string }) {
  const [now, setNow] = useState<number | null>(null);
  useEffect(() => {
    setNow(Date.now());
    const timer = window.setInterval(() => setNow(Date.now()), 60_000);
    return () => window.clearInterval(timer);
  }, []);
  const day = formatDay(iso.slice(0, 10));
  return (
    <time dateTime={iso} title={day}>
      {now === null ? day : formatDistanceStrict(new Date(iso), now, { addSuffix: true })}
    </time>
  );
}
