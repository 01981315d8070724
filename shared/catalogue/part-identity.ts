import { normalisePartNumber } from '../search/normalise';

// Two part records are the same part when the same maker gave them the same number, however each was
// written: "OV-355-104-L", "ov 355.104/l" and "OV355104L" are one number, "Northgate Fabrication" and
// "northgate-fabrication" one maker. The rule is the search's part-number rule, applied to both.

/** A maker's name without case, accents or separators (spaces, dashes, dots, slashes and the like). */
export const normaliseMaker = (maker: string): string => normalisePartNumber(maker);

/** The key two records share when they are the same part, or null when maker or number is missing. */
export function partIdentityKey(maker: string, partNumber: string): string | null {
  const m = normaliseMaker(maker);
  const n = normalisePartNumber(partNumber);
  return m && n ? `${m}|${n}` : null;
}
