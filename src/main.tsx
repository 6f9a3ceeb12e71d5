import '@fontsource/nunito/latin-400.css';
import '@fontsource/nunito/latin-700.css';
import '@fontsource/nunito/latin-800.css';
import './index.css';
import { lazy, StrictMode, Suspense } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import { withDb } from './lib/db';
import { hasEarlyAnswer } from './lib/early-requests';
import { applyTheme, storedTheme } from './lib/theme';

applyTheme(storedTheme());
// Open the phone's database while React starts: the first screen reads from it (P2).
void withDb(async () => undefined).catch(() => undefined);
// The page already asked for the round (src/first-visit.ts): its schema is read while the rest
// of the app starts, not after the answer is in (P3).
if (hasEarlyAnswer((path) => path.endsWith('/rounds/today')))
  void import('#shared/schemas/rounds').catch(() => undefined);

// The service worker's helper is not needed to draw the first screen.
const UpdateBanner = lazy(() =>
  import('./features/app-update/components/update-banner').then((m) => ({
    default: m.UpdateBanner,
  })),
);

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
      {import.meta.env.PROD && (
        <Suspense>
          <UpdateBanner />
        </Suspense>
      )}
    </AppProvider>
  </StrictMode>,
);
