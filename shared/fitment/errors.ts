/** Thrown for input no computation can use; `field` names the offending input (dotted path for nested values). */
export class FitmentInputError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = 'FitmentInputError';
    this.field = field;
  }
}

function shown(value: unknown): string {
  if (typeof value === 'number') return String(value);
  if (value === null) return 'null';
  return typeof value;
}

export function requireFinite(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new FitmentInputError(field, `${field} must be a finite number (got ${shown(value)})`);
  }
  return value;
}

export function requirePositive(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n <= 0) throw new FitmentInputError(field, `${field} must be greater than 0 (got ${n})`);
  return n;
}

export function requireNonNegative(value: unknown, field: string): number {
  const n = requireFinite(value, field);
  if (n < 0) throw new FitmentInputError(field, `${field} must not be negative (got ${n})`);
  return n;
}

export function requireInteger(value: unknown, field: string, min: number, max = Number.MAX_SAFE_INTEGER): number {
  const n = requireFinite(value, field);
  if (!Number.isSafeInteger(n)) throw new FitmentInputError(field, `${field} must be a whole number (got ${n})`);
  if (n < min || n > max) {
    const range = max === Number.MAX_SAFE_INTEGER ? `at least ${min}` : `between ${min} and ${max}`;
    throw new FitmentInputError(field, `${field} must be ${range} (got ${n})`);
  }
  return n;
}
