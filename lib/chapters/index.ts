// Clip chapters and caption files: pure TypeScript, no React, Next or database (safe in the browser too).
export { formatClock, parseClock, formatVttTimestamp, formatSrtTimestamp } from './clock';
export { toWebVtt, toTimestampList, chapterSpans, LAST_CHAPTER_FALLBACK_MS } from './write';
export { parseWebVtt, parseSrt, parseCaptionFile, type CaptionProblem } from './captions';
export { momentHref, parseMomentFragment, legacyMomentMs } from './moment';
