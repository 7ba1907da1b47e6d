import localFont from 'next/font/local';

// Shipped with the app from the geist npm package: nothing is fetched at build or run time.
export const sans = localFont({
  src: '../node_modules/geist/dist/fonts/geist-sans/Geist-Variable.woff2',
  variable: '--font-geist-sans',
  weight: '100 900',
  display: 'swap',
  // A fallback face sized to match (Arial with adjusted metrics), so text does not move when the web font arrives.
  adjustFontFallback: 'Arial',
});

export const mono = localFont({
  src: '../node_modules/geist/dist/fonts/geist-mono/GeistMono-Variable.woff2',
  variable: '--font-geist-mono',
  weight: '100 900',
  display: 'swap',
});
