import type { SubmissionView } from '@shared/schemas/submissions';
import { Button } from '../../../components/ui/button';
import { useKeepDraft } from '../api/keep-draft';
import { formatDate } from '@shared/dates';

const longDate = (iso: string) => formatDate(iso);

/** An untouched draft its author was told about by e-mail: when it goes, and the one click that keeps it. */
export function DraftExpiryNotice({ view }: { view: SubmissionView & { expiresAt: string } }) {
  const keep = useKeepDraft();
  return (
    <div role="status" className="mb-6 rounded-xl border-l-4 border-brass bg-brass-soft/40 p-4">
      <h2 className="font-extrabold text-ink">This draft will be removed on {longDate(view.expiresAt)}</h2>
      <p className="mt-1 text-graphite">
        Nobody has changed it for a long while. Keep it, or save any change, and it stays; otherwise it is removed with its
        photos, so unfinished drafts do not take up space for good.
      </p>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Button onClick={() => keep.mutate(view.id)} disabled={keep.isPending}>
          {keep.isPending ? 'Keeping it…' : 'Keep this draft'}
        </Button>
        {keep.isError && (
          <p role="alert" className="text-sm font-semibold text-oxide">
            {keep.error.message}
          </p>
        )}
      </div>
    </div>
  );
}
