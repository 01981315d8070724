import type { SaveState } from '../lib/use-autosave';

const time = (d: Date) => d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });

/** "Saved 12:03" / "Saving…" / what stops the save, in one line beside the heading. */
export function SaveStatus({ state, onRetry }: { state: SaveState; onRetry: () => void }) {
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
    case 'saved':
      text = `Saved ${time(state.at)}`;
      tone = 'text-ink';
      break;
    case 'incomplete':
      text = (
        <>
          Not saved yet: {state.issues[0]?.message ?? 'some fields are missing'}
          {state.issues.length > 1 && ` (+${state.issues.length - 1} more)`}. Kept on this device.
        </>
      );
      tone = 'text-brass-deep';
      break;
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
    >
      {text}
    </p>
  );
}
