import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// One variable font file (weight axis only) carries every weight the screens use; index.html preloads its
// Latin part, the one the first screen needs.
import '@fontsource-variable/nunito-sans/wght.css';
import './styles.css';
import { App } from './app/app.tsx';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
