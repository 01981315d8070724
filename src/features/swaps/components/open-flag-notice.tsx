import type { OpenSafetyFlag } from '@shared/schemas/flags';
import { formatDate } from '@shared/dates';

const heading: Record<OpenSafetyFlag['kind'], string> = {
  wrong_figure: 'A reader questions a figure on this sheet',
  unsafe_advice: 'A reader questions the safety of advice on this sheet',
};

/**
 * Open flags about a safety figure, told to every reader until a moderator settles them: the gist of what
 * was reported and when, never who reported it.
 */
export function OpenFlagNotice({ flags }: { flags: OpenSafetyFlag[] }) {
  if (flags.length === 0) return null;
  return (
    <section
      aria-labelledby="open-flags-h"
      className="print-break-avoid mb-6 rounded-lg border-2 border-oxide bg-oxide-soft px-4 py-3 text-sm text-graphite"
    >
      <h2 id="open-flags-h" className="font-extrabold text-oxide">
        {flags.length === 1 ? heading[flags[0]!.kind] : `Readers question ${flags.length} points on this sheet`}
      </h2>
      <ul className="mt-2 space-y-2">
        {flags.map((f) => (
          <li key={f.id}>
            <p className="break-words">
              <span className="font-bold">{f.kind === 'wrong_figure' ? 'Figure questioned' : 'Safety concern'}</span> · reported{' '}
              {formatDate(f.raisedAt)}
              {f.correctionPending && ' · a correction is at the review desk'}
            </p>
            <blockquote className="mt-0.5 border-l-2 border-oxide/50 pl-2 italic">{f.gist}</blockquote>
          </li>
        ))}
      </ul>
      <p className="mt-2">
        A moderator has not settled {flags.length === 1 ? 'it' : 'them'} yet. Until then, check the figure against the
        manufacturer’s specification before you rely on it.
      </p>
    </section>
  );
}
