import '@fontsource/nunito/latin-400.css';
import '@fontsource/nunito/latin-700.css';
import '@fontsource/nunito/latin-800.css';
import './index.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import { UpdateBanner } from './features/app-update/components/update-banner';
import { applyTheme, storedTheme } from './lib/theme';

applyTheme(storedTheme());

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
      {import.meta.env.PROD && <UpdateBanner />}
    </AppProvider>
  </StrictMode>,
);
