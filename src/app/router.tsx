import { createBrowserRouter, Navigate, RouterProvider } from 'react-router-dom';
import { Shell } from './layout/shell';
import { NotFoundRoute } from './routes/not-found';
import { TodayRoute } from './routes/today';

// Today is the route people open at the rack, so it ships in the first bundle; every other
// screen (sign-in and its forms included) loads on first use and is precached for offline use.
const router = createBrowserRouter([
  {
    path: '/sign-in',
    lazy: () => import('./routes/sign-in').then((m) => ({ Component: m.SignInRoute })),
  },
  {
    path: '/sign-up',
    lazy: () => import('./routes/sign-up').then((m) => ({ Component: m.SignUpRoute })),
  },
  {
    path: '/sign-up/finish',
    lazy: () => import('./routes/sign-up-finish').then((m) => ({ Component: m.SignUpFinishRoute })),
  },
  {
    path: '/forgot-password',
    lazy: () =>
      import('./routes/forgot-password').then((m) => ({ Component: m.ForgotPasswordRoute })),
  },
  {
    path: '/reset-password',
    lazy: () =>
      import('./routes/reset-password').then((m) => ({ Component: m.ResetPasswordRoute })),
  },
  {
    path: '/cover/accept',
    lazy: () => import('./routes/cover-accept').then((m) => ({ Component: m.CoverAcceptRoute })),
  },
  // A keeper's invite: the same page, which reads the invite's kind from the server.
  {
    path: '/join',
    lazy: () => import('./routes/cover-accept').then((m) => ({ Component: m.CoverAcceptRoute })),
  },
  // Sales — payments: the buyer's page after card checkout (no sign-in, no app chrome).
  {
    path: '/payment/done',
    lazy: () => import('./routes/payment-done').then((m) => ({ Component: m.PaymentDoneRoute })),
  },
  {
    path: '/dev/mailbox',
    lazy: () => import('./routes/dev-mailbox').then((m) => ({ Component: m.DevMailboxRoute })),
  },
  // Sales — L: a breeder's public availability list, no sign-in, no app chrome.
  {
    path: '/available/:token',
    lazy: () => import('./routes/availability').then((m) => ({ Component: m.AvailabilityRoute })),
  },
  {
    element: <Shell />,
    children: [
      { path: '/', element: <Navigate to="/today" replace /> },
      { path: '/today', element: <TodayRoute /> },
      {
        path: '/today/checklist',
        lazy: () =>
          import('./routes/today-checklist').then((m) => ({ Component: m.TodayChecklistRoute })),
      },
      {
        path: '/tomorrow',
        lazy: () => import('./routes/tomorrow').then((m) => ({ Component: m.TomorrowRoute })),
      },
      {
        path: '/animals',
        lazy: () => import('./routes/animals').then((m) => ({ Component: m.AnimalsRoute })),
      },
      {
        path: '/animals/new',
        lazy: () => import('./routes/animal-edit').then((m) => ({ Component: m.AnimalEditRoute })),
      },
      {
        path: '/animals/:animalId',
        lazy: () => import('./routes/animal').then((m) => ({ Component: m.AnimalRoute })),
      },
      {
        path: '/animals/:animalId/edit',
        lazy: () => import('./routes/animal-edit').then((m) => ({ Component: m.AnimalEditRoute })),
      },
      // Sales — L
      {
        path: '/sales/stock',
        lazy: () => import('./routes/sales-stock').then((m) => ({ Component: m.SalesStockRoute })),
      },
      {
        path: '/colonies',
        lazy: () => import('./routes/colonies').then((m) => ({ Component: m.ColoniesRoute })),
      },
      {
        path: '/colonies/:colonyId',
        lazy: () => import('./routes/colony').then((m) => ({ Component: m.ColonyRoute })),
      },
      // Sales — S: reservations and sales, buyers, settings, one sale (/sales/stock is L's).
      {
        path: '/sales',
        lazy: () => import('./routes/sales').then((m) => ({ Component: m.SalesRoute })),
      },
      {
        path: '/sales/buyers',
        lazy: () =>
          import('./routes/sales-buyers').then((m) => ({ Component: m.SalesBuyersRoute })),
      },
      {
        path: '/sales/settings',
        lazy: () =>
          import('./routes/sales-settings').then((m) => ({ Component: m.SalesSettingsRoute })),
      },
      {
        path: '/sales/:saleId',
        lazy: () =>
          import('./routes/sales-detail').then((m) => ({ Component: m.SalesDetailRoute })),
      },
      {
        path: '/breeding',
        lazy: () => import('./routes/breeding').then((m) => ({ Component: m.BreedingRoute })),
      },
      {
        path: '/cover',
        lazy: () => import('./routes/cover').then((m) => ({ Component: m.CoverRoute })),
      },
      {
        path: '/places',
        lazy: () => import('./routes/places').then((m) => ({ Component: m.PlacesRoute })),
      },
      {
        path: '/climate',
        lazy: () => import('./routes/climate').then((m) => ({ Component: m.ClimateRoute })),
      },
      {
        path: '/import',
        lazy: () => import('./routes/import').then((m) => ({ Component: m.ImportRoute })),
      },
      {
        path: '/labels',
        lazy: () => import('./routes/labels').then((m) => ({ Component: m.LabelsRoute })),
      },
      {
        path: '/scan',
        lazy: () => import('./routes/scan').then((m) => ({ Component: m.ScanRoute })),
      },
      // What a label's QR opens, also from a phone's own camera app (matched in any case).
      {
        path: '/l/:tag/:code',
        lazy: () => import('./routes/label-link').then((m) => ({ Component: m.LabelLinkRoute })),
      },
      {
        path: '/collections/new',
        lazy: () =>
          import('./routes/new-collection').then((m) => ({ Component: m.NewCollectionRoute })),
      },
      {
        path: '/attention',
        lazy: () => import('./routes/attention').then((m) => ({ Component: m.AttentionRoute })),
      },
      {
        path: '/settings/rules',
        lazy: () => import('./routes/rules').then((m) => ({ Component: m.RulesRoute })),
      },
      {
        path: '/settings/people',
        lazy: () => import('./routes/people').then((m) => ({ Component: m.PeopleRoute })),
      },
      {
        path: '/settings',
        lazy: () => import('./routes/settings').then((m) => ({ Component: m.SettingsRoute })),
      },
    ],
  },
  { path: '*', element: <NotFoundRoute /> },
]);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
