import { useEffect } from 'react';
import { registerServiceWorker } from '../service-worker';
import { useOnline } from '../use-online';

/** Says so when the connection is gone, and sets up reading without one (the service worker). */
export function OfflineBanner() {
  const online = useOnline();
  useEffect(registerServiceWorker, []);
  if (online) return null;
  return (
    <div role="status" className="no-print border-b border-brass bg-brass-soft text-ink">
      <p className="mx-auto max-w-sheet px-4 py-2 text-sm sm:px-6">
        <strong className="font-extrabold">You are offline.</strong> Sheets kept on this device and your cars still read, with
        their checks; anything else waits for a connection.
      </p>
    </div>
  );
}
