import type { MetadataRoute } from 'next';

// The home-screen app: it opens on the bench view (the phone at the machine), which works without a connection.
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: '/bench',
    name: 'Scribeline at the bench',
    short_name: 'Bench',
    description: 'Readings, cuts, photos and the session timer at the machine, with or without a connection.',
    start_url: '/bench',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    background_color: '#f7f4ec',
    theme_color: '#1d3f8f',
    icons: [
      { src: '/bench-icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
      { src: '/bench-icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'maskable' },
    ],
  };
}
