import { useState } from 'react';
import { RouterProvider } from 'react-router-dom';
import { AppProvider } from './provider.tsx';
import { createAppRouter } from './router.tsx';

export function App() {
  const [router] = useState(createAppRouter);
  return (
    <AppProvider>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
