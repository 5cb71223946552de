import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { NotFoundRoute } from '@/routes/not-found';
import { OverviewRoute } from '@/routes/overview';
import { RootLayout } from '@/routes/root-layout';
import { RouteErrorScreen } from '@/routes/route-error';

const router = createBrowserRouter([
  {
    path: '/',
    element: <RootLayout />,
    errorElement: <RouteErrorScreen />,
    children: [
      { index: true, element: <OverviewRoute />, errorElement: <RouteErrorScreen /> },
      { path: '*', element: <NotFoundRoute /> },
    ],
  },
]);

export function App() {
  return <RouterProvider router={router} />;
}
