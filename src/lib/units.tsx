import { createContext, useCallback, useContext, useMemo, useSyncExternalStore, type ReactNode } from 'react';
import type { UnitSystem } from '@shared/schemas/enums';
import { mmToIn, nmToLbfFt, barToPsi, kgToLb, MM_PER_IN, N_PER_LBF } from '@shared/fitment/units';

const storageKey = 'swapyard.units';

type UnitsContextValue = {
  system: UnitSystem;
  setSystem: (s: UnitSystem) => void;
};

const UnitsContext = createContext<UnitsContextValue | null>(null);

function readStored(): UnitSystem {
  try {
    return localStorage.getItem(storageKey) === 'imperial' ? 'imperial' : 'metric';
  } catch {
    return 'metric';
  }
}

// the choice lives on the device; a page the server drew is hydrated in metric, then shown in the reader's units
const unitListeners = new Set<() => void>();
let chosen: UnitSystem | null = null;
const subscribeUnits = (listener: () => void) => {
  unitListeners.add(listener);
  return () => unitListeners.delete(listener);
};
const currentUnits = () => (chosen ??= readStored());
const serverUnits = (): UnitSystem => 'metric';

export function UnitsProvider({ children }: { children: ReactNode }) {
  const system = useSyncExternalStore(subscribeUnits, currentUnits, serverUnits);
  const setSystem = useCallback((s: UnitSystem) => {
    chosen = s;
    try {
      localStorage.setItem(storageKey, s);
    } catch {
      // private mode: the choice lasts for this visit only
    }
    unitListeners.forEach((l) => l());
  }, []);
  const value = useMemo(() => ({ system, setSystem }), [system, setSystem]);
  return <UnitsContext.Provider value={value}>{children}</UnitsContext.Provider>;
}

export function useUnits() {
  const ctx = useContext(UnitsContext);
  if (!ctx) throw new Error('useUnits needs a UnitsProvider');
  const { system } = ctx;
  return {
    ...ctx,
    /** a length given in mm, shown in the chosen system */
    length: (mm: number, digits = 1) =>
      system === 'metric' ? `${round(mm, digits)} mm` : `${round(mmToIn(mm), inchPlaces(digits))} in`,
    /** a length rounded toward `direction` at the shown precision, for figures that must not flatter (a clearance down, a spacer up) */
    lengthToward: (mm: number, direction: 'down' | 'up', digits = 1) => {
      const metric = system === 'metric';
      const places = metric ? digits : inchPlaces(digits);
      const scale = 10 ** places;
      const shown = metric ? mm : mmToIn(mm);
      // a hair of slack so a figure that is exactly on a step is not pushed a whole step by floating-point noise
      const stepped = (direction === 'down' ? Math.floor(shown * scale + 1e-9) : Math.ceil(shown * scale - 1e-9)) / scale;
      return `${round(stepped, places)} ${metric ? 'mm' : 'in'}`;
    },
    torque: (nm: number) => (system === 'metric' ? `${round(nm, 0)} N·m` : `${round(nmToLbfFt(nm), 0)} lbf·ft`),
    pressure: (bar: number) => (system === 'metric' ? `${round(bar, 1)} bar` : `${round(barToPsi(bar), 0)} psi`),
    mass: (kg: number) => (system === 'metric' ? `${round(kg, 0)} kg` : `${round(kgToLb(kg), 0)} lb`),
    force: (n: number) => (system === 'metric' ? `${round(n, 0)} N` : `${round(n / N_PER_LBF, 0)} lbf`),
    /** a volume given in mm³, shown as cm³ or cubic inches */
    volume: (mm3: number) => (system === 'metric' ? `${round(mm3 / 1000, 2)} cm³` : `${round(mm3 / MM_PER_IN ** 3, 3)} in³`),
    lengthUnit: system === 'metric' ? 'mm' : 'in',
  };
}

/**
 * Decimal places of a length in inches for one shown to `mmDigits` in millimetres, at the trade's usual
 * precision: hundredths of an inch for sizes, lengths and clearances (whole or tenth millimetres), thousandths
 * for shims, gaps and fits (hundredths of a millimetre); common practice, no source.
 */
export function inchPlaces(mmDigits: number): number {
  return mmDigits >= 2 ? 3 : 2;
}

export function round(value: number, digits: number): string {
  return value.toLocaleString('en-GB', { minimumFractionDigits: 0, maximumFractionDigits: digits });
}
