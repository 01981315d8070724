/**
 * The signed-in reader's own data kept on this device so it reads without a connection (who they are,
 * their cars). It is filed under their id: a different member signing in, or signing out, drops it, so one
 * member's data never shows for another; a visitor has none. The service worker stores none of it.
 */
const KEY = 'swapyard.reader';

type Copy = { userId: number; values: Record<string, unknown> };

function read(): Copy | null {
  try {
    const raw = typeof localStorage === 'undefined' ? null : localStorage.getItem(KEY);
    return raw ? (JSON.parse(raw) as Copy) : null;
  } catch {
    return null;
  }
}

function write(copy: Copy | null) {
  if (typeof localStorage === 'undefined') return;
  try {
    if (copy) localStorage.setItem(KEY, JSON.stringify(copy));
    else localStorage.removeItem(KEY);
  } catch {
    // storage full or refused: the app works online without it
  }
}

/** Who the server says is signed in (null: nobody); anything kept for someone else goes. */
export function rememberReader(userId: number | null) {
  const copy = read();
  if (userId === null) write(null);
  else if (copy?.userId !== userId) write({ userId, values: {} });
}

export const forgetReader = () => write(null);

/** Keeps a value for the reader last remembered; nothing when nobody is. */
export function keepForReader(key: string, value: unknown) {
  const copy = read();
  if (copy) write({ ...copy, values: { ...copy.values, [key]: value } });
}

export function readForReader<T>(key: string): T | undefined {
  return read()?.values[key] as T | undefined;
}
