import { useEffect, useState } from 'react';

/** The value once it has stayed the same for `ms`: a search as you type asks once per pause, not per key. */
export function useDebounced<T>(value: T, ms: number) {
  const [debounced, setDebounced] = useState(value);
  useEffect(() => {
    const id = setTimeout(() => setDebounced(value), ms);
    return () => clearTimeout(id);
  }, [value, ms]);
  return debounced;
}
