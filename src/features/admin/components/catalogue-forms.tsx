import { useState, type FormEvent, type ReactNode } from 'react';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';

export type Errors = { message: string; fields: Record<string, string> } | null;

export const errorsOf = (err: unknown): Errors =>
  err instanceof ApiError
    ? { message: err.message, fields: err.fields }
    : { message: err instanceof Error ? err.message : 'That did not work.', fields: {} };

/** Only what the admin changed is sent: a field left alone is never overwritten with a stale copy. */
export function changedOnly<T extends Record<string, unknown>>(before: T, after: Partial<T>): Partial<T> {
  return Object.fromEntries(
    Object.entries(after).filter(([k, v]) => JSON.stringify(v) !== JSON.stringify(before[k])),
  ) as Partial<T>;
}

/** A form of a record being corrected: its fields, the error of the whole, Save and Cancel. */
export function EditorForm({
  label,
  errors,
  pending,
  onSubmit,
  onCancel,
  children,
}: {
  label: string;
  errors: Errors;
  pending: boolean;
  onSubmit: () => void;
  onCancel: () => void;
  children: ReactNode;
}) {
  return (
    <form
      aria-label={label}
      className="mt-3 grid gap-3 rounded-lg border border-ink/15 bg-paper p-3 sm:grid-cols-2 sm:p-4"
      onSubmit={(e: FormEvent) => {
        e.preventDefault();
        onSubmit();
      }}
    >
      {children}
      {errors && (
        <p role="alert" className="text-sm font-semibold text-oxide sm:col-span-2">
          {errors.message}
        </p>
      )}
      <div className="flex flex-wrap gap-2 sm:col-span-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : 'Save'}
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

/** Merging: who survives, what moves, and a second click to confirm. */
export function MergeConfirm({
  what,
  into,
  pending,
  errors,
  onConfirm,
}: {
  what: string;
  into: string | null;
  pending: boolean;
  errors: Errors;
  onConfirm: () => void;
}) {
  const [sure, setSure] = useState(false);
  if (!into) return null;
  return (
    <div className="mt-2 rounded-md border border-oxide/40 bg-oxide-soft/40 p-3 text-sm">
      <p>
        <strong>{what}</strong> will be folded into <strong>{into}</strong>: everything that refers to it moves there, and it is
        removed. This cannot be undone from here.
      </p>
      {errors && (
        <p role="alert" className="mt-2 font-semibold text-oxide">
          {errors.message} {Object.values(errors.fields).join(' ')}
        </p>
      )}
      <label className="mt-2 flex min-h-10 items-center gap-2">
        <input type="checkbox" className="h-5 w-5 accent-oxide" checked={sure} onChange={(e) => setSure(e.target.checked)} />
        They are the same record
      </label>
      <Button variant="danger" disabled={!sure || pending} onClick={onConfirm}>
        {pending ? 'Merging…' : 'Merge'}
      </Button>
    </div>
  );
}
