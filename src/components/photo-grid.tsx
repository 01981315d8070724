import { useCallback, useEffect, useRef, useState } from 'react';
import type { PhotoView } from '@shared/schemas/views';

/** Thumbnails with captions; a click opens a viewer that arrow keys step through and Escape closes. */
export function PhotoGrid({ photos }: { photos: PhotoView[] }) {
  const [open, setOpen] = useState<number | null>(null);
  const dialog = useRef<HTMLDialogElement>(null);
  const opener = useRef<HTMLButtonElement | null>(null);

  const show = (i: number, el: HTMLButtonElement) => {
    opener.current = el;
    setOpen(i);
  };
  const close = useCallback(() => setOpen(null), []);
  const step = useCallback(
    (d: number) => setOpen((i) => (i === null ? i : (i + d + photos.length) % photos.length)),
    [photos.length],
  );

  useEffect(() => {
    const d = dialog.current;
    if (!d) return;
    if (open !== null && !d.open) d.showModal();
    if (open === null && d.open) {
      d.close();
      opener.current?.focus();
    }
  }, [open]);

  if (photos.length === 0) return null;
  const current = open === null ? null : photos[open];
  return (
    <>
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
        {photos.map((p, i) => (
          <li key={p.id}>
            <figure>
              <button
                type="button"
                className="block w-full overflow-hidden rounded-lg bg-paper-deep"
                onClick={(e) => show(i, e.currentTarget)}
                aria-label={`Open photo ${i + 1}: ${p.caption || 'no caption'}`}
              >
                <img
                  src={p.thumbUrl}
                  alt={p.caption}
                  width={p.width}
                  height={p.height}
                  loading="lazy"
                  className="aspect-[4/3] w-full bg-paper-deep object-contain transition-transform hover:scale-[1.02]"
                />
              </button>
              {p.caption && <figcaption className="mt-1 text-sm text-graphite-soft">{p.caption}</figcaption>}
            </figure>
          </li>
        ))}
      </ul>
      <dialog
        ref={dialog}
        aria-label="Photo viewer"
        className="m-auto max-h-[95vh] w-[min(64rem,95vw)] rounded-xl bg-graphite p-0 text-paper backdrop:bg-black/70"
        onClose={close}
        onKeyDown={(e) => {
          if (e.key === 'ArrowRight') step(1);
          if (e.key === 'ArrowLeft') step(-1);
        }}
      >
        {current && (
          <figure className="flex flex-col">
            <img src={current.url} alt={current.caption} className="max-h-[78vh] w-full object-contain" />
            <figcaption className="flex items-center justify-between gap-3 p-3 text-sm">
              <span>
                <span className="tabular mr-2 text-paper/70">
                  {open! + 1} / {photos.length}
                </span>
                {current.caption}
              </span>
              <span className="flex gap-2">
                <button
                  type="button"
                  className="rounded border border-paper/30 px-3 py-1"
                  onClick={() => step(-1)}
                  aria-label="Previous photo"
                >
                  ←
                </button>
                <button
                  type="button"
                  className="rounded border border-paper/30 px-3 py-1"
                  onClick={() => step(1)}
                  aria-label="Next photo"
                >
                  →
                </button>
                <button type="button" className="rounded bg-paper px-3 py-1 font-bold text-graphite" onClick={close} autoFocus>
                  Close
                </button>
              </span>
            </figcaption>
          </figure>
        )}
      </dialog>
    </>
  );
}
