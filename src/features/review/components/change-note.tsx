import type { SubmissionView } from '@shared/schemas/submissions';
import { flagKindLabels } from '@shared/schemas/flags';

/** A correction's own account on the desk: what changed and why, and the flags it says it answers. */
export function ChangeNote({ revision }: { revision: SubmissionView }) {
  if (!revision.changeNote && revision.answersFlags.length === 0) return null;
  return (
    <section aria-labelledby="change-note-h" className="rounded-xl border-l-4 border-brass bg-brass-soft/30 p-4">
      <h2 id="change-note-h" className="text-xl font-extrabold text-ink">
        What changed and why
      </h2>
      {revision.changeNote ? (
        <p className="mt-2 whitespace-pre-line break-words text-graphite">{revision.changeNote}</p>
      ) : (
        <p className="mt-2 text-graphite-soft">The author wrote no note.</p>
      )}
      {revision.answersFlags.length > 0 && (
        <>
          <h3 className="mt-3 text-sm font-bold uppercase tracking-wide text-graphite-soft">Answers these flags</h3>
          <ul className="mt-1 space-y-1 text-sm">
            {revision.answersFlags.map((f) => (
              <li key={f.id} className="break-words">
                <span className="font-bold">{flagKindLabels[f.kind]}</span> ({f.status === 'open' ? 'open' : 'resolved'}):{' '}
                {f.reason}
              </li>
            ))}
          </ul>
          <p className="mt-1 text-xs text-graphite-soft">Approving this correction resolves the open ones as fixed.</p>
        </>
      )}
    </section>
  );
}
