type Named = { make: string; model: string; code: string };

/** The code says nothing the model does not already say ("Halden H31", code H31). */
export const codeRepeatsModel = (c: Named) => c.model.toLowerCase().split(/\s+/).includes(c.code.toLowerCase());

/** A chassis by name, the code after it only where it adds something: "Halden H31", "Orsino Vela · V3". */
export const chassisName = (c: Named) => `${c.make} ${c.model}${codeRepeatsModel(c) ? '' : ` · ${c.code}`}`;

/** A chassis as readers name it: make, model, code and years, e.g. "Halden H31 (1994–2001)", "Orsino Vela (V3, 1998–2005)". */
export const chassisLabel = (c: Named & { yearFrom: number; yearTo: number | null }) =>
  `${c.make} ${c.model} (${codeRepeatsModel(c) ? '' : `${c.code}, `}${c.yearFrom}–${c.yearTo ?? 'on'})`;
