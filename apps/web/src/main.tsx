// First: starts the session, and the shelf's chunk and bundles, before the rest of the app is evaluated.
import { queryClient } from './app/start.ts';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/index.tsx';
import './styles.css';

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element.');

createRoot(container).render(
  <StrictMode>
    <App queryClient={queryClient} />
  </StrictMode>,
);
