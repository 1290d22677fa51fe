/** A moment as planners read it: "2 Dec 2026, 14:05" in the device's time zone. */
export const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
