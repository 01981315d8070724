import { useState } from 'react';
import type { ReviewDetail } from '@shared/schemas/submissions';
import { takedownSchema } from '@shared/schemas/takedowns';
import { Button } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/field';
import { ApiError } from '../../../lib/api-client';
import { useRevertTakedown, useTakeDown } from '../api/takedowns';
import { formatDateTime } from '@shared/dates';

const when = (iso: string) => formatDateTime(iso);

type Choice = { target: 'photo'; photoId: string } | { target: 'body' };

/**
 * On a published revision: take one of its photos or its write-up down, with the reason on record. A
 * photo goes wherever the swap shows it (copies in later revisions included); an admin can put it back.
 */
export function TakedownPanel({ detail }: { detail: ReviewDetail }) {
  const { revision, takedowns, canRevertTakedowns } = detail;
  const [choice, setChoice] = useState<Choice | null>(null);
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string | null>(null);
  const [choiceError, setChoiceError] = useState<string | null>(null);
  const takeDown = useTakeDown(revision.id);
  const revert = useRevertTakedown(revision.id);
  const active = takedowns.filter((t) => !t.revertedAt);
  const bodyDown = active.some((t) => t.target === 'body');

  const send = async (e: React.FormEvent) => {
    e.preventDefault();
    if (!choice) return setChoiceError('Pick the photo or the write-up to take down.');
    setChoiceError(null);
    const parsed = takedownSchema.safeParse({ ...choice, reason });
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'Check the reason');
    setError(null);
    try {
      await takeDown.mutateAsync(parsed.data);
      setChoice(null);
      setReason('');
    } catch (err) {
      setError(err instanceof ApiError ? (Object.values(err.fields)[0] ?? err.message) : 'That did not work. Try again.');
    }
  };

  return (
    <section aria-labelledby="takedown-h" className="rounded-xl border border-oxide/30 bg-paper-card p-4">
      <h2 id="takedown-h" className="text-xl font-extrabold text-ink">
        Take down
      </h2>
      <p className="mt-1 text-sm text-graphite">
        For a photo or a write-up that must not stay public (personal details, someone else’s photo, abuse). The record of the
        swap stays; readers are told the write-up was taken down. An admin can put it back.
      </p>
      <form onSubmit={(e) => void send(e)} noValidate className="mt-3 space-y-3">
        <fieldset className="space-y-2">
          <legend className="text-sm font-bold text-graphite">What comes down</legend>
          {revision.photos.length > 0 && (
            <ul className="grid grid-cols-2 gap-2 sm:grid-cols-4">
              {revision.photos.map((p, i) => (
                <li key={p.id}>
                  <label
                    className={`block cursor-pointer rounded-lg border p-1 text-xs ${choice?.target === 'photo' && choice.photoId === p.id ? 'border-oxide bg-oxide-soft' : 'border-graphite/15'}`}
                  >
                    <img
                      src={p.thumbUrl}
                      alt={p.caption || `Photo ${i + 1}`}
                      className={`aspect-[4/3] w-full rounded object-cover ${p.takenDown ? 'opacity-50 grayscale' : ''}`}
                    />
                    <span className="mt-1 flex items-center gap-1">
                      <input
                        type="radio"
                        name="takedown"
                        disabled={p.takenDown}
                        checked={choice?.target === 'photo' && choice.photoId === p.id}
                        onChange={() => {
                          setChoice({ target: 'photo', photoId: p.id });
                          setChoiceError(null);
                        }}
                        className="accent-oxide"
                      />
                      {p.takenDown ? 'Taken down' : `Photo ${i + 1}`}
                    </span>
                  </label>
                </li>
              ))}
            </ul>
          )}
          <label className="flex items-center gap-2 text-sm">
            <input
              type="radio"
              name="takedown"
              disabled={bodyDown || !revision.body}
              checked={choice?.target === 'body'}
              onChange={() => {
                setChoice({ target: 'body' });
                setChoiceError(null);
              }}
              className="accent-oxide"
            />
            {bodyDown ? 'The write-up (taken down)' : revision.body ? 'The write-up' : 'The write-up (this revision has none)'}
          </label>
          {choiceError && (
            <p role="alert" className="text-sm font-semibold text-oxide">
              {choiceError}
            </p>
          )}
        </fieldset>
        <TextArea
          label="Why (moderators and admins read this; the author and readers do not)"
          rows={2}
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          error={error ?? undefined}
        />
        <Button type="submit" variant="danger" disabled={takeDown.isPending}>
          {takeDown.isPending ? 'Taking it down…' : 'Take down'}
        </Button>
      </form>
      {takedowns.length > 0 && (
        <div className="mt-5">
          <h3 className="font-extrabold text-ink">On record</h3>
          <ul className="mt-2 space-y-2 text-sm">
            {takedowns.map((t) => (
              <li key={t.id} className="rounded-lg border border-graphite/15 bg-paper p-2">
                <p>
                  <strong>{t.target === 'photo' ? 'A photo' : 'The write-up'}</strong> taken down by {t.createdBy.name} ·{' '}
                  {when(t.createdAt)}
                  {t.revertedAt && t.revertedBy && (
                    <>
                      {' '}
                      · put back by {t.revertedBy.name} · {when(t.revertedAt)}
                    </>
                  )}
                </p>
                <p className="mt-1 whitespace-pre-wrap text-graphite">{t.reason}</p>
                {canRevertTakedowns && !t.revertedAt && (
                  <Button variant="secondary" className="mt-2" disabled={revert.isPending} onClick={() => revert.mutate(t.id)}>
                    Put it back
                  </Button>
                )}
              </li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
