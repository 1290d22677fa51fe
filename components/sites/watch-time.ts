import { DateTime } from 'luxon';

/** How watch times are typed and shown: the site's local time, to the minute. */
export const WATCH_TIME_FORMAT = 'yyyy-MM-dd HH:mm';

/** Reads "2026-12-03 08:00" in the site's time zone; null when it is not such a time. */
export function parseWatchTime(text: string, timeZone: string): string | null {
  const t = DateTime.fromFormat(text.trim(), WATCH_TIME_FORMAT, { zone: timeZone });
  return t.isValid ? t.toUTC().toISO() : null;
}

/** Shows an instant in the site's time zone, e.g. "Thu 3 Dec 08:00". */
export function showWatchTime(iso: string, timeZone: string): string {
  return DateTime.fromISO(iso, { zone: 'utc' }).setZone(timeZone).toFormat('ccc d LLL HH:mm');
}

/** The start of today in the site's time zone and seven days on, as ISO instants. */
export function weekFrom(timeZone: string, offsetDays = 0): { from: string; to: string; days: string[] } {
  const start = DateTime.now().setZone(timeZone).startOf('day').plus({ days: offsetDays });
  const days = Array.from({ length: 7 }, (_, i) => start.plus({ days: i }).toFormat('ccc d'));
  return { from: start.toUTC().toISO()!, to: start.plus({ days: 7 }).toUTC().toISO()!, days };
}
