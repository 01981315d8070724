import { useRef, useState } from 'react';
import { Link } from 'react-router';
import type { SubmissionView } from '@shared/schemas/submissions';
import { decisionNoteSchema, reasonTemplateSchema, requiredReasonSchema } from '@shared/schemas/submissions';
import { revisionStatusLabels } from '@shared/schemas/enums';
import { Button } from '../../../components/ui/button';
import { TextArea, TextInput } from '../../../components/ui/field';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { useDecide, type Decision } from '../api/decide';
import { useShortcuts } from '../../../lib/use-shortcuts';
import { useCreateTemplate, useDeleteTemplate, useTemplates, useUpdateTemplate } from '../api/templates';

const choices: { value: Decision; label: string; hint: string }[] = [
  { value: 'approve', label: 'Publish', hint: 'It becomes the swap’s current revision and appears in search.' },
  { value: 'send-back', label: 'Send back for rework', hint: 'The author changes it and sends it again. Reasons required.' },
  { value: 'decline', label: 'Don’t publish', hint: 'It is not published. Reason required.' },
];

/** keys that choose a decision; saving it still takes the button, so no key alone publishes a brake record */
export const decisionKeys: Record<Decision, string> = { approve: '1', 'send-back': '2', decline: '3' };
export const decisionKeyLabels = choices.map((c) => ({ key: decisionKeys[c.value], label: `Choose “${c.label}”` }));

const doneWords: Record<Decision, string> = {
  approve: 'Published',
  'send-back': 'Sent back to the author for rework',
  decline: 'Not published',
};

/**
 * Publish, send back or don't publish one revision; the author is told by e-mail. Nothing is chosen
 * until the moderator chooses: publishing a brake record is never one stray click away.
 */
type Props = {
  revision: SubmissionView;
  canDecide: boolean;
  /** another moderator's login while their claim holds: deciding waits for it */
  heldBy: string | null;
  /** after "… and open the next": claims and opens the next submission in the desk's filter */
  openNext: () => Promise<void>;
};

export function DecisionPanel({ revision, canDecide, heldBy, openNext }: Props) {
  const { behind } = revision;
  // nothing is chosen until the moderator chooses; a correction behind the current revision cannot be
  // published, so sending it back is the way on
  const [decision, setDecision] = useState<Decision | null>(behind ? 'send-back' : null);
  const [note, setNote] = useState(
    behind
      ? `Revision ${behind.current.number} was published after you started this correction. Please bring it up to date (your draft offers the merge) and send it again.`
      : '',
  );
  // the note's own problem shows once the box has been left or a send was tried, and goes as soon as it is fixed
  const [noteShown, setNoteShown] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<Decision | null>(null);
  const noteRef = useRef<HTMLDivElement>(null);
  const decide = useDecide(revision.id);
  useShortcuts(
    choices.map((c) => ({
      key: decisionKeys[c.value],
      label: c.label,
      run: () => {
        if (!(c.value === 'approve' && behind)) setDecision(c.value);
      },
    })),
    canDecide && !done,
  );

  if (!canDecide) {
    return (
      <aside aria-labelledby="decide-h" className="rounded-xl border border-graphite/20 bg-paper-card p-4">
        <h2 id="decide-h" className="text-lg font-extrabold text-ink">
          Decision
        </h2>
        <p className="mt-2 text-sm text-graphite" data-testid="cannot-decide">
          {done
            ? `${doneWords[done]}. The author has been told by e-mail.`
            : revision.status !== 'in_review'
              ? `This revision is ${revisionStatusLabels[revision.status].toLowerCase()}; decisions are made only while it is at the desk.`
              : 'You wrote this revision, so another moderator decides on it.'}
        </p>
        {(done === 'approve' || revision.status === 'approved') && (
          <Link to={paths.swap(revision.swapSlug)} className="mt-3 inline-block font-bold text-ink underline">
            Open the published swap sheet
          </Link>
        )}
        <fieldset disabled className="mt-3 space-y-2 opacity-50">
          {choices.map((c) => (
            <label key={c.value} className="flex items-center gap-2 text-sm">
              <input type="radio" name="decision-disabled" /> {c.label}
            </label>
          ))}
        </fieldset>
      </aside>
    );
  }

  const insert = (text: string) => {
    setNote((n) => (n.trim() ? `${n.trimEnd()}\n${text}` : text));
    requestAnimationFrame(() => noteRef.current?.querySelector('textarea')?.focus());
  };

  const noteCheck = (decision === 'send-back' || decision === 'decline' ? requiredReasonSchema : decisionNoteSchema).safeParse({
    note,
  });
  const noteError = noteShown && !noteCheck.success ? (noteCheck.error.issues[0]?.message ?? 'Check the note') : undefined;

  const send = async (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    const thenNext = (e.nativeEvent as SubmitEvent).submitter?.getAttribute('data-then') === 'next';
    setError(null);
    setNoteShown(true);
    if (!decision || !noteCheck.success) return;
    const parsed = noteCheck;
    try {
      await decide.mutateAsync({ decision, note: parsed.data.note });
      setDone(decision);
      if (thenNext) await openNext();
    } catch (err) {
      setError(err instanceof ApiError ? (err.fields.note ?? err.message) : 'That did not work. Try again.');
    }
  };

  const needsReason = decision === 'send-back' || decision === 'decline';
  return (
    <aside aria-labelledby="decide-h" className="rounded-xl border border-ink/20 bg-paper-card p-4 shadow-sm">
      <h2 id="decide-h" className="text-lg font-extrabold text-ink">
        Decision
      </h2>
      <form onSubmit={(e) => void send(e)} className="mt-3 space-y-4" noValidate>
        <fieldset className="space-y-2">
          <legend className="sr-only">Decision</legend>
          {choices.map((c) => {
            const blocked = c.value === 'approve' && behind !== null;
            return (
              <label
                key={c.value}
                className={`flex items-start gap-2 rounded-lg border p-2 text-sm ${blocked ? 'cursor-not-allowed opacity-60' : 'cursor-pointer'} ${decision === c.value ? 'border-ink bg-ink-faint/50' : 'border-graphite/15'}`}
              >
                <input
                  type="radio"
                  name="decision"
                  value={c.value}
                  checked={decision === c.value}
                  disabled={blocked}
                  onChange={() => setDecision(c.value)}
                  className="mt-1 h-4 w-4 accent-ink"
                />
                <span>
                  <span className="font-bold">{c.label}</span>
                  <span className="block text-xs text-graphite-soft">
                    {blocked ? `Not until its author brings it up to date with revision ${behind.current.number}.` : c.hint}
                  </span>
                </span>
              </label>
            );
          })}
        </fieldset>
        {needsReason && <Templates onInsert={insert} />}
        <div ref={noteRef}>
          <TextArea
            label={needsReason ? 'Reasons (the author reads these)' : 'Note to the author (optional)'}
            rows={5}
            value={note}
            onChange={(e) => {
              setNote(e.target.value);
              setError(null);
            }}
            onBlur={() => setNoteShown(true)}
            error={error ?? noteError}
            reserveError
          />
        </div>
        {heldBy && (
          <p className="text-sm font-semibold text-oxide" data-testid="held-by-other">
            @{heldBy} is working on this. Deciding waits until they release it or their claim lapses.
          </p>
        )}
        <div className="space-y-2">
          <Button
            type="submit"
            variant={decision === 'decline' ? 'danger' : 'primary'}
            className="w-full"
            disabled={decide.isPending || decision === null || heldBy !== null}
          >
            {decide.isPending
              ? 'Saving the decision…'
              : decision === null
                ? 'Choose a decision above'
                : choices.find((c) => c.value === decision)!.label}
          </Button>
          {decision !== null && (
            <Button
              type="submit"
              data-then="next"
              variant="secondary"
              className="w-full"
              disabled={decide.isPending || heldBy !== null}
            >
              {choices.find((c) => c.value === decision)!.label} and open the next
            </Button>
          )}
        </div>
      </form>
    </aside>
  );
}

/** Reusable reasons: insert one into the note; moderators add, edit and delete them. */
function Templates({ onInsert }: { onInsert: (text: string) => void }) {
  const templates = useTemplates();
  const [editing, setEditing] = useState<{ id: number | null; label: string; text: string } | null>(null);
  const [error, setError] = useState<string | null>(null);
  const create = useCreateTemplate();
  const update = useUpdateTemplate();
  const remove = useDeleteTemplate();

  const save = async () => {
    if (!editing) return;
    const parsed = reasonTemplateSchema.safeParse({ label: editing.label, text: editing.text });
    if (!parsed.success)
      return setError(parsed.error.issues.map((i) => `${String(i.path[0])}: ${i.message}`)[0] ?? 'Check the template');
    setError(null);
    try {
      if (editing.id) await update.mutateAsync({ id: editing.id, ...parsed.data });
      else await create.mutateAsync(parsed.data);
      setEditing(null);
    } catch (err) {
      setError(err instanceof ApiError ? err.message : 'The template was not saved.');
    }
  };

  return (
    <div className="space-y-2">
      <p className="text-sm font-bold text-graphite">Reason templates</p>
      {templates.isError && <p className="text-sm text-oxide">The templates did not load.</p>}
      <ul className="flex flex-wrap gap-2">
        {(templates.data ?? []).map((t) => (
          <li key={t.id} className="flex items-center overflow-hidden rounded-full border border-ink/25 bg-paper text-sm">
            <button
              type="button"
              className="px-3 py-1 font-bold text-ink hover:bg-ink-faint"
              onClick={() => onInsert(t.text)}
              title={t.text}
            >
              + {t.label}
            </button>
            <button
              type="button"
              className="border-l border-ink/15 px-2 py-1 text-graphite-soft hover:bg-ink-faint"
              onClick={() => setEditing({ id: t.id, label: t.label, text: t.text })}
              aria-label={`Edit the template “${t.label}”`}
            >
              ✎
            </button>
          </li>
        ))}
        <li>
          <button
            type="button"
            className="rounded-full border border-dashed border-ink/30 px-3 py-1 text-sm text-ink hover:bg-ink-faint"
            onClick={() => setEditing({ id: null, label: '', text: '' })}
          >
            New template
          </button>
        </li>
      </ul>
      {editing && (
        <div className="space-y-2 rounded-lg border border-graphite/15 bg-paper p-3">
          <TextInput
            label="Template name"
            value={editing.label}
            onChange={(e) => setEditing({ ...editing, label: e.target.value })}
          />
          <TextArea
            label="Text"
            rows={3}
            value={editing.text}
            onChange={(e) => setEditing({ ...editing, text: e.target.value })}
            error={error ?? undefined}
          />
          <div className="flex flex-wrap gap-2">
            <Button variant="secondary" onClick={() => void save()} disabled={create.isPending || update.isPending}>
              Save template
            </Button>
            {editing.id && (
              <Button
                variant="quiet"
                onClick={() => {
                  if (editing.id && window.confirm(`Delete the template “${editing.label}”?`))
                    void remove.mutateAsync(editing.id).then(() => setEditing(null));
                }}
              >
                Delete
              </Button>
            )}
            <Button variant="quiet" onClick={() => setEditing(null)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
