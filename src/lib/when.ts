/**
 * Times as the pages and reports show them: to the minute, in UTC ("2026-12-03 14:05"), the same for every
 * reader wherever they are. Seconds are cut, not rounded, so a time never reads later than it was.
 */
export const utcMinute = (d: Date | string) => new Date(d).toISOString().slice(0, 16).replace('T', ' ');

/** `utcMinute` with its zone written out, where nothing else on the page says it. */
export const utcMinuteLabelled = (d: Date | string) => `${utcMinute(d)} UTC`;
