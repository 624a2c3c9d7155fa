import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './app/index.tsx';
import { followSignedIn, startFirstPage } from './app/first-page.ts';
import { makeQueryClient } from './app/provider.tsx';
import { getSessionQueryOptions } from './features/auth/api/get-session.ts';
import './styles.css';

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element.');

// The first page waits for its lazy route chunk before the layout mounts and asks for the
// session; asking now lets both travel at once. The layout's useSession finds it in flight.
const queryClient = makeQueryClient();
followSignedIn(queryClient);
void queryClient.prefetchQuery(getSessionQueryOptions());
startFirstPage(queryClient, window.location);

createRoot(container).render(
  <StrictMode>
    <App queryClient={queryClient} />
  </StrictMode>,
);
