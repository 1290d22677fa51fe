/**
 * Default bearing uncertainties by instrument, one standard deviation in
 * degrees, offered when a report is written; anyone may type their own.
 * Common practice, no source: a sight on a fixed, oriented mount (the
 * sighting ring of a fire lookout, a pelorus, a surveying instrument) is read
 * to about half a degree; a hand-held compass to 1–2°; a bearing estimated
 * from a map or a landmark is worse (values from memory).
 */
export const BEARING_INSTRUMENTS = [
  { key: 'mounted-sight', label: 'Mounted sight (fixed, oriented)', sigmaDeg: 0.5 },
  { key: 'hand-compass', label: 'Hand compass', sigmaDeg: 1.5 },
  { key: 'estimated', label: 'Estimated by eye from landmarks', sigmaDeg: 5 },
] as const;

export type BearingInstrument = (typeof BEARING_INSTRUMENTS)[number]['key'];
