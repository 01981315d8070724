import { dequal } from 'dequal';
import { applyPatch, createPatch } from 'diff';

// Three-way merge of a correction with the revision approved since it was started: base is the revision the
// correction started from, theirs the swap's current revision, mine the correction. A field only one side
// changed takes that side's value; a field both changed the same way is no question; a field both changed
// differently is a conflict its author settles.

/** A field's value as text: JSON for lists and groups, null for an absent value. */
export const showValue = (v: unknown): string | null =>
  v === undefined || v === null ? null : typeof v === 'object' ? JSON.stringify(v) : String(v);

type LeafChange = { path: string; before: string | null; after: string | null };

/** Leaf-by-leaf differences of two values (groups and lists walked by key), with dotted paths below `prefix`. */
function diffLeaves(before: unknown, after: unknown, prefix: string): LeafChange[] {
  const changes: LeafChange[] = [];
  const walk = (a: unknown, b: unknown, path: string) => {
    if (dequal(a, b)) return;
    const key = rowKeyOf(a, b);
    if (key) {
      const named = (list: unknown) =>
        new Map((Array.isArray(list) ? (list as Record<string, unknown>[]) : []).map((r) => [r[key] as string, r]));
      const [ra, rb] = [named(a), named(b)];
      for (const k of new Set([...ra.keys(), ...rb.keys()])) walk(ra.get(k), rb.get(k), `${path}[${k}]`);
      return;
    }
    const objA = a !== null && typeof a === 'object';
    const objB = b !== null && typeof b === 'object';
    if (objA || objB) {
      const keyed = (v: unknown) => (v !== null && typeof v === 'object' ? (v as Record<string, unknown>) : {});
      for (const k of new Set([...Object.keys(keyed(a)), ...Object.keys(keyed(b))]))
        walk(keyed(a)[k], keyed(b)[k], path ? `${path}.${k}` : k);
      // a scalar on one side and a group on the other: the scalar is a change of its own
      if (!objA && a != null) changes.push({ path, before: showValue(a), after: null });
      if (!objB && b != null) changes.push({ path, before: null, after: showValue(b) });
      return;
    }
    if (!(a == null && b == null)) changes.push({ path, before: showValue(a), after: showValue(b) });
  };
  walk(before, after, prefix);
  return changes;
}

export type MergeSide = 'theirs' | 'mine';

/** One field that differs from the base, shown as text (JSON for lists and groups). */
export type MergeField = { path: string; base: string | null; theirs: string | null; mine: string | null };

export type MergeOutcome<T> = {
  /** the merged value; a conflict without a choice keeps the correction's value */
  value: T;
  /** fields settled without asking: one side left them as they were, or (the write-up) both edits apply together */
  taken: (MergeField & { from: MergeSide | 'both' })[];
  /** fields both sides changed differently */
  conflicts: MergeField[];
  /** conflicts no choice was given for */
  unresolved: string[];
};

const isRecord = (v: unknown): v is Record<string, unknown> => v !== null && typeof v === 'object' && !Array.isArray(v);

/** The write-up merges line by line: the newer approval's edits apply to the correction when their lines did not move. */
function mergeText(base: string, theirs: string, mine: string): string | null {
  const merged = applyPatch(mine, createPatch('body', base, theirs, undefined, undefined, { context: 1 }));
  return merged === false ? null : merged;
}

/** rows are matched by what they are, never by position: */
const rowKeys = ['id', 'fastenerId'] as const;

/**
 * The field that names each row of all three lists (a fastener's id, a torque line's fastener), when every
 * row has one and no list holds it twice; null for any other list.
 */
function rowKeyOf(...lists: unknown[]): string | null {
  if (!lists.every((l) => Array.isArray(l) || l === undefined || l === null)) return null;
  const rows = lists.flatMap((l) => (Array.isArray(l) ? [l as unknown[]] : []));
  if (rows.length < 2) return null;
  return (
    rowKeys.find((key) =>
      rows.every((list) => {
        const names = list.map((r) => (isRecord(r) && typeof r[key] === 'string' ? r[key] : null));
        return names.every((n) => n !== null) && new Set(names).size === names.length;
      }),
    ) ?? null
  );
}

/**
 * Merges `theirs` and `mine` against `base`, field by field. Groups recurse by key. Lists whose rows name
 * themselves (fasteners by id, torque lines by fastener) recurse row by row, matched by that name; any other
 * list is one field, since pairing its rows by position would attach one side's edit to the wrong row once
 * the other side added, removed or reordered rows. `choices` settles conflicts by path.
 */
export function mergeThreeWay<T>(base: T, theirs: T, mine: T, choices: Record<string, MergeSide> = {}): MergeOutcome<T> {
  const taken: MergeOutcome<T>['taken'] = [];
  const conflicts: MergeField[] = [];
  const unresolved: string[] = [];
  const field = (path: string, b: unknown, t: unknown, m: unknown): MergeField => ({
    path,
    base: showValue(b),
    theirs: showValue(t),
    mine: showValue(m),
  });
  const join = (path: string, key: string | number) => (path ? `${path}.${key}` : String(key));

  const walk = (b: unknown, t: unknown, m: unknown, path: string): unknown => {
    if (dequal(t, m)) return m;
    // one side left this part alone: the other side's changes, listed leaf by leaf
    if (dequal(b, t)) {
      for (const c of diffLeaves(b, m, path))
        taken.push({ path: c.path, base: c.before, theirs: c.before, mine: c.after, from: 'mine' });
      return m;
    }
    if (dequal(b, m)) {
      for (const c of diffLeaves(b, t, path))
        taken.push({ path: c.path, base: c.before, theirs: c.after, mine: c.before, from: 'theirs' });
      return t;
    }
    if (isRecord(t) && isRecord(m) && (isRecord(b) || b == null)) {
      const from = isRecord(b) ? b : {};
      const out: Record<string, unknown> = {};
      for (const key of new Set([...Object.keys(m), ...Object.keys(t), ...Object.keys(from)])) {
        const v = walk(from[key], t[key], m[key], join(path, key));
        if (v !== undefined) out[key] = v;
      }
      return out;
    }
    const key = rowKeyOf(b, t, m);
    if (key) {
      const rows = (list: unknown) =>
        new Map((Array.isArray(list) ? (list as Record<string, unknown>[]) : []).map((r) => [r[key] as string, r]));
      const [rb, rt, rm] = [rows(b), rows(t), rows(m)];
      // the correction's order, then rows only the newer approval added
      const keys = [...rm.keys(), ...[...rt.keys()].filter((k) => !rm.has(k) && !rb.has(k))];
      for (const k of rb.keys()) if (!keys.includes(k)) keys.push(k);
      return keys.flatMap((k) => {
        const v = walk(rb.get(k), rt.get(k), rm.get(k), `${path}[${k}]`);
        return v === undefined ? [] : [v];
      });
    }
    if (typeof b === 'string' && typeof t === 'string' && typeof m === 'string' && /\n/.test(b + t + m)) {
      const text = mergeText(b, t, m);
      if (text !== null) {
        taken.push({ ...field(path, b, t, m), from: 'both' });
        return text;
      }
    }
    conflicts.push(field(path, b, t, m));
    const choice = choices[path];
    if (!choice) unresolved.push(path);
    return choice === 'theirs' ? t : m;
  };

  const value = walk(base, theirs, mine, '') as T;
  return { value, taken, conflicts, unresolved };
}
