import { useCallback, useEffect, useRef, useState } from 'react';
import type { UseFormReturn } from 'react-hook-form';
import type { SubmissionView, UpdateSubmission } from '@shared/schemas/submissions';
import { ApiError } from '../../../lib/api-client';
import { createSubmission, updateSubmission } from '../api/save-submission';
import { draftPayload, formPathOf, type FormValues } from './form-values';

export type SaveState =
  | { kind: 'idle' }
  | { kind: 'pending' }
  | { kind: 'saving' }
  /** `unfinished`: rows the server holds as incomplete; they hold back only the send to review */
  | { kind: 'saved'; at: Date; unfinished?: { path: string; message: string }[] }
  | { kind: 'incomplete'; issues: { path: string; message: string }[] }
  | { kind: 'error'; message: string; fields: number };

const DEBOUNCE_MS = 1200;

// ---- a copy of the inputs on this device, so nothing typed is lost when a save fails ----

type Backup = { values: FormValues; at: number };
export function readBackup(key: string): Backup | null {
  try {
    const raw = localStorage.getItem(key);
    return raw ? (JSON.parse(raw) as Backup) : null;
  } catch {
    return null;
  }
}
function writeBackup(key: string, values: FormValues) {
  try {
    localStorage.setItem(key, JSON.stringify({ values, at: Date.now() } satisfies Backup));
  } catch {
    // storage full or blocked: the form itself still holds the input
  }
}
export function clearBackup(key: string) {
  try {
    localStorage.removeItem(key);
  } catch {
    // nothing to clear
  }
}

type Options = {
  form: UseFormReturn<FormValues>;
  submissionId: number | null;
  swapSlug: string | null;
  /** for a new correction: the approved revision the form was filled from */
  basedOnRevisionId?: number | null;
  enabled: boolean;
  backupKey: string;
  /** return true when another editor takes the new draft over; this one then stops saving */
  onCreated: (view: SubmissionView) => boolean | void;
  onSaved?: (view: SubmissionView) => void;
  /** the values the server already holds, when the form opens on a saved revision */
  savedValues?: FormValues | null;
  /** when the server last stored the revision */
  savedAt?: string | null;
};

/**
 * Saves the draft a moment after each change: the first save creates it (POST), later ones
 * replace it (PATCH). Saves run one at a time; a change during a save triggers one more.
 * A half-filled row is saved as incomplete beside the record; only a record that does not read
 * without it (no title yet) waits on this device, and the status names the field it needs.
 */
export function useAutosave({
  form,
  submissionId,
  swapSlug,
  basedOnRevisionId = null,
  enabled,
  backupKey,
  onCreated,
  onSaved,
  savedValues = null,
  savedAt = null,
}: Options) {
  const [state, setStateRaw] = useState<SaveState>(
    submissionId ? { kind: 'saved', at: savedAt ? new Date(savedAt) : new Date() } : { kind: 'idle' },
  );
  const stateRef = useRef<SaveState>(state);
  const setState = useCallback((next: SaveState | ((s: SaveState) => SaveState)) => {
    stateRef.current = typeof next === 'function' ? next(stateRef.current) : next;
    setStateRaw(stateRef.current);
  }, []);
  const idRef = useRef(submissionId);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const running = useRef<Promise<SubmissionView | null> | null>(null);
  const again = useRef(false);
  const [savedJson] = useState(() => {
    const draft = savedValues ? draftPayload(savedValues, swapSlug) : null;
    return draft?.ok ? JSON.stringify({ ...draft.payload, incompleteRows: draft.incompleteRows }) : null;
  });
  const lastSaved = useRef<string | null>(savedJson);
  const changedSinceSave = useRef(false);
  const handedOff = useRef(false);
  const serverErrorPaths = useRef<string[]>([]);
  const callbacks = useRef({ onCreated, onSaved });
  callbacks.current = { onCreated, onSaved };

  useEffect(() => {
    idRef.current = submissionId;
  }, [submissionId]);

  const saveNow = useCallback(async (): Promise<SubmissionView | null> => {
    const draft = draftPayload(form.getValues(), swapSlug);
    if (!draft.ok) {
      setState({ kind: 'incomplete', issues: draft.issues });
      return null;
    }
    const payload = { ...draft.payload, incompleteRows: draft.incompleteRows };
    const unfinished = draft.unfinished;
    const json = JSON.stringify(payload);
    if (json === lastSaved.current && idRef.current) {
      setState((s) => (s.kind === 'saved' ? { ...s, unfinished } : { kind: 'saved', at: new Date(), unfinished }));
      return null;
    }
    setState({ kind: 'saving' });
    changedSinceSave.current = false;
    try {
      let view: SubmissionView;
      if (idRef.current) {
        const { swapSlug: _slug, ...rest } = payload;
        void _slug;
        view = await updateSubmission(idRef.current, rest as UpdateSubmission);
      } else {
        view = await createSubmission(basedOnRevisionId ? { ...payload, basedOnRevisionId } : payload);
        idRef.current = view.id;
        if (callbacks.current.onCreated(view) === true) handedOff.current = true;
      }
      lastSaved.current = json;
      if (serverErrorPaths.current.length) form.clearErrors(serverErrorPaths.current as never);
      serverErrorPaths.current = [];
      if (!changedSinceSave.current) clearBackup(backupKey);
      setState({ kind: 'saved', at: new Date(), unfinished });
      callbacks.current.onSaved?.(view);
      return view;
    } catch (err) {
      const apiErr = err instanceof ApiError ? err : null;
      const fields = Object.entries(apiErr?.fields ?? {});
      for (const [path, message] of fields) form.setError(formPathOf(path) as never, { type: 'server', message });
      serverErrorPaths.current = fields.map(([path]) => formPathOf(path));
      setState({
        kind: 'error',
        message: apiErr?.message ?? 'The draft could not be saved. Your input is still here.',
        fields: fields.length,
      });
      return null;
    }
  }, [form, swapSlug, basedOnRevisionId, backupKey, setState]);

  const run = useCallback((): Promise<SubmissionView | null> => {
    // after a hand-over the adopting editor saves; two savers could land out of order
    if (handedOff.current) return Promise.resolve(null);
    if (running.current) {
      again.current = true;
      return running.current;
    }
    const p = saveNow().finally(() => {
      running.current = null;
      if (again.current) {
        again.current = false;
        if (!handedOff.current) void run();
      }
    });
    running.current = p;
    return p;
  }, [saveNow]);

  useEffect(() => {
    if (!enabled) return;
    const sub = form.watch((values, info) => {
      if (!info.name && info.type === undefined) return; // a reset, not a person typing
      if (handedOff.current) return;
      changedSinceSave.current = true;
      writeBackup(backupKey, values as FormValues);
      setState({ kind: 'pending' });
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void run(), DEBOUNCE_MS);
    });
    return () => {
      sub.unsubscribe();
      if (timer.current) clearTimeout(timer.current);
    };
  }, [enabled, form, backupKey, run, setState]);

  /** Save whatever is pending now (before sending for review); ok when the server holds the current input. */
  const flush = useCallback(async () => {
    if (timer.current) clearTimeout(timer.current);
    if (running.current) await running.current;
    await run();
    return { id: idRef.current, ok: stateRef.current.kind === 'saved' };
  }, [run]);

  return { state, flush, retry: run };
}
