/** Line colours for conditions, in request order; each also gets its own dash so colour is not the only cue. */
export const CONDITION_STYLES = [
  { color: '#B8461B', dash: undefined },
  { color: '#2F5C44', dash: '8 4' },
  { color: '#3B4C8C', dash: '2 4' },
  { color: '#7A3E6E', dash: '10 3 2 3' },
  { color: '#8A6A12', dash: '4 2' },
  { color: '#17252B', dash: '12 6' },
] as const;

export const conditionStyle = (i: number) => CONDITION_STYLES[i % CONDITION_STYLES.length]!;
