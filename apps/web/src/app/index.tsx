import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { RouterProvider } from 'react-router-dom';
import { AppProvider } from './provider.tsx';
import { createAppRouter } from './router.tsx';

/** `queryClient`: one made before the first render (main.tsx fills it with the session early). */
export function App({ queryClient }: { queryClient?: QueryClient }) {
  const [router] = useState(createAppRouter);
  return (
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
