import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { appRoutes } from '@/app-routes';
import { NoticeArea } from '@/components/notice-area';

const router = createBrowserRouter(appRoutes);

export function App() {
  return (
    <>
      <RouterProvider router={router} />
      <NoticeArea />
    </>
  );
}
