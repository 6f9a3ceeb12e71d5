// The baseline for P2 and P3 (docs/benchmarks.md, Budgets): the least a React + router + query + PWA
// app can be, measured the same way as Rackside.
import { QueryClient, QueryClientProvider, useQuery } from '@tanstack/react-query';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { registerSW } from 'virtual:pwa-register';

function Today() {
  const data = useQuery({
    queryKey: ['text'],
    queryFn: async () => 'Twenty-two animals on the round today.',
    networkMode: 'always',
  });
  return (
    <main style={{ fontFamily: 'sans-serif', padding: 16 }}>
      <h1 style={{ fontSize: 30 }}>Today</h1>
      <p style={{ fontSize: 18 }}>{data.data ?? '…'}</p>
    </main>
  );
}

registerSW({ immediate: true });
const router = createBrowserRouter([{ path: '*', element: <Today /> }]);
createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <QueryClientProvider client={new QueryClient()}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
