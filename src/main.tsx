import './lib/zod-jitless';
import { StrictMode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import './index.css';
import { AppProvider } from './app/provider';
import { AppRouter, createAppRouter } from './app/router';
import { readServerState } from './app/server-state';

async function start() {
  const container = document.getElementById('root')!;
  const serverState = readServerState();
  const router = await createAppRouter({ hydrating: Boolean(serverState) });
  const app = (
    <StrictMode>
      <AppProvider dehydratedState={serverState?.queries}>
        <AppRouter router={router} />
      </AppProvider>
    </StrictMode>
  );
  if (serverState) hydrateRoot(container, app);
  else createRoot(container).render(app);
}

void start();
