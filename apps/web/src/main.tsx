import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// One variable font file (weight axis only) carries every weight the screens use; index.html preloads its
// Latin part, the one the first screen needs.
import '@fontsource-variable/nunito-sans/wght.css';
import './styles.css';
import { App } from './app/app.tsx';
import { startOfflineStore } from './app/offline-store.ts';
import { queryClient } from './app/query-client.ts';
import { registerServiceWorker } from './app/service-worker.ts';
import { applyStoredTheme } from './app/theme.ts';

applyStoredTheme();
registerServiceWorker();
// The phone's saved day and queued changes are back in the cache before the first screen asks for them.
void startOfflineStore(queryClient).then(() =>
  createRoot(document.getElementById('root')!).render(
    <StrictMode>
      <App />
    </StrictMode>,
  ),
);
