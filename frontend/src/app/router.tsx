import { lazy, Suspense, type ReactNode } from 'react';
import { createBrowserRouter, Navigate, Outlet, RouterProvider, useLocation } from 'react-router-dom';
import { PageSpinner } from '../components/page-spinner';
import { paths } from '../config/paths';
import { accessFor, type Access } from '../lib/access';
import { useAuth } from '../lib/auth';

const page = <T extends string>(load: () => Promise<Record<T, React.ComponentType>>, name: T) =>
  lazy(() => load().then((m) => ({ default: m[name] })));

const SignInPage = page(() => import('./routes/sign-in'), 'SignInPage');
const AppShell = page(() => import('./layouts/app-shell'), 'AppShell');
const HomePage = page(() => import('./routes/home'), 'HomePage');
const UsersPage = page(() => import('./routes/admin/users'), 'UsersPage');
const NotFoundPage = page(() => import('./routes/not-found'), 'NotFoundPage');
const MovesListPage = page(() => import('./routes/moves/moves-list'), 'MovesListPage');
const MoveFormPage = page(() => import('./routes/moves/move-form'), 'MoveFormPage');
const MovePage = page(() => import('./routes/moves/move-page'), 'MovePage');
const FleetPage = page(() => import('./routes/fleet/fleet'), 'FleetPage');
const RulebookPage = page(() => import('./routes/rulebook/rulebook'), 'RulebookPage');
const RulebookStatePage = page(() => import('./routes/rulebook/rulebook-state'), 'RulebookStatePage');
const PermitDeskPage = page(() => import('./routes/permits/permit-desk'), 'PermitDeskPage');
const PaymentsPage = page(() => import('./routes/permits/payments'), 'PaymentsPage');
const VendorsPage = page(() => import('./routes/escorts/vendors'), 'VendorsPage');
const EscortResponsePage = page(() => import('./routes/escorts/escort-response'), 'EscortResponsePage');
const RunSheetsPage = page(() => import('./routes/run-sheets/run-sheets'), 'RunSheetsPage');
const RunSheetPage = page(() => import('./routes/run-sheets/run-sheet'), 'RunSheetPage');

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

const guarded = (allow: keyof Access, el: ReactNode) => <RequireAccess allow={allow}>{el}</RequireAccess>;

const router = createBrowserRouter([
  { path: paths.signIn, element: <SignInPage /> },
  // escort vendors answer through a signed link, without an account
  { path: paths.escortResponse, element: <EscortResponsePage /> },
  {
    element: <RequireAuth />,
    children: [
      {
        element: <AppShell />,
        children: [
          { path: paths.home, element: <HomePage /> },
          { path: paths.moves, element: guarded('canSeeMoves', <MovesListPage />) },
          { path: paths.moveNew, element: guarded('canEditMoves', <MoveFormPage />) },
          { path: paths.move, element: guarded('canSeeMoves', <MovePage />) },
          { path: paths.moveEdit, element: guarded('canEditMoves', <MoveFormPage />) },
          { path: paths.fleet, element: guarded('canSeeFleet', <FleetPage />) },
          { path: paths.rulebook, element: guarded('canSeeRulebook', <RulebookPage />) },
          { path: paths.rulebookState, element: guarded('canSeeRulebook', <RulebookStatePage />) },
          { path: paths.permits, element: guarded('canSeePermitDesk', <PermitDeskPage />) },
          { path: paths.payments, element: guarded('canSeePayments', <PaymentsPage />) },
          { path: paths.vendors, element: guarded('canManageVendors', <VendorsPage />) },
          { path: paths.runSheets, element: guarded('canSeeRunSheets', <RunSheetsPage />) },
          { path: paths.runSheet, element: guarded('canSeeRunSheets', <RunSheetPage />) },
          { path: paths.users, element: guarded('canManageUsers', <UsersPage />) },
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
