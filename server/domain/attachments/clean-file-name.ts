// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001F\u007F]/g;

/** Longest name kept, in characters (the column holds 255). */
export const FILE_NAME_MAX = 200;

/**
 * The uploader's file name made safe to store and to send back in a
 * Content-Disposition header: folders dropped (some clients send a path),
 * control characters removed, surrounding space and dots trimmed, shortened
 * to {@link FILE_NAME_MAX} characters keeping the extension. An empty result
 * becomes `fallback`.
 *
 * @param name - the name the client sent (may be empty)
 * @param fallback - used when nothing is left (default `upload`)
 *
 * Source: RFC 7578, 4.2 (a file name in form data may carry a path; the
 * receiver should drop it) and RFC 6266, 4.3 (recipients strip folders).
 *
 * @example
 * cleanFileName('C:\\Users\\crew\\north.jpg'); // 'north.jpg'
 */
export function cleanFileName(name: string, fallback = 'upload'): string {
  const base = (name.split(/[/\\]/).pop() ?? '').replace(CONTROL, '').trim().replace(/^\.+/, '');
  if (!base) return fallback;
  const chars = [...base];
  if (chars.length <= FILE_NAME_MAX) return base;
  const dot = base.lastIndexOf('.');
  const extension = dot > 0 && base.length - dot <= 10 ? base.slice(dot) : '';
  return chars.slice(0, FILE_NAME_MAX - [...extension].length).join('') + extension;
}
