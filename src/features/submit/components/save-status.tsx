import type { SaveState } from '../lib/use-autosave';
import { placeOf } from '../lib/form-values';
import { formatTime } from '@shared/dates';

const time = (d: Date) => formatTime(d);

/** A link to the field a problem belongs to: it scrolls there and puts the cursor in it. */
export function FieldLink({ path, onGo }: { path: string; onGo: (path: string) => void }) {
  const place = placeOf(path);
  return (
    <a
      href={`#${place.section}`}
      className="font-bold underline"
      onClick={(e) => {
        e.preventDefault();
        onGo(path);
      }}
    >
      {place.words}
    </a>
  );
}

/**
 * "Saved 12:03" / "Saving…" / what stops the save, in one line beside the heading. It says "Saved"
 * only when the server holds everything the page shows, rows kept as incomplete included.
 */
export function SaveStatus({ state, onRetry, onGo }: { state: SaveState; onRetry: () => void; onGo: (path: string) => void }) {
  let text: React.ReactNode;
  let tone = 'text-graphite-soft';
  switch (state.kind) {
    case 'idle':
      text = 'Not saved yet';
      break;
    case 'pending':
      text = 'Unsaved changes…';
      break;
    case 'saving':
      text = 'Saving…';
      break;
    case 'saved': {
      const first = state.unfinished?.[0];
      const rows = new Set(state.unfinished?.map((i) => placeOf(i.path).words.split(', ').slice(0, 2).join(', ')));
      text = first ? (
        <>
          Saved {time(state.at)}, with {rows.size === 1 ? 'a row' : `${rows.size} rows`} kept as incomplete:{' '}
          <FieldLink path={first.path} onGo={onGo} /> — {first.message.toLowerCase()}. Finish it before sending.
        </>
      ) : (
        `Saved ${time(state.at)}`
      );
      tone = 'text-ink';
      break;
    }
    case 'incomplete': {
      const first = state.issues[0];
      text = first ? (
        <>
          Not saved yet: <FieldLink path={first.path} onGo={onGo} /> — {first.message.toLowerCase()}
          {state.issues.length > 1 && ` (+${state.issues.length - 1} more)`}. Kept on this device until then.
        </>
      ) : (
        'Not saved yet. Kept on this device.'
      );
      tone = 'text-brass-deep';
      break;
    }
    case 'error':
      text = (
        <>
          Not saved: {state.message} Your input is still here.{' '}
          <button type="button" className="font-bold underline" onClick={onRetry}>
            Try again
          </button>
        </>
      );
      tone = 'text-oxide';
      break;
  }
  return (
    <p
      role="status"
      aria-live="polite"
      className={`max-w-xs sm:text-right text-sm font-semibold ${tone}`}
      data-save-state={state.kind}
      data-unfinished={state.kind === 'saved' ? (state.unfinished?.length ?? 0) : undefined}
    >
      {text}
    </p>
  );
}
