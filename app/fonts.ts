import localFont from 'next/font/local';

// Shipped with the app from the geist npm package: nothing is fetched at build or run time.
export const sans = localFont({
  src: '../node_modules/geist/dist/fonts/geist-sans/Geist-Variable.woff2',
  variable: '--font-geist-sans',
  weight: '100 900',
  // The web font is used when it is there at first paint (preloaded; from the browser's cache on every later page)
  // and never swapped in afterwards: on a slow phone the first page stays in the fallback face instead of moving
  // when the font arrives (lines that wrap differently shifted whole sections: CLS 0.2–0.3 on the phone profile).
  display: 'optional',
  // A fallback face sized to match (Arial with adjusted metrics), so the two faces set text alike.
  adjustFontFallback: 'Arial',
});

export const mono = localFont({
  src: '../node_modules/geist/dist/fonts/geist-mono/GeistMono-Variable.woff2',
  variable: '--font-geist-mono',
  weight: '100 900',
  display: 'optional',
});
