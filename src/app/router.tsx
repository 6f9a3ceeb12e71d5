import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { AnimalRoute } from './routes/animal';
import { AnimalsRoute } from './routes/animals';
import { DevMailboxRoute } from './routes/dev-mailbox';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { RulesRoute } from './routes/rules';
import { SettingsRoute } from './routes/settings';
import { Shell } from './routes/shell';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { TodayRoute } from './routes/today';
import { TomorrowRoute } from './routes/tomorrow';

const router = createBrowserRouter([
  { path: '/sign-in', element: <SignInRoute /> },
  { path: '/sign-up', element: <SignUpRoute /> },
  { path: '/forgot-password', element: <ForgotPasswordRoute /> },
  { path: '/reset-password', element: <ResetPasswordRoute /> },
  { path: '/dev/mailbox', element: <DevMailboxRoute /> },
  {
    element: <Shell />,
    children: [
      { path: '/', element: <Navigate to="/today" replace /> },
      { path: '/today', element: <TodayRoute /> },
      { path: '/tomorrow', element: <TomorrowRoute /> },
      { path: '/animals', element: <AnimalsRoute /> },
      { path: '/animals/:animalId', element: <AnimalRoute /> },
      { path: '/settings/rules', element: <RulesRoute /> },
      { path: '/settings', element: <SettingsRoute /> },
    ],
  },
  { path: '*', element: <NotFoundRoute /> },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
