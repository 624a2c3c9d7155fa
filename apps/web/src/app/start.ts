import { getSessionQueryOptions } from '../features/auth/api/get-session.ts';
import { followSignedIn, startFirstPage } from './first-page.ts';
import { makeQueryClient } from './provider.tsx';

/*
 * The requests a cold load starts with, made while the rest of the entry chunk (React DOM, the router) is still
 * to be evaluated: main.tsx imports this module first, and modules run in import order. So nothing this module
 * imports may bring in react-dom or react-router. The first page waits for its lazy route chunk before the
 * layout mounts and asks for the session; asking here lets both travel at once, and the layout's useSession
 * finds the session in flight.
 */
export const queryClient = makeQueryClient();
followSignedIn(queryClient);
void queryClient.prefetchQuery(getSessionQueryOptions());
startFirstPage(queryClient, window.location);
