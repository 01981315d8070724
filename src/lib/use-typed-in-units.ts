import { useCallback, useState, type SetStateAction } from 'react';
import type { UnitSystem } from '@shared/schemas/enums';
import { textInSystem, type Quantity } from './quantity-text';
import { useUnits } from './units';

/**
 * A small form's typed text, with the figures of a quantity converted when the units toggle flips,
 * so 0.4 typed in inches reads 10.16 after switching to mm and still means the same thing. The text
 * is kept as typed together with the system it was typed in, and converted on the way out: flipping
 * back shows exactly what was typed, with no rounding drift.
 */
export function useTypedInUnits<F extends object>(
  initial: F | (() => F),
  quantities: Partial<Record<keyof F, Quantity>>,
): [F, (next: SetStateAction<F>) => void] {
  const { system } = useUnits();
  const [held, setHeld] = useState<{ system: UnitSystem; form: F }>(() => ({
    system,
    form: typeof initial === 'function' ? initial() : initial,
  }));
  const shown = held.system === system ? held.form : convert(held.form, quantities, held.system, system);
  const set = useCallback(
    (next: SetStateAction<F>) =>
      setHeld((h) => {
        const current = h.system === system ? h.form : convert(h.form, quantities, h.system, system);
        return { system, form: typeof next === 'function' ? next(current) : next };
      }),
    // quantities is a constant table at every call site
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [system],
  );
  return [shown, set];
}

function convert<F extends object>(form: F, quantities: Partial<Record<keyof F, Quantity>>, from: UnitSystem, to: UnitSystem): F {
  const out = { ...form } as Record<string, unknown>;
  for (const [key, q] of Object.entries(quantities) as [string, Quantity][]) {
    const text = out[key];
    if (typeof text === 'string') out[key] = textInSystem(text, q, from, to);
  }
  return out as F;
}
