import { FitmentInputError, requirePositive } from './errors';
import { MM_PER_IN } from './units';

export type TyreConstruction = 'R' | 'ZR' | 'D' | 'B';

export interface TyreSize {
  widthMm: number;
  aspectRatio: number;
  construction: TyreConstruction;
  rimIn: number;
  loadIndex?: number;
  speedRating?: string;
}

export interface TyreGeometry {
  sidewallMm: number;
  diameterMm: number;
  circumferenceMm: number;
  revsPerKm: number;
  revsPerMile: number;
}

const MM_PER_MILE = 1_609_344;

// Metric designation: [P]width/aspect construction rim [load index][speed rating].
// Speed-rating letters skip I, O and X; "(Y)" marks the open-ended top rating.
const TYRE_CODE = /^P?\s*(\d{3})\s*\/\s*(\d{2})\s*(ZR|R|D|B)\s*(\d{1,2}(?:\.\d)?)(?:\s+(\d{2,3})?\s*(\(Y\)|[A-HJ-NP-WYZ])?)?$/;

const EXAMPLE = 'like 225/45R17 or 225/45ZR17 94W';

export function parseTyreSize(code: string): TyreSize {
  if (typeof code !== 'string') throw new FitmentInputError('code', `Tyre size must be text ${EXAMPLE}`);
  const normalized = code.trim().replace(/\s+/g, ' ').toUpperCase();
  const match = TYRE_CODE.exec(normalized);
  if (!match) throw new FitmentInputError('code', `"${code}" is not a tyre size ${EXAMPLE}`);
  const [, width, aspect, construction, rim, load, speed] = match;

  const widthMm = Number(width);
  const aspectRatio = Number(aspect);
  const rimIn = Number(rim);
  if (widthMm < 100 || widthMm > 500) {
    throw new FitmentInputError('code', `Section width ${widthMm} mm is outside 100–500 mm`);
  }
  if (aspectRatio < 20 || aspectRatio > 100) {
    throw new FitmentInputError('code', `Aspect ratio ${aspectRatio} is outside 20–100`);
  }
  if (rimIn < 8 || rimIn > 30) {
    throw new FitmentInputError('code', `Rim diameter ${rimIn} in is outside 8–30 in`);
  }

  const size: TyreSize = { widthMm, aspectRatio, construction: construction as TyreConstruction, rimIn };
  if (load !== undefined) {
    const loadIndex = Number(load);
    if (loadIndex > 279) throw new FitmentInputError('code', `Load index ${loadIndex} is above the highest index, 279`);
    size.loadIndex = loadIndex;
  }
  if (speed !== undefined) size.speedRating = speed;
  return size;
}

/** Nominal, unloaded geometry; load index and speed rating do not change it. */
export function tyreGeometry(codeOrParsed: string | TyreSize): TyreGeometry {
  const size = typeof codeOrParsed === 'string' ? parseTyreSize(codeOrParsed) : codeOrParsed;
  if (size === null || typeof size !== 'object') {
    throw new FitmentInputError('code', `Give a tyre size ${EXAMPLE}`);
  }
  const widthMm = requirePositive(size.widthMm, 'widthMm');
  const aspectRatio = requirePositive(size.aspectRatio, 'aspectRatio');
  const rimIn = requirePositive(size.rimIn, 'rimIn');
  if (aspectRatio > 100) {
    throw new FitmentInputError('aspectRatio', `aspectRatio must be at most 100 (got ${aspectRatio})`);
  }

  const sidewallMm = (widthMm * aspectRatio) / 100;
  const diameterMm = rimIn * MM_PER_IN + 2 * sidewallMm;
  const circumferenceMm = Math.PI * diameterMm;
  return {
    sidewallMm,
    diameterMm,
    circumferenceMm,
    revsPerKm: 1e6 / circumferenceMm,
    revsPerMile: MM_PER_MILE / circumferenceMm,
  };
}
