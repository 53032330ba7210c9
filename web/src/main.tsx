import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
// IBM Plex Sans ships with the app (no font from the network): the weights we use.
import '@fontsource/ibm-plex-sans/400.css';
import '@fontsource/ibm-plex-sans/500.css';
import '@fontsource/ibm-plex-sans/600.css';
import './app/global.css';
import { App } from './app/app';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
