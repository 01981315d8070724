import { requireFinite } from './errors';

// Exact factors from NIST SP 811, Appendix B.8/B.9.
export const MM_PER_IN = 25.4;
export const N_PER_LBF = 4.4482216152605;
export const M_PER_FT = 0.3048;
export const NM_PER_LBF_FT = N_PER_LBF * M_PER_FT;
export const PA_PER_PSI = 6894.757293168;
export const PA_PER_BAR = 1e5;
export const KG_PER_LB = 0.45359237;

export function inToMm(inches: number): number {
  return requireFinite(inches, 'in') * MM_PER_IN;
}

export function mmToIn(mm: number): number {
  return requireFinite(mm, 'mm') / MM_PER_IN;
}

export function lbfFtToNm(lbfFt: number): number {
  return requireFinite(lbfFt, 'lbfFt') * NM_PER_LBF_FT;
}

export function nmToLbfFt(nm: number): number {
  return requireFinite(nm, 'nm') / NM_PER_LBF_FT;
}

export function psiToBar(psi: number): number {
  return (requireFinite(psi, 'psi') * PA_PER_PSI) / PA_PER_BAR;
}

export function barToPsi(bar: number): number {
  return (requireFinite(bar, 'bar') * PA_PER_BAR) / PA_PER_PSI;
}

export function lbToKg(lb: number): number {
  return requireFinite(lb, 'lb') * KG_PER_LB;
}

export function kgToLb(kg: number): number {
  return requireFinite(kg, 'kg') / KG_PER_LB;
}

/** to one decimal place, for figures shown in words */
export const round1 = (x: number) => Math.round(x * 10) / 10;
