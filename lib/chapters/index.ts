// Clip chapters and caption files: pure TypeScript, no React, Next or database (safe in the browser too).
export { formatClock, parseClock, formatVttTimestamp, formatSrtTimestamp } from './clock';
export { toWebVtt, toTimestampList, chapterSpans, chapterTitle, LAST_CHAPTER_FALLBACK_MS, type ChapterNote } from './write';
export { parseWebVtt, parseSrt, parseCaptionFile, type Cue, type CaptionProblem, type CaptionParse, type CaptionFormat } from './captions';
export { momentHref, parseMomentFragment, legacyMomentMs } from './moment';
