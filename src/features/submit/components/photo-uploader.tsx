import { useEffect, useId, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { StorageUse, SubmissionView } from '@shared/schemas/submissions';
import type { PhotoView } from '@shared/schemas/views';
import { ApiError } from '../../../lib/api-client';
import { Button } from '../../../components/ui/button';
import { inputClass } from '../../../components/ui/field';
import { submissionKeys } from '../api/submission-keys';
import { deletePhoto, photoLimits, photosOf, savePhotoOrder, uploadPhoto } from '../api/photos';
import { useStorageUse } from '../api/get-storage';

type Upload = { key: string; name: string; progress: number; error: string | null };

const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`;

/** Why a file cannot go up, checked before sending; the server checks again by the file's bytes. */
function precheck(file: File, slotsLeft: number): string | null {
  if (!(photoLimits.types as readonly string[]).includes(file.type))
    return `${file.name}: only JPEG, PNG or WebP photos can be added.`;
  if (file.size > photoLimits.maxBytes)
    return `${file.name} is ${mb(file.size)}; a photo may be at most ${mb(photoLimits.maxBytes)}.`;
  if (slotsLeft <= 0) return `${file.name}: a revision holds at most ${photoLimits.maxCount} photos.`;
  return null;
}

function messageOf(err: unknown, name: string): string {
  if (err instanceof ApiError) {
    const field = Object.values(err.fields)[0];
    return `${name}: ${field ?? err.message}`;
  }
  return `${name}: the upload failed. Try again.`;
}

/** The member's photo quota: what their unpublished photos use of it. */
function StorageLine({ use }: { use: StorageUse }) {
  const share = use.quotaBytes > 0 ? use.usedBytes / use.quotaBytes : 0;
  return (
    <p className="text-xs text-graphite-soft" data-testid="storage-use">
      <span className={share >= 0.9 ? 'font-bold text-oxide' : ''}>
        Your photos not yet published use {mb(use.usedBytes)} of your {mb(use.quotaBytes)}.
      </span>{' '}
      Photos count until a moderator publishes them; deleting a draft’s photos frees the space.
    </p>
  );
}

/**
 * Photos of one revision: drop files or pick them (the picker offers the camera on a phone),
 * each upload with its own progress bar; captions, order (move buttons) and removal.
 */
export function PhotoUploader({
  submissionId,
  photos,
  locked = false,
}: {
  submissionId: number | null;
  photos: PhotoView[];
  locked?: boolean;
}) {
  const queryClient = useQueryClient();
  const [list, setList] = useState<PhotoView[]>(photos);
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [notice, setNotice] = useState<string | null>(null);
  const [dragging, setDragging] = useState(false);
  const listRef = useRef<HTMLUListElement>(null);
  const inputId = useId();
  const active = uploads.filter((u) => !u.error).length;

  useEffect(() => setList(photos), [photos]);

  const store = (next: PhotoView[]) => {
    setList(next);
    // the quota line follows every upload and removal
    void queryClient.invalidateQueries({ queryKey: submissionKeys.storage() });
    if (submissionId)
      queryClient.setQueryData<SubmissionView>(submissionKeys.detail(submissionId), (old) =>
        old ? { ...old, photos: next } : old,
      );
  };
  const storage = useStorageUse();
  const refresh = () => {
    void queryClient.invalidateQueries({ queryKey: submissionKeys.storage() });
    if (submissionId) void queryClient.invalidateQueries({ queryKey: submissionKeys.detail(submissionId) });
  };

  const addFiles = (files: FileList | File[]) => {
    if (!submissionId || locked) return;
    setNotice(null);
    let slots = photoLimits.maxCount - list.length - active;
    for (const file of Array.from(files)) {
      const key = `${file.name}-${file.size}-${Math.random().toString(36).slice(2)}`;
      const problem = precheck(file, slots);
      if (problem) {
        setUploads((u) => [...u, { key, name: file.name, progress: 0, error: problem }]);
        continue;
      }
      slots -= 1;
      setUploads((u) => [...u, { key, name: file.name, progress: 0, error: null }]);
      uploadPhoto(submissionId, file, '', (f) => setUploads((u) => u.map((x) => (x.key === key ? { ...x, progress: f } : x))))
        .then((answer) => {
          setUploads((u) => u.filter((x) => x.key !== key));
          const next = photosOf(answer);
          if (next) store(next);
          else void refresh();
        })
        .catch((err: unknown) =>
          setUploads((u) => u.map((x) => (x.key === key ? { ...x, error: messageOf(err, file.name) } : x))),
        );
    }
  };

  const persist = async (next: PhotoView[], previous: PhotoView[]) => {
    if (!submissionId) return;
    store(next);
    try {
      const answer = await savePhotoOrder(
        submissionId,
        next.map((p) => ({ id: p.id, caption: p.caption })),
      );
      const saved = photosOf(answer);
      if (saved) store(saved);
    } catch (err) {
      store(previous);
      setNotice(err instanceof ApiError ? err.message : 'The change to the photos was not saved. Try again.');
    }
  };

  const move = (index: number, by: -1 | 1) => {
    const target = index + by;
    if (target < 0 || target >= list.length) return;
    const next = [...list];
    [next[index], next[target]] = [next[target], next[index]];
    const id = list[index].id;
    void persist(next, list);
    // keep the keyboard on the photo that moved
    requestAnimationFrame(() => {
      const row = listRef.current?.querySelector<HTMLElement>(`[data-photo-id="${CSS.escape(id)}"]`);
      const btn =
        row?.querySelector<HTMLButtonElement>(`button[data-move="${by}"]:not(:disabled)`) ??
        row?.querySelector<HTMLButtonElement>('button[data-move]:not(:disabled)');
      btn?.focus();
    });
  };

  const remove = async (photo: PhotoView) => {
    if (!submissionId) return;
    setNotice(null);
    try {
      const answer = await deletePhoto(submissionId, photo.id);
      const next = photosOf(answer);
      store(next ?? list.filter((p) => p.id !== photo.id));
    } catch (err) {
      setNotice(err instanceof ApiError ? err.message : 'The photo was not removed. Try again.');
    }
  };

  const disabled = !submissionId || locked;
  return (
    <div className="space-y-4">
      {!submissionId && (
        <p className="rounded-md bg-brass-soft/50 p-3 text-sm text-graphite">
          Photos can be added once the draft has been saved — give it a title and at least one part, and it saves by itself.
        </p>
      )}
      {!locked && (
        <div
          className={`flex flex-col items-center gap-3 rounded-xl border-2 border-dashed p-6 text-center transition-colors ${dragging ? 'border-ink bg-ink-faint' : 'border-graphite/25 bg-paper'}`}
          onDragOver={(e) => {
            if (disabled) return;
            e.preventDefault();
            setDragging(true);
          }}
          onDragLeave={() => setDragging(false)}
          onDrop={(e) => {
            e.preventDefault();
            setDragging(false);
            if (!disabled) addFiles(e.dataTransfer.files);
          }}
          data-testid="photo-drop"
        >
          <p className="text-sm text-graphite">Drop photos here, or</p>
          <label
            htmlFor={inputId}
            className={`inline-flex min-h-10 cursor-pointer items-center rounded-md bg-ink px-4 py-2 text-sm font-bold text-paper hover:bg-ink-soft ${disabled ? 'pointer-events-none opacity-60' : ''}`}
          >
            Choose photos
          </label>
          <input
            id={inputId}
            type="file"
            accept="image/jpeg,image/png,image/webp"
            multiple
            className="sr-only"
            disabled={disabled}
            onChange={(e) => {
              if (e.target.files) addFiles(e.target.files);
              e.target.value = '';
            }}
          />
          <p className="text-xs text-graphite-soft">
            JPEG, PNG or WebP, up to {mb(photoLimits.maxBytes)} each and {photoLimits.maxCount} per revision. Location data is
            removed from every photo.
          </p>
          {storage.data && <StorageLine use={storage.data} />}
        </div>
      )}

      {uploads.length > 0 && (
        <ul className="space-y-2" aria-label="Uploads">
          {uploads.map((u) => (
            <li key={u.key} className="rounded-md border border-graphite/15 bg-paper-card p-3 text-sm">
              {u.error ? (
                <div className="flex items-start justify-between gap-3">
                  <p role="alert" className="font-semibold text-oxide">
                    {u.error}
                  </p>
                  <Button
                    variant="quiet"
                    onClick={() => setUploads((all) => all.filter((x) => x.key !== u.key))}
                    aria-label={`Dismiss the message about ${u.name}`}
                  >
                    Dismiss
                  </Button>
                </div>
              ) : (
                <>
                  <div className="flex justify-between gap-2">
                    <span className="truncate">{u.name}</span>
                    <span className="tabular text-graphite-soft">
                      {u.progress >= 1 ? 'Processing…' : `${Math.round(u.progress * 100)} %`}
                    </span>
                  </div>
                  <progress
                    className="mt-2 h-2 w-full accent-ink"
                    max={1}
                    value={u.progress}
                    aria-label={`Uploading ${u.name}`}
                  />
                </>
              )}
            </li>
          ))}
        </ul>
      )}

      {notice && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {notice}
        </p>
      )}

      {list.length > 0 && (
        <ul ref={listRef} className="space-y-3" aria-label="Photos in this revision">
          {list.map((p, i) => (
            <li
              key={p.id}
              data-photo-id={p.id}
              className="flex flex-col gap-3 rounded-lg border border-graphite/15 bg-paper-card p-3 sm:flex-row sm:items-start"
            >
              <img
                src={p.thumbUrl}
                alt={p.caption || `Photo ${i + 1}`}
                width={p.width}
                height={p.height}
                className="aspect-[4/3] w-full rounded-md bg-paper-deep object-cover sm:w-40"
              />
              <div className="flex-1 space-y-2">
                <label className="block text-sm font-bold text-graphite" htmlFor={`${inputId}-cap-${p.id}`}>
                  Caption for photo {i + 1}
                </label>
                <input
                  id={`${inputId}-cap-${p.id}`}
                  className={inputClass}
                  defaultValue={p.caption}
                  maxLength={300}
                  disabled={locked}
                  onBlur={(e) => {
                    const caption = e.target.value.trim();
                    if (caption !== p.caption)
                      void persist(
                        list.map((x) => (x.id === p.id ? { ...x, caption } : x)),
                        list,
                      );
                  }}
                />
                {!locked && (
                  <div className="flex flex-wrap gap-2">
                    <Button
                      variant="secondary"
                      data-move={-1}
                      onClick={() => move(i, -1)}
                      disabled={i === 0}
                      aria-label={`Move photo ${i + 1} up`}
                    >
                      ↑ Up
                    </Button>
                    <Button
                      variant="secondary"
                      data-move={1}
                      onClick={() => move(i, 1)}
                      disabled={i === list.length - 1}
                      aria-label={`Move photo ${i + 1} down`}
                    >
                      ↓ Down
                    </Button>
                    <Button variant="quiet" onClick={() => void remove(p)} aria-label={`Remove photo ${i + 1}`}>
                      Remove
                    </Button>
                  </div>
                )}
              </div>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
