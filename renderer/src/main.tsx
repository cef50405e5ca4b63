// Entry of the UI: picks the host (Electron preload or browser) and mounts the editor.
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/noto-sans/latin-400.css';
import '@fontsource/noto-sans/latin-500.css';
import '@fontsource/noto-sans/latin-600.css';
import '@fontsource/noto-sans/latin-700.css';
import './styles.css';
import { App } from './App';
import { pickHost } from './host/pickHost';

const root = document.getElementById('root');
if (!root) throw new Error('The page has no #root element.');
createRoot(root).render(
  <StrictMode>
    <App host={pickHost()} />
  </StrictMode>,
);
