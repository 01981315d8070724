import { useEffect, useState, useSyncExternalStore } from 'react';
import type { SwapSheetView } from '@shared/schemas/views';
import { Button } from '../../../components/ui/button';
import { forgetSheet, isKept, keepSheet, keptSheets, offlineStorageAvailable, sheetUrls } from '../kept-sheets';
import { useOnline } from '../use-online';

type State = { kind: 'idle' } | { kind: 'busy' } | { kind: 'failed'; message: string };

const noSubscription = () => () => {};
/** Whether this browser can keep sheets; a page the server drew is hydrated without the button, then shows it. */
const useStorageAvailable = () => useSyncExternalStore(noSubscription, offlineStorageAvailable, () => false);

/**
 * "Keep offline" on a sheet: stores the sheet and its photos on this device, so it reads in the garage
 * without a connection, with its checks (they are computed on the device from the kept sheet).
 */
export function KeepOfflineButton({ view, number }: { view: SwapSheetView; number: number | null }) {
  const online = useOnline();
  const available = useStorageAvailable();
  const [kept, setKept] = useState(false);
  const [state, setState] = useState<State>({ kind: 'idle' });
  const slug = view.swap.slug;

  useEffect(() => {
    if (!offlineStorageAvailable()) return;
    const wasKept = isKept(slug, number);
    setKept(wasKept);
    // a kept sheet that has changed since (a new revision, other photos) is kept again as it is now
    const entry = keptSheets().find((k) => k.slug === slug && k.number === number);
    if (wasKept && online && entry && entry.urls.join() !== sheetUrls(view, number).join())
      void keepSheet(view, number).catch(() => {});
  }, [view, slug, number, online]);

  if (!available) return null;

  const keep = async () => {
    setState({ kind: 'busy' });
    try {
      await keepSheet(view, number);
      setKept(true);
      setState({ kind: 'idle' });
    } catch {
      setState({ kind: 'failed', message: 'It could not be kept just now. Check the connection and try again.' });
    }
  };
  const forget = async () => {
    await forgetSheet(slug, number);
    setKept(false);
  };

  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      {kept ? (
        <>
          <span role="status" className="text-sm font-bold text-ink">
            ✓ Kept on this device
          </span>
          <Button variant="quiet" onClick={() => void forget()}>
            Remove from device
          </Button>
        </>
      ) : (
        <Button variant="secondary" disabled={!online || state.kind === 'busy'} onClick={() => void keep()}>
          {state.kind === 'busy' ? 'Keeping…' : 'Keep offline'}
        </Button>
      )}
      {state.kind === 'failed' && (
        <span role="alert" className="text-sm text-oxide">
          {state.message}
        </span>
      )}
    </span>
  );
}
