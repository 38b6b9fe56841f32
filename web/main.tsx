import '@fontsource-variable/inter';
import '@fontsource-variable/jetbrains-mono';
import './index.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import { createQueryClient } from './lib/query-client';

const queryClient = createQueryClient();
const rootElement = document.getElementById('root');
if (!rootElement) throw new Error('index.html must contain <div id="root">');

createRoot(rootElement).render(
  <StrictMode>
    <AppProvider queryClient={queryClient}>
      <AppRouter queryClient={queryClient} />
    </AppProvider>
  </StrictMode>,
);
