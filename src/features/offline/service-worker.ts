/**
 * Registers the service worker in the built app (never in development, where Vite serves modules one by
 * one). A server started with SERVICE_WORKER=off answers /sw.js with one that removes itself.
 */
export function registerServiceWorker() {
  if (!import.meta.env.PROD || typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  navigator.serviceWorker.register('/sw.js', { scope: '/' }).catch(() => {
    // without it the app still works online; nothing to tell the reader
  });
}
