import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/inter/400.css';
import '@fontsource/inter/500.css';
import '@fontsource/inter/600.css';
import '@fontsource/inter/700.css';
import '@mantine/core/styles.css';
import '@mantine/notifications/styles.css';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';

const rootElement = document.getElementById('root');
if (!rootElement) throw new Error('The page has no #root element to mount Ladderwright into.');

createRoot(rootElement).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
