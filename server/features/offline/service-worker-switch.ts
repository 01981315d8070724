import { Router } from 'express';

/**
 * With SERVICE_WORKER=off, /sw.js is a worker that unregisters itself at once: browsers that installed
 * the offline app drop it on their next visit, and a fresh browser ends up with none. It has no fetch
 * handler, so every request goes to the network untouched.
 */
const removeItself = `self.addEventListener('install', () => self.skipWaiting());
self.addEventListener('activate', (event) => {
  event.waitUntil(self.registration.unregister());
});
`;

export function serviceWorkerSwitch() {
  const router = Router();
  router.get('/sw.js', (_req, res) => {
    res.set('Cache-Control', 'no-cache').type('text/javascript').send(removeItself);
  });
  return router;
}
