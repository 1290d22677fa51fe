/** What an exported file is of: enough for a person to tell two downloads apart. */
export interface ExportNameParts {
  siteName: string;
  planTitle: string;
  planVersion: number;
  /** The revision's number, or null for a draft plan's files (named "draft"). */
  revision: number | null;
  /** When the content was frozen (the revision's submission, or the run's end), ISO 8601. */
  at: string;
  /** The site's IANA time zone: the date is the site's local date. */
  timeZone: string;
  /** What is in the file, e.g. "results", "posts-per-cell-fog-k0.13". */
  what: string;
  /** File extension without the dot. */
  extension: string;
}

/** Characters file systems refuse or treat specially. */
const UNSAFE = /[\\/:*?"<>|]+/g;

/** Control characters (C0 and DEL) to spaces. */
const withoutControls = (text: string) =>
  Array.from(text, (ch) => (ch.charCodeAt(0) < 0x20 || ch.charCodeAt(0) === 0x7f ? ' ' : ch)).join('');

/** A name part: trimmed, unsafe characters and spaces to hyphens, at most 60 characters. */
export function namePart(text: string): string {
  const part = withoutControls(text)
    .normalize('NFC')
    .replace(UNSAFE, '-')
    .replace(/\s+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/^[-.]+|[-.]+$/g, '')
    .slice(0, 60)
    .replace(/[-.]+$/, '');
  return part || 'unnamed';
}

/** The calendar date of an instant in a time zone, YYYY-MM-DD (UTC when the zone is unknown). */
export function localDate(at: string, timeZone: string): string {
  const date = new Date(at);
  try {
    return new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' }).format(date);
  } catch {
    return date.toISOString().slice(0, 10);
  }
}

/**
 * The name of an exported file: site, plan, version, revision, the site's
 * local date of the content and what it holds, e.g.
 * `Harrowmere-Ridge_Summer-network_v2_rev3_2026-07-14_results.csv`.
 * Non-ASCII letters are kept (the Content-Disposition header carries them
 * as RFC 6266 `filename*`, with an ASCII fallback).
 */
export function exportFileName(parts: ExportNameParts): string {
  const revision = parts.revision === null ? 'draft' : `rev${parts.revision}`;
  return (
    [
      namePart(parts.siteName),
      namePart(parts.planTitle),
      `v${parts.planVersion}`,
      revision,
      localDate(parts.at, parts.timeZone),
      namePart(parts.what),
    ].join('_') + `.${parts.extension}`
  );
}
