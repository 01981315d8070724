/** A chassis as readers name it: make, model, code and years, e.g. "Halden H31 (1994–2001)". */
export const chassisLabel = (c: { make: string; model: string; code: string; yearFrom: number; yearTo: number | null }) =>
  `${c.make} ${c.model} (${c.code === c.model ? '' : `${c.code}, `}${c.yearFrom}–${c.yearTo ?? 'on'})`;
