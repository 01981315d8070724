import { diffLines, type Change } from 'diff';
import type { SwapData } from './schemas/swap-data';

export type FieldChange = { path: string; before: string | null; after: string | null };

const show = (v: unknown): string | null =>
  v === undefined || v === null ? null : typeof v === 'object' ? JSON.stringify(v) : String(v);

/** Leaf-by-leaf differences of two revisions' structured data, with readable dotted paths (parts.1.name). */
export function diffSwapData(before: SwapData | null, after: SwapData): FieldChange[] {
  const changes: FieldChange[] = [];
  const walk = (a: unknown, b: unknown, path: string) => {
    const objA = a !== null && typeof a === 'object';
    const objB = b !== null && typeof b === 'object';
    if (objA && objB) {
      const keys = new Set([...Object.keys(a as object), ...Object.keys(b as object)]);
      for (const k of keys) walk((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], path ? `${path}.${k}` : k);
      return;
    }
    if (objA || objB) {
      // one side is missing or a scalar: compare the leaves of whichever side is an object
      const base = (objA ? a : b) as Record<string, unknown>;
      for (const k of Object.keys(base))
        walk(objA ? base[k] : undefined, objB ? (b as Record<string, unknown>)[k] : undefined, path ? `${path}.${k}` : k);
      if (!objA && a !== undefined && a !== null) changes.push({ path, before: show(a), after: null });
      if (!objB && b !== undefined && b !== null) changes.push({ path, before: null, after: show(b) });
      return;
    }
    if (a !== b && !(a == null && b == null)) changes.push({ path, before: show(a), after: show(b) });
  };
  walk(before ?? {}, after, '');
  return changes;
}

/** Line-by-line difference of two write-ups. */
export function diffBody(before: string, after: string): Change[] {
  return diffLines(before, after);
}

/** One line summing up what changed between two revisions, for notices such as a shop link's. */
export function summariseChanges(changes: FieldChange[], bodyChanged: boolean): string {
  const sections = [...new Set(changes.map((c) => c.path.split('.')[0]))];
  const parts = sections.map((s) => sectionLabels[s] ?? s);
  if (bodyChanged) parts.push('write-up');
  return parts.length ? `Changed: ${parts.join(', ')}.` : 'No changes to the record’s content.';
}

const sectionLabels: Record<string, string> = {
  title: 'title',
  summary: 'summary',
  parts: 'parts',
  adapter: 'adapter',
  shims: 'shims',
  shimTargetMm: 'shim gap',
  spacers: 'spacers',
  rotors: 'rotors',
  machining: 'machining',
  torque: 'torque specs',
  wheel: 'wheel requirement',
  brakes: 'brake figures',
  currency: 'currency',
  costs: 'costs',
  installHours: 'install time',
  difficulty: 'difficulty',
  tools: 'tools',
  parkingBrakeKept: 'parking brake',
};
