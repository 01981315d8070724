import { FitmentInputError, requireInteger, requirePositive } from './errors';
import { MM_PER_IN } from './units';

export type TyreConstruction = 'R' | 'ZR' | 'D' | 'B';
/** P passenger (US), LT light truck, T temporary spare, ST special trailer */
export type TyrePrefix = 'P' | 'LT' | 'T' | 'ST';

export interface TyreSize {
  widthMm: number;
  aspectRatio: number;
  construction: TyreConstruction;
  rimIn: number;
  loadIndex?: number;
  speedRating?: string;
  /** second index of a pair like 104/102R: per tyre when the axle runs twin tyres */
  dualLoadIndex?: number;
  prefix?: TyrePrefix;
  /** "C" after the rim: commercial (van) tyre */
  commercial?: true;
  /** XL (extra load) or RF (reinforced): the higher load is reached at a higher inflation pressure */
  reinforced?: 'XL' | 'RF';
  /** service description in brackets, e.g. (94Y): rated above the symbol's speed */
  bracketed?: true;
  /** older codes carry the speed letter in the size, e.g. 185/70HR14, 165SR15 */
  speedInSize?: 'S' | 'H' | 'V';
  /** no aspect ratio in the code (e.g. 165SR15): the old series' 82 % is assumed, see IMPLIED_ASPECT_RATIO */
  aspectRatioImplied?: true;
  /** flotation sizes such as 31x10.50R15 give the overall diameter in inches */
  format?: 'flotation';
  overallDiameterIn?: number;
}

export interface TyreGeometry {
  sidewallMm: number;
  diameterMm: number;
  circumferenceMm: number;
  revsPerKm: number;
  revsPerMile: number;
}

export interface SpeedCapability {
  symbol: string;
  kmh: number;
  /** true when the tyre is rated above kmh (ZR sizes without a symbol, bracketed service descriptions, (Y), old VR) */
  above: boolean;
  source: string;
}

export interface TyreLoadCheck {
  /** load index used: the single index, or the dual one when the axle runs twin tyres */
  loadIndex: number;
  capacityPerTyreKg: number;
  tyresOnAxle: number;
  axleCapacityKg: number;
  axleLoadKg: number;
  marginKg: number;
  ok: boolean;
  rule: string;
  source: string;
  note: string | null;
}

const MM_PER_MILE = 1_609_344;

/**
 * Codes without an aspect ratio (165SR15, 185R14C) belong to the old series whose height is 82 % of the width.
 * Source: the "Tire code" reference article, explanation of tyre codes ("if omitted, it is assumed to be 82 %").
 */
export const IMPLIED_ASPECT_RATIO = 82;
export const IMPLIED_ASPECT_SOURCE = 'Tire code reference article (explanation of tyre codes): an omitted aspect ratio is 82 %';

export const SPEED_SYMBOL_SOURCE = 'Speed symbol table of ISO 4000-1 / ETRTO (UN Regulation No. 30), as reprinted in tyre charts';
export const LOAD_INDEX_SOURCE = 'Load index table of ISO 4000-1 / ETRTO, as reprinted in tyre makers’ load index charts';

/** Speed symbol → km/h. Z is not a symbol: it appears only in the size, as ZR (above 240 km/h). */
// prettier-ignore
export const SPEED_SYMBOLS: Readonly<Record<string, number>> = {
  A1: 5, A2: 10, A3: 15, A4: 20, A5: 25, A6: 30, A7: 35, A8: 40,
  B: 50, C: 60, D: 65, E: 70, F: 80, G: 90, J: 100, K: 110, L: 120, M: 130, N: 140,
  P: 150, Q: 160, R: 170, S: 180, T: 190, U: 200, H: 210, V: 240, W: 270, Y: 300,
};

/**
 * Load index → kg per tyre, 60 to 150 (car, van and light-truck range). 135 is 2180 kg: one maker's chart prints 2190,
 * but 2180 kg is what the pound edition of the table (4806 lb) converts to.
 */
// prettier-ignore
export const LOAD_INDEX_KG: Readonly<Record<number, number>> = {
  60: 250, 61: 257, 62: 265, 63: 272, 64: 280, 65: 290, 66: 300, 67: 307, 68: 315, 69: 325,
  70: 335, 71: 345, 72: 355, 73: 365, 74: 375, 75: 387, 76: 400, 77: 412, 78: 425, 79: 437,
  80: 450, 81: 462, 82: 475, 83: 487, 84: 500, 85: 515, 86: 530, 87: 545, 88: 560, 89: 580,
  90: 600, 91: 615, 92: 630, 93: 650, 94: 670, 95: 690, 96: 710, 97: 730, 98: 750, 99: 775,
  100: 800, 101: 825, 102: 850, 103: 875, 104: 900, 105: 925, 106: 950, 107: 975, 108: 1000, 109: 1030,
  110: 1060, 111: 1090, 112: 1120, 113: 1150, 114: 1180, 115: 1215, 116: 1250, 117: 1285, 118: 1320, 119: 1360,
  120: 1400, 121: 1450, 122: 1500, 123: 1550, 124: 1600, 125: 1650, 126: 1700, 127: 1750, 128: 1800, 129: 1850,
  130: 1900, 131: 1950, 132: 2000, 133: 2060, 134: 2120, 135: 2180, 136: 2240, 137: 2300, 138: 2360, 139: 2430,
  140: 2500, 141: 2575, 142: 2650, 143: 2725, 144: 2800, 145: 2900, 146: 3000, 147: 3075, 148: 3150, 149: 3250,
  150: 3350,
};
export const LOAD_INDEX_RANGE = { min: 60, max: 150 } as const;
const HIGHEST_LOAD_INDEX = 279;

// Old speed letters inside the size: SR and HR as today's S and H; VR meant above 210 km/h (from memory).
const SIZE_SPEED: Record<'S' | 'H' | 'V', { kmh: number; above: boolean; source: string }> = {
  S: { kmh: 180, above: false, source: SPEED_SYMBOL_SOURCE },
  H: { kmh: 210, above: false, source: SPEED_SYMBOL_SOURCE },
  V: { kmh: 210, above: true, source: 'older VR sizes: above 210 km/h (from memory)' },
};

const EXAMPLE = 'like 225/45R17, 225/45ZR17 94W, LT265/75R16 123/120Q, 195/70R15C 104/102R, 165SR15 or 31x10.50R15';

// Sizes, each anchored at the start and followed by the end or a space.
const PREFIX = String.raw`(LT|ST|P|T)?\s*`;
const RIM = String.raw`(\d{1,2}(?:\.\d)?)`;
const METRIC = new RegExp(String.raw`^${PREFIX}(\d{3})\s*\/\s*(\d{2})\s*([SHV])?\s*(ZR|R|D|B)\s*${RIM}(C)?(?=\s|$)`);
const OLD_SERIES = new RegExp(String.raw`^${PREFIX}(\d{3})\s*([SHV])?\s*(R)\s*${RIM}(C)?(?=\s|$)`);
const FLOTATION = new RegExp(
  String.raw`^${PREFIX}(\d{2}(?:[.,]\d)?)\s*X\s*(\d{1,2}(?:[.,]\d{1,2})?)\s*(R|D|B|-)\s*${RIM}\s*(LT)?(?=\s|$)`,
);
const REINFORCED = /(?:^|\s)(XL|RF|REINF(?:ORCED)?|EXTRA LOAD)(?=\s|$)/;
// 94W, 104/102R, 94 W, 93(Y), (94Y), (Y), 94, W
const SERVICE = /^(?:\((\d{2,3})(?:\/(\d{2,3}))?\s*([A-Z]\d?)\)|(\d{2,3})?(?:\/(\d{2,3}))?\s*(\(Y\)|[A-Z]\d?)?)$/;

function codeError(message: string): FitmentInputError {
  return new FitmentInputError('code', message);
}

function decimal(text: string): number {
  return Number(text.replace(',', '.'));
}

function checkLoadIndex(index: number): number {
  if (index > HIGHEST_LOAD_INDEX) throw codeError(`Load index ${index} is above the highest index, ${HIGHEST_LOAD_INDEX}`);
  return index;
}

function checkSpeedSymbol(symbol: string): string {
  if (symbol === '(Y)') return symbol;
  if (SPEED_SYMBOLS[symbol] === undefined) {
    const why = symbol === 'Z' ? ' (Z belongs in the size, as ZR)' : '';
    throw codeError(`"${symbol}" is not a speed symbol${why}; the published table runs A1–A8, B–H, J–N, P–W and Y`);
  }
  return symbol;
}

function parseService(rest: string, size: TyreSize): void {
  if (rest === '') return;
  const match = SERVICE.exec(rest.replace(/\s+/g, ' ').replace(/\s*\/\s*/g, '/'));
  if (!match || rest === '()') throw codeError(`"${rest}" is not a service description like 94W, 104/102R or (94Y)`);
  const [, bLoad, bDual, bSpeed, load, dual, speed] = match;
  if (bLoad !== undefined) {
    size.loadIndex = checkLoadIndex(Number(bLoad));
    if (bDual !== undefined) size.dualLoadIndex = checkLoadIndex(Number(bDual));
    size.speedRating = checkSpeedSymbol(bSpeed);
    size.bracketed = true;
  } else {
    if (dual !== undefined && load === undefined) throw codeError(`"${rest}" has a second load index without a first`);
    if (load !== undefined) size.loadIndex = checkLoadIndex(Number(load));
    if (dual !== undefined) size.dualLoadIndex = checkLoadIndex(Number(dual));
    if (speed !== undefined) size.speedRating = checkSpeedSymbol(speed);
  }
  if (size.dualLoadIndex !== undefined && size.dualLoadIndex > size.loadIndex!) {
    throw codeError(`The twin-tyre load index (${size.dualLoadIndex}) cannot exceed the single one (${size.loadIndex})`);
  }
}

function checkMetric(widthMm: number, aspectRatio: number, rimIn: number): void {
  if (widthMm < 100 || widthMm > 500) throw codeError(`Section width ${widthMm} mm is outside 100–500 mm`);
  if (aspectRatio < 20 || aspectRatio > 100) throw codeError(`Aspect ratio ${aspectRatio} is outside 20–100`);
  if (rimIn < 8 || rimIn > 30) throw codeError(`Rim diameter ${rimIn} in is outside 8–30 in`);
}

function withPrefix(size: TyreSize, prefix: string | undefined): TyreSize {
  if (prefix) size.prefix = prefix as TyrePrefix;
  return size;
}

function parseSize(text: string): { size: TyreSize; rest: string } | null {
  let m = METRIC.exec(text);
  if (m) {
    const [all, prefix, width, aspect, speedLetter, construction, rim, c] = m;
    const size: TyreSize = {
      widthMm: Number(width),
      aspectRatio: Number(aspect),
      construction: construction as TyreConstruction,
      rimIn: Number(rim),
    };
    checkMetric(size.widthMm, size.aspectRatio, size.rimIn);
    if (speedLetter) {
      if (construction !== 'R') throw codeError(`A speed letter in the size goes with R (e.g. 185/70HR14), not ${construction}`);
      size.speedInSize = speedLetter as 'S' | 'H' | 'V';
    }
    if (c) size.commercial = true;
    return { size: withPrefix(size, prefix), rest: text.slice(all.length) };
  }
  m = OLD_SERIES.exec(text);
  if (m) {
    const [all, prefix, width, speedLetter, , rim, c] = m;
    const size: TyreSize = { widthMm: Number(width), aspectRatio: IMPLIED_ASPECT_RATIO, construction: 'R', rimIn: Number(rim) };
    checkMetric(size.widthMm, size.aspectRatio, size.rimIn);
    size.aspectRatioImplied = true;
    if (speedLetter) size.speedInSize = speedLetter as 'S' | 'H' | 'V';
    if (c) size.commercial = true;
    return { size: withPrefix(size, prefix), rest: text.slice(all.length) };
  }
  m = FLOTATION.exec(text);
  if (m) {
    const [all, prefix, diameter, width, construction, rim, lt] = m;
    const overallDiameterIn = decimal(diameter);
    const widthIn = decimal(width);
    const rimIn = Number(rim);
    if (overallDiameterIn < 20 || overallDiameterIn > 60)
      throw codeError(`Overall diameter ${overallDiameterIn} in is outside 20–60 in`);
    if (widthIn < 5 || widthIn > 25) throw codeError(`Section width ${widthIn} in is outside 5–25 in`);
    if (rimIn < 10 || rimIn > 30) throw codeError(`Rim diameter ${rimIn} in is outside 10–30 in`);
    if (overallDiameterIn <= rimIn) throw codeError(`A ${overallDiameterIn} in tyre cannot fit a ${rimIn} in rim`);
    if (prefix && lt && prefix !== 'LT') throw codeError(`"${prefix}" and "LT" cannot both describe one tyre`);
    const sidewallIn = (overallDiameterIn - rimIn) / 2;
    const size: TyreSize = {
      widthMm: widthIn * MM_PER_IN,
      aspectRatio: (sidewallIn / widthIn) * 100,
      construction: construction === '-' ? 'D' : (construction as TyreConstruction),
      rimIn,
      format: 'flotation',
      overallDiameterIn,
    };
    return { size: withPrefix(size, prefix ?? lt), rest: text.slice(all.length) };
  }
  return null;
}

/** Every size code a car wears, with its service description and load marks; see EXAMPLE for the forms. */
export function parseTyreSize(code: string): TyreSize {
  if (typeof code !== 'string') throw codeError(`Tyre size must be text ${EXAMPLE}`);
  let text = code.trim().replace(/\s+/g, ' ').toUpperCase();
  let reinforced: TyreSize['reinforced'];
  const mark = REINFORCED.exec(text);
  if (mark) {
    reinforced = mark[1] === 'XL' || mark[1] === 'EXTRA LOAD' ? 'XL' : 'RF';
    text = (text.slice(0, mark.index) + text.slice(mark.index + mark[0].length)).trim();
    if (REINFORCED.test(text)) throw codeError('Give XL or RF once');
  }
  const parsed = parseSize(text);
  if (!parsed) throw codeError(`"${code}" is not a tyre size ${EXAMPLE}`);
  const { size, rest } = parsed;
  try {
    parseService(rest.trim(), size);
  } catch (error) {
    if (error instanceof FitmentInputError && !/is not a service description/.test(error.message)) throw error;
    throw codeError(`"${code}" is not a tyre size ${EXAMPLE}`);
  }
  if (reinforced) size.reinforced = reinforced;
  return size;
}

/** Nominal, unloaded geometry; load index and speed rating do not change it. */
export function tyreGeometry(codeOrParsed: string | TyreSize): TyreGeometry {
  const size = typeof codeOrParsed === 'string' ? parseTyreSize(codeOrParsed) : codeOrParsed;
  if (size === null || typeof size !== 'object') {
    throw new FitmentInputError('code', `Give a tyre size ${EXAMPLE}`);
  }
  const rimIn = requirePositive(size.rimIn, 'rimIn');
  let sidewallMm: number;
  if (size.format === 'flotation') {
    // Flotation sizes state the overall diameter itself.
    const overallIn = requirePositive(size.overallDiameterIn, 'overallDiameterIn');
    if (overallIn <= rimIn) {
      throw new FitmentInputError('overallDiameterIn', `overallDiameterIn (${overallIn}) must exceed rimIn (${rimIn})`);
    }
    sidewallMm = ((overallIn - rimIn) / 2) * MM_PER_IN;
  } else {
    const widthMm = requirePositive(size.widthMm, 'widthMm');
    const aspectRatio = requirePositive(size.aspectRatio, 'aspectRatio');
    if (aspectRatio > 100) {
      throw new FitmentInputError('aspectRatio', `aspectRatio must be at most 100 (got ${aspectRatio})`);
    }
    sidewallMm = (widthMm * aspectRatio) / 100;
  }
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

/** km/h of a speed symbol from the published table; anything else is not a speed symbol. */
export function speedSymbolKmh(symbol: string): number {
  const key = typeof symbol === 'string' ? symbol.trim().toUpperCase() : '';
  const kmh = SPEED_SYMBOLS[key];
  if (kmh === undefined)
    throw new FitmentInputError('speedSymbol', `"${String(symbol)}" is not a speed symbol from the published table`);
  return kmh;
}

/** kg per tyre for a load index, from the published table (60–150 carried here). */
export function loadIndexKg(index: number): number {
  const n = requireInteger(index, 'loadIndex', 0, HIGHEST_LOAD_INDEX);
  const kg = LOAD_INDEX_KG[n];
  if (kg === undefined) {
    throw new FitmentInputError(
      'loadIndex',
      `Load index ${n} is outside the car, van and light-truck range carried here (${LOAD_INDEX_RANGE.min}–${LOAD_INDEX_RANGE.max})`,
    );
  }
  return kg;
}

/** What the code says about speed; null when it says nothing. */
export function speedCapability(size: TyreSize): SpeedCapability | null {
  const symbol = size.speedRating;
  if (symbol === '(Y)') return { symbol, kmh: SPEED_SYMBOLS.Y, above: true, source: SPEED_SYMBOL_SOURCE };
  if (symbol !== undefined) {
    return { symbol, kmh: speedSymbolKmh(symbol), above: Boolean(size.bracketed), source: SPEED_SYMBOL_SOURCE };
  }
  if (size.speedInSize) {
    const old = SIZE_SPEED[size.speedInSize];
    return { symbol: `${size.speedInSize}R`, kmh: old.kmh, above: old.above, source: old.source };
  }
  if (size.construction === 'ZR') return { symbol: 'ZR', kmh: 240, above: true, source: SPEED_SYMBOL_SOURCE };
  return null;
}

export const LOAD_RULE =
  'The tyres on an axle must together carry the axle load: capacity per tyre (load index table) × tyres on the axle ≥ axle load';

/**
 * Load check of one axle: single tyres use the first load index, twin tyres (4 on the axle) the second of a pair.
 * The capacity holds at the tyre's reference inflation pressure; it carries less below it.
 */
export function tyreLoadCheck(input: { size: TyreSize | string; axleLoadKg: number; tyresOnAxle?: number }): TyreLoadCheck {
  const size = typeof input?.size === 'string' ? parseTyreSize(input.size) : input?.size;
  if (size === null || typeof size !== 'object') throw new FitmentInputError('code', `Give a tyre size ${EXAMPLE}`);
  const axleLoadKg = requirePositive(input.axleLoadKg, 'axleLoadKg');
  const tyresOnAxle = requireInteger(input.tyresOnAxle ?? 2, 'tyresOnAxle', 2, 4);
  if (tyresOnAxle === 3) throw new FitmentInputError('tyresOnAxle', 'An axle runs 2 tyres, or 4 as twins');
  if (size.loadIndex === undefined)
    throw new FitmentInputError('code', 'The code has no load index: add the service description, e.g. 94W');
  const twin = tyresOnAxle === 4;
  const loadIndex = twin ? (size.dualLoadIndex ?? size.loadIndex) : size.loadIndex;
  const capacityPerTyreKg = loadIndexKg(loadIndex);
  const axleCapacityKg = capacityPerTyreKg * tyresOnAxle;
  const marginKg = axleCapacityKg - axleLoadKg;
  const notes: string[] = [];
  if (twin && size.dualLoadIndex === undefined) notes.push('No twin-tyre index in the code; the single index is used.');
  if (size.reinforced) notes.push(`${size.reinforced} tyres reach this load only at their higher reinforced inflation pressure.`);
  if (size.bracketed)
    notes.push('A bracketed service description gives the load at the symbol’s speed; above it the maker’s figures apply.');
  return {
    loadIndex,
    capacityPerTyreKg,
    tyresOnAxle,
    axleCapacityKg,
    axleLoadKg,
    marginKg,
    ok: marginKg >= 0,
    rule: LOAD_RULE,
    source: LOAD_INDEX_SOURCE,
    note: notes.length ? notes.join(' ') : null,
  };
}
