import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { BrowserRouter } from 'react-router-dom';
import { App } from './app/App';
import './styles.css';

// Local data never goes stale behind our back: queries are invalidated by our own writes.
// Local data lives in IndexedDB: queries and mutations run offline too (the default 'online' mode would pause them).
const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false, networkMode: 'always' }, mutations: { networkMode: 'always' } } });

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <BrowserRouter>
        <App />
      </BrowserRouter>
    </QueryClientProvider>
  </StrictMode>,
);
