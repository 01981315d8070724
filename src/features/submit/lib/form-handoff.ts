import type { UseFormReturn } from 'react-hook-form';
import type { FormValues } from './form-values';

// The first save of a new swap moves the form from /submit to /submissions/:id/edit. The page
// being left stays on screen, and takes keystrokes, until the new one is ready, so the new
// editor adopts the very same form instead of a copy of its values: nothing typed in between
// can fall through the gap. Kept in memory only, so a reload opens what the server holds.
const pending = new Map<number, UseFormReturn<FormValues>>();

export function handOver(id: number, form: UseFormReturn<FormValues>) {
  pending.set(id, form);
}

export function handedOverForm(id: number): UseFormReturn<FormValues> | null {
  return pending.get(id) ?? null;
}

export function releaseHandOver(id: number, form: UseFormReturn<FormValues>) {
  if (pending.get(id) === form) pending.delete(id);
}
