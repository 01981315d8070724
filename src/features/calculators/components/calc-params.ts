import { useCallback, useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router';
import { listItems, numberList, readNumber } from '../../../lib/number-text';
import { FitmentInputError } from '@shared/fitment/errors';
import { MM_PER_IN, psiToBar, barToPsi, kgToLb, lbToKg } from '@shared/fitment/units';
import type { UnitSystem } from '@shared/schemas/enums';

/** How an input's text relates to the value kept in the URL (always mm / bar, so a shared link means the same to everyone). */
export type Quantity = 'length' | 'pressure' | 'mass' | 'plain';

export type CalcParams = {
  get: (key: string) => string;
  getAll: (key: string) => string[];
  set: (key: string, value: string) => void;
  setAll: (key: string, values: string[]) => void;
};

/** Calculator inputs live in the query string; typing replaces the entry so Back leaves the page instead of undoing keystrokes. */
export function useCalcParams(): CalcParams {
  const [params, setParams] = useSearchParams();
  // setSearchParams' updater starts from the params of the last render: two edits before the router renders
  // again (a fast typist, autofill, a slow phone) would both start there and the first would be lost. So each
  // edit starts from the newest state asked for, until the router has caught up with it.
  const pending = useRef<URLSearchParams | null>(null);
  const rendered = useRef(params);
  useEffect(() => {
    rendered.current = params;
    if (pending.current?.toString() === params.toString()) pending.current = null;
  }, [params]);
  const update = useCallback(
    (change: (next: URLSearchParams) => void) => {
      const next = new URLSearchParams(pending.current ?? rendered.current);
      change(next);
      pending.current = next;
      setParams(next, { replace: true, preventScrollReset: true });
    },
    [setParams],
  );
  return {
    // reads see the newest state asked for too, so an edit that rewrites a whole list (rows of points) keeps the one before it
    get: (key) => (pending.current ?? params).get(key) ?? '',
    getAll: (key) => (pending.current ?? params).getAll(key),
    set: (key, value) =>
      update((next) => {
        if (value === '') next.delete(key);
        else next.set(key, value);
      }),
    setAll: (key, values) =>
      update((next) => {
        next.delete(key);
        values.forEach((v) => next.append(key, v));
      }),
  };
}

/** A link to one panel, carrying only that panel's inputs. */
export function panelLink(search: string, keys: string[], anchor: string): string {
  const all = new URLSearchParams(search);
  const own = new URLSearchParams();
  for (const key of keys) all.getAll(key).forEach((v) => own.append(key, v));
  const query = own.toString();
  return `${window.location.origin}/tools${query ? `?${query}` : ''}#${anchor}`;
}

const clean = (n: number, digits: number) => String(Number(n.toFixed(digits)));

function convertNumber(text: string, quantity: Quantity, system: UnitSystem, toCanonical: boolean): string {
  const trimmed = text.trim();
  if (quantity === 'plain' || system === 'metric' || trimmed === '') return text;
  const n = readNumber(trimmed) ?? NaN;
  if (!Number.isFinite(n)) return text;
  if (quantity === 'length') return toCanonical ? clean(n * MM_PER_IN, 6) : clean(n / MM_PER_IN, 4);
  if (quantity === 'mass') return toCanonical ? clean(lbToKg(n), 6) : clean(kgToLb(n), 1);
  return toCanonical ? clean(psiToBar(n), 6) : clean(barToPsi(n), 1);
}

function convert(text: string, quantity: Quantity, system: UnitSystem, list: boolean, toCanonical: boolean): string {
  if (!list) return convertNumber(text, quantity, system, toCanonical);
  if (quantity === 'plain' || system === 'metric') return text;
  return listItems(text)
    .map((part) => convertNumber(part, quantity, system, toCanonical))
    .join('; ');
}

export const toCanonical = (text: string, q: Quantity, s: UnitSystem, list = false) => convert(text, q, s, list, true);
export const toDisplay = (canonical: string, q: Quantity, s: UnitSystem, list = false) => convert(canonical, q, s, list, false);

export function unitLabel(quantity: Quantity, system: UnitSystem): string | null {
  if (quantity === 'length') return system === 'metric' ? 'mm' : 'in';
  if (quantity === 'pressure') return system === 'metric' ? 'bar' : 'psi';
  if (quantity === 'mass') return system === 'metric' ? 'kg' : 'lb';
  return null;
}

/**
 * Reads a panel's inputs, collecting per-field reasons and the names of what is still missing,
 * then runs the shared computations and maps any FitmentInputError back to the input it came from.
 */
export class Inputs {
  readonly errors: Record<string, string> = {};
  readonly missing: string[] = [];
  general: string | null = null;

  constructor(private readonly params: CalcParams) {}

  get ready(): boolean {
    return this.missing.length === 0 && Object.keys(this.errors).length === 0 && !this.general;
  }

  number(key: string, label: string, { optional = false } = {}): number {
    const text = this.params.get(key).trim();
    if (text === '') {
      if (!optional) this.missing.push(label);
      return optional ? 0 : NaN;
    }
    const n = readNumber(text) ?? NaN;
    if (!Number.isFinite(n)) this.errors[key] = `Enter a number (got "${text}")`;
    return n;
  }

  list(key: string, label: string): number[] {
    const text = this.params.get(key).trim();
    if (text === '') {
      this.missing.push(label);
      return [];
    }
    const parts = listItems(text);
    const values = numberList(text);
    const bad = parts.find((_, i) => !Number.isFinite(values[i]));
    if (bad !== undefined) this.errors[key] = `"${bad}" is not a number; separate sizes with semicolons or spaces, e.g. 40; 44`;
    return values;
  }

  text(key: string, label: string): string {
    const text = this.params.get(key).trim();
    if (text === '') this.missing.push(label);
    return text;
  }

  /** Runs a computation once the inputs read cleanly; a rejected input is shown beside its field. */
  run<T>(compute: () => T, fieldToKey: (field: string) => string | undefined): T | null {
    if (!this.ready) return null;
    try {
      return compute();
    } catch (error) {
      if (!(error instanceof FitmentInputError)) throw error;
      const key = fieldToKey(error.field);
      const reason = readable(error);
      if (key) this.errors[key] = reason;
      else this.general = reason;
      return null;
    }
  }

  error(key: string): string | undefined {
    return this.errors[key];
  }
}

/** Messages from shared/fitment start with the internal field name; the field's label already says which one. */
export function readable(error: FitmentInputError): string {
  const base = error.field.replace(/\.\d+$/, '');
  let message = error.message;
  for (const prefix of [error.field, base]) {
    if (message.startsWith(prefix)) {
      message = message
        .slice(prefix.length)
        .replace(/^\s*\([^)]*\)/, '')
        .trim();
      break;
    }
  }
  message = message.replace(/\s*\(got [^)]*\)/, '');
  const index = /\.(\d+)$/.exec(error.field);
  if (index && message !== error.message) return `Entry ${Number(index[1]) + 1} ${message}`;
  return message.charAt(0).toUpperCase() + message.slice(1);
}

/** Maps a shared field name (possibly `front.pistonsPerSideMm.1`) onto a query key by its last named part. */
export function byField(map: Record<string, string>): (field: string) => string | undefined {
  return (field) => {
    if (map[field]) return map[field];
    const named = field.split('.').filter((p) => !/^\d+$/.test(p));
    for (let i = 0; i < named.length; i++) {
      const key = map[named.slice(i).join('.')];
      if (key) return key;
    }
    return undefined;
  };
}
