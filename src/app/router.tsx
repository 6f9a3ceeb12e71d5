import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { AnimalsRoute } from './routes/animals';
import { DevMailboxRoute } from './routes/dev-mailbox';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { SettingsRoute } from './routes/settings';
import { Shell } from './routes/shell';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { TodayRoute } from './routes/today';

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
      { path: '/animals', element: <AnimalsRoute /> },
      { path: '/settings', element: <SettingsRoute /> },
    ],
  },
  { path: '*', element: <NotFoundRoute /> },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
