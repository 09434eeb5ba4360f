import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { Layout } from './components/ui/Layout';
import { HomePage } from './features/table/routes/HomePage';
import { SignInPage } from './features/account/routes/SignInPage';
import { RegisterPage } from './features/account/routes/RegisterPage';
import { AdminUsersPage } from './features/account/routes/AdminUsersPage';
import { NotFoundPage } from './components/ui/NotFoundPage';
import { RouteErrorPage } from './components/ui/RouteErrorPage';

export const routes: RouteObject[] = [
  {
    element: <Layout />,
    errorElement: <RouteErrorPage />,
    children: [
      { path: '/', element: <HomePage /> },
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/register', element: <RegisterPage /> },
      { path: '/admin/users', element: <AdminUsersPage /> },
      // The live table, replays and history load their own code, so sign-in and home stay small.
      { path: '/tables/:id', handle: { wide: true }, lazy: async () => ({ Component: (await import('./features/table/routes/TablePage')).TablePage }) },
      { path: '/replays/:id', handle: { wide: true }, lazy: async () => ({ Component: (await import('./features/replay/routes/ReplayPage')).ReplayPage }) },
      { path: '/progress', lazy: async () => ({ Component: (await import('./features/history/routes/ProgressPage')).ProgressPage }) },
      { path: '/progress/:userId', lazy: async () => ({ Component: (await import('./features/history/routes/ProgressPage')).ProgressPage }) },
      { path: '/compare', handle: { wide: true }, lazy: async () => ({ Component: (await import('./features/history/routes/ComparisonPage')).ComparisonPage }) },
      { path: '/compare/:kind/:id', handle: { wide: true }, lazy: async () => ({ Component: (await import('./features/history/routes/ComparisonPage')).ComparisonPage }) },
      { path: '/history', lazy: async () => ({ Component: (await import('./features/history/routes/HistoryPage')).HistoryPage }) },
      { path: '/drills', lazy: async () => ({ Component: (await import('./features/teaching/routes/DrillsPage')).DrillsPage }) },
      { path: '/drills/new', lazy: async () => ({ Component: (await import('./features/teaching/routes/DrillEditPage')).DrillEditPage }) },
      { path: '/drills/:id', lazy: async () => ({ Component: (await import('./features/teaching/routes/DrillEditPage')).DrillEditPage }) },
      { path: '/pattern-lists', lazy: async () => ({ Component: (await import('./features/teaching/routes/PatternListsPage')).PatternListsPage }) },
      { path: '/pattern-lists/new', lazy: async () => ({ Component: (await import('./features/teaching/routes/PatternListEditPage')).PatternListEditPage }) },
      { path: '/pattern-lists/:id', lazy: async () => ({ Component: (await import('./features/teaching/routes/PatternListEditPage')).PatternListEditPage }) },
      { path: '/lessons', lazy: async () => ({ Component: (await import('./features/lessons/routes/LessonsPage')).LessonsPage }) },
      { path: '/lessons/:id', lazy: async () => ({ Component: (await import('./features/lessons/routes/LessonPage')).LessonPage }) },
      { path: '/lessons/:id/receipt', lazy: async () => ({ Component: (await import('./features/lessons/routes/ReceiptPage')).ReceiptPage }) },
      { path: '/invitations/:token', lazy: async () => ({ Component: (await import('./features/lessons/routes/InvitationPage')).InvitationPage }) },
      { path: '/mail', lazy: async () => ({ Component: (await import('./features/lessons/routes/OutboxPage')).OutboxPage }) },
      { path: '/forgot-password', lazy: async () => ({ Component: (await import('./features/account/routes/ForgotPasswordPage')).ForgotPasswordPage }) },
      { path: '/reset-password/:token', lazy: async () => ({ Component: (await import('./features/account/routes/ResetPasswordPage')).ResetPasswordPage }) },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];

export const router = createBrowserRouter(routes);
