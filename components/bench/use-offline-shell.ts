'use client';

import { useEffect, useState } from 'react';

/** unsupported: no service workers here; preparing: keeping the page; ready: it opens without a connection. */
export type ShellState = 'unsupported' | 'preparing' | 'ready';

const MEMBER_KEY = 'scribeline-bench:shell-member';

function activated(w: ServiceWorker | null): Promise<ServiceWorker | null> {
  if (!w) return Promise.resolve(null);
  return new Promise((resolve) => {
    const check = () => {
      if (w.state === 'activated') resolve(w);
      else if (w.state === 'redundant') resolve(null);
    };
    w.addEventListener('statechange', check);
    check();
  });
}

/**
 * Registers the bench view's service worker (scope /bench) and asks it to keep this page and the static
 * files it loaded before the worker took it over, so the next visit opens offline. A different member on the
 * same phone first has the kept pages forgotten.
 */
export function useOfflineShell(memberId: number): ShellState {
  const [state, setState] = useState<ShellState>('preparing');
  useEffect(() => {
    if (!('serviceWorker' in navigator) || !window.isSecureContext) {
      setState('unsupported');
      return;
    }
    let live = true;
    const onMessage = (e: MessageEvent) => {
      if (live && (e.data as { type?: string } | null)?.type === 'kept') setState('ready');
    };
    navigator.serviceWorker.addEventListener('message', onMessage);
    // Messages from a worker wait in a queue until this is called (setting onmessage would do it too).
    navigator.serviceWorker.startMessages();
    (async () => {
      try {
        const reg = await navigator.serviceWorker.register('/bench-worker.js', { scope: '/bench' });
        // Waits on the registration itself: `ready` never settles for a page reached by a client-side navigation
        // from outside the scope.
        const worker = reg.active ?? (await activated(reg.installing ?? reg.waiting));
        if (!worker || !live) return;
        const forget = localStorage.getItem(MEMBER_KEY) !== String(memberId);
        localStorage.setItem(MEMBER_KEY, String(memberId));
        const urls = new Set<string>([location.pathname, '/bench']);
        for (const e of performance.getEntriesByType('resource')) urls.add(e.name);
        document.querySelectorAll<HTMLScriptElement>('script[src]').forEach((s) => urls.add(s.src));
        document.querySelectorAll<HTMLLinkElement>('link[rel="stylesheet"], link[rel="preload"], link[rel="icon"], link[rel="manifest"]').forEach((l) => urls.add(l.href));
        worker.postMessage({ type: 'keep', urls: [...urls], forget });
      } catch {
        if (live) setState('unsupported');
      }
    })();
    return () => {
      live = false;
      navigator.serviceWorker.removeEventListener('message', onMessage);
    };
  }, [memberId]);
  return state;
}
