import { lazy, Suspense, type ReactNode } from 'react';
import { createBrowserRouter, Navigate, Outlet, RouterProvider, useLocation } from 'react-router-dom';
import { PageSpinner } from '../components/page-spinner';
import { paths } from '../config/paths';
import { accessFor, type Access } from '../lib/access';
import { useAuth } from '../lib/auth';

const SignInPage = lazy(() => import('./routes/sign-in').then((m) => ({ default: m.SignInPage })));
const AppShell = lazy(() => import('./layouts/app-shell').then((m) => ({ default: m.AppShell })));
const HomePage = lazy(() => import('./routes/home').then((m) => ({ default: m.HomePage })));
const UsersPage = lazy(() => import('./routes/admin/users').then((m) => ({ default: m.UsersPage })));
const NotFoundPage = lazy(() => import('./routes/not-found').then((m) => ({ default: m.NotFoundPage })));

function RequireAuth() {
  const { user, loading } = useAuth();
  const location = useLocation();
  if (loading) return <PageSpinner />;
  if (!user) return <Navigate to={paths.signIn} replace state={{ from: location.pathname }} />;
  return <Outlet />;
}

function RequireAccess({ allow, children }: { allow: keyof Access; children: ReactNode }) {
  const { user } = useAuth();
  return accessFor(user?.role)[allow] ? <>{children}</> : <NotFoundPage />;
}

const router = createBrowserRouter([
  { path: paths.signIn, element: <SignInPage /> },
  {
    element: <RequireAuth />,
    children: [
      {
        element: <AppShell />,
        children: [
          { path: paths.home, element: <HomePage /> },
          { path: paths.users, element: <RequireAccess allow="canManageUsers"><UsersPage /></RequireAccess> },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
]);

export function AppRouter() {
  return (
    <Suspense fallback={<PageSpinner />}>
      <RouterProvider router={router} />
    </Suspense>
  );
}
