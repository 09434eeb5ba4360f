import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { Layout } from './routes/Layout';
import { HomePage } from './routes/HomePage';
import { SignInPage } from './routes/SignInPage';
import { RegisterPage } from './routes/RegisterPage';
import { AdminUsersPage } from './routes/AdminUsersPage';
import { NotFoundPage } from './routes/NotFoundPage';

export const routes: RouteObject[] = [
  {
    element: <Layout />,
    children: [
      { path: '/', element: <HomePage /> },
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/register', element: <RegisterPage /> },
      { path: '/admin/users', element: <AdminUsersPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];

export const router = createBrowserRouter(routes);
