import type { ReactNode } from 'react';
import { createBrowserRouter, Navigate } from 'react-router-dom';
import type { Permission } from '@bumperline/contracts/roles';
import { paths } from '../lib/paths.ts';
import { AppShell } from './app-shell.tsx';
import { RequirePermission, RequireSignedIn } from './guards.tsx';
import { useMe } from '../api/me.ts';
import { Loading } from '../components/states.tsx';
import { prefetchStartPage, StartPage } from './start-page.tsx';
import { LandingPage } from '../features/home/landing-page.tsx';
import { prefetchCalls } from '../features/calls/calls-queries.ts';
import { prefetchRouteDays } from '../features/route-days/route-days-queries.ts';
import { prefetchCarePlan, prefetchCarePlans } from '../features/care-plans/care-plans-queries.ts';
import { prefetchWorkOrder, prefetchWorkOrders } from '../features/work-orders/work-orders-queries.ts';
import { prefetchPartsList, prefetchPartsLists } from '../features/parts-lists/parts-lists-queries.ts';
import { prefetchBoard, prefetchRecapDue } from '../features/boards/boards-queries.ts';
import {
  prefetchBench,
  prefetchBenchJob,
  prefetchBenchTemplate,
  prefetchBenchTemplates,
  prefetchNewBenchJob,
} from '../features/bench/bench-queries.ts';
import { prefetchPart, prefetchParts } from '../features/parts/parts-queries.ts';
import { prefetchReorder, prefetchStock, prefetchStockLocation } from '../features/stock/stock-queries.ts';
import { prefetchVan } from '../features/van/van-queries.ts';
import { NotFoundPage } from './not-found-page.tsx';
import { RouteError } from './route-error.tsx';
import { lazyPage } from './lazy-page.tsx';
import { prefetching } from './prefetch.ts';

// The first bundle holds the shell, the landing page and Today (the first screen of most people); every other
// screen loads on first visit, so forms (zod, react-hook-form) and the map (Leaflet) come only with the screens
// that use them.
const SignInPage = lazyPage(() => import('../features/auth/sign-in-page.tsx').then((m) => m.SignInPage));
const SignUpPage = lazyPage(() => import('../features/auth/sign-up-page.tsx').then((m) => m.SignUpPage));
const SignInLinkPage = lazyPage(() =>
  import('../features/auth/password-pages.tsx').then((m) => () => <m.RequestLinkPage kind="sign-in-link" />),
);
const ForgotPasswordPage = lazyPage(() =>
  import('../features/auth/password-pages.tsx').then((m) => () => <m.RequestLinkPage kind="password-reset" />),
);
const ResetPasswordPage = lazyPage(() => import('../features/auth/password-pages.tsx').then((m) => m.ResetPasswordPage));
const LinkSignInPage = lazyPage(() => import('../features/auth/link-sign-in-page.tsx').then((m) => m.LinkSignInPage));
const InvitationPage = lazyPage(() => import('../features/auth/invitation-page.tsx').then((m) => m.InvitationPage));
const VerifyEmailPage = lazyPage(() => import('../features/auth/verify-email-page.tsx').then((m) => m.VerifyEmailPage));
const CallsPage = lazyPage(() => import('../features/calls/calls-page.tsx').then((m) => m.CallsPage));
const CallPage = lazyPage(() => import('../features/calls/call-page.tsx').then((m) => m.CallPage));
const SettingsPage = lazyPage(() => import('../features/settings/settings-page.tsx').then((m) => m.SettingsPage));
const VenuesPage = lazyPage(() => import('../features/venues/venues-page.tsx').then((m) => m.VenuesPage));
const VenuePage = lazyPage(() => import('../features/venues/venue-page.tsx').then((m) => m.VenuePage));
const EditVenuePage = lazyPage(() => import('../features/venues/venue-form-page.tsx').then((m) => m.EditVenuePage));
const NewVenuePage = lazyPage(() => import('../features/venues/venue-form-page.tsx').then((m) => m.NewVenuePage));
const GamesPage = lazyPage(() => import('../features/games/games-page.tsx').then((m) => m.GamesPage));
const GamePage = lazyPage(() => import('../features/games/game-page.tsx').then((m) => m.GamePage));
const EditGamePage = lazyPage(() => import('../features/games/game-form-page.tsx').then((m) => m.EditGamePage));
const NewGamePage = lazyPage(() => import('../features/games/game-form-page.tsx').then((m) => m.NewGamePage));
const TeamPage = lazyPage(() => import('../features/team/team-page.tsx').then((m) => m.TeamPage));
const ActivityPage = lazyPage(() => import('../features/team/activity-page.tsx').then((m) => m.ActivityPage));
const BenchPage = lazyPage(() => import('../features/bench/bench-page.tsx').then((m) => m.BenchPage));
const BenchJobPage = lazyPage(() => import('../features/bench/bench-job-page.tsx').then((m) => m.BenchJobPage));
const JobSheetPage = lazyPage(() => import('../features/bench/job-sheet-page.tsx').then((m) => m.JobSheetPage));
const NewBenchJobPage = lazyPage(() => import('../features/bench/new-bench-job-page.tsx').then((m) => m.NewBenchJobPage));
const BenchTemplatesPage = lazyPage(() => import('../features/bench/bench-page.tsx').then((m) => m.BenchTemplatesPage));
const BenchTemplatePage = lazyPage(() => import('../features/bench/template-page.tsx').then((m) => m.BenchTemplatePage));
const EditBenchTemplatePage = lazyPage(() => import('../features/bench/template-editor-page.tsx').then((m) => m.EditBenchTemplatePage));
const NewBenchTemplatePage = lazyPage(() => import('../features/bench/template-editor-page.tsx').then((m) => m.NewBenchTemplatePage));
const BoardPage = lazyPage(() => import('../features/boards/board-page.tsx').then((m) => m.BoardPage));
const RecapDuePage = lazyPage(() => import('../features/boards/recap-due-page.tsx').then((m) => m.RecapDuePage));
const PartsListsPage = lazyPage(() => import('../features/parts-lists/parts-lists-page.tsx').then((m) => m.PartsListsPage));
const PartsListPage = lazyPage(() => import('../features/parts-lists/parts-list-page.tsx').then((m) => m.PartsListPage));
const MyDayPage = lazyPage(() => import('../features/my-day/my-day-page.tsx').then((m) => m.MyDayPage));
const MyStopPage = lazyPage(() => import('../features/my-day/stop-page.tsx').then((m) => m.StopPage));
const MyChangesPage = lazyPage(() => import('../features/my-day/changes-page.tsx').then((m) => m.ChangesPage));
const RouteDaysPage = lazyPage(() => import('../features/route-days/route-days-page.tsx').then((m) => m.RouteDaysPage));
const PartsPage = lazyPage(() => import('../features/parts/parts-page.tsx').then((m) => m.PartsPage));
const PartPage = lazyPage(() => import('../features/parts/part-page.tsx').then((m) => m.PartPage));
const StockPage = lazyPage(() => import('../features/stock/stock-page.tsx').then((m) => m.StockPage));
const StockLocationPage = lazyPage(() => import('../features/stock/stock-location-page.tsx').then((m) => m.StockLocationPage));
const ReorderPage = lazyPage(() => import('../features/stock/reorder-page.tsx').then((m) => m.ReorderPage));
const VanPage = lazyPage(() => import('../features/van/van-page.tsx').then((m) => m.VanPage));
const CarePlansPage = lazyPage(() => import('../features/care-plans/care-plans-page.tsx').then((m) => m.CarePlansPage));
const CarePlanPage = lazyPage(() => import('../features/care-plans/care-plan-page.tsx').then((m) => m.CarePlanPage));
const NewCarePlanPage = lazyPage(() => import('../features/care-plans/care-plan-editor-page.tsx').then((m) => m.NewCarePlanPage));
const EditCarePlanPage = lazyPage(() => import('../features/care-plans/care-plan-editor-page.tsx').then((m) => m.EditCarePlanPage));
const WorkOrdersPage = lazyPage(() => import('../features/work-orders/work-orders-page.tsx').then((m) => m.WorkOrdersPage));
const WorkOrderPage = lazyPage(() => import('../features/work-orders/work-order-page.tsx').then((m) => m.WorkOrderPage));

/** A screen for those whose role has `permission` (the API checks the same table). */
function guard(permission: Permission, page: ReactNode) {
  return <RequirePermission permission={permission}>{page}</RequirePermission>;
}

/** "/" is the landing page for visitors and the Today screen once signed in. */
function Root() {
  const me = useMe();
  if (me.isLoading) return <Loading />;
  return me.data ? <Navigate to={paths.today} replace /> : <LandingPage />;
}

export const router = createBrowserRouter([
  {
    errorElement: <RouteError />,
    children: [
      // A signed-in visitor at / goes on to Today: its data starts beside /me.
      { path: paths.home, element: <Root />, loader: prefetching(prefetchStartPage) },
      { path: paths.signIn, element: <SignInPage /> },
      { path: paths.signUp, element: <SignUpPage /> },
      { path: paths.signInLink, element: <SignInLinkPage /> },
      { path: paths.signInLinkOpen, element: <LinkSignInPage /> },
      { path: paths.forgotPassword, element: <ForgotPasswordPage /> },
      { path: paths.resetPassword, element: <ResetPasswordPage /> },
      { path: paths.verifyEmail, element: <VerifyEmailPage /> },
      { path: paths.invitation, element: <InvitationPage /> },
      {
        element: (
          <RequireSignedIn>
            <AppShell />
          </RequireSignedIn>
        ),
        children: [
          { path: paths.today, element: <StartPage />, loader: prefetching(prefetchStartPage) },
          {
            path: paths.venues,
            element: guard('venues:read', <VenuesPage />),
          },
          {
            path: paths.newVenue,
            element: guard('venues:write', <NewVenuePage />),
          },
          {
            path: '/venues/:id',
            element: guard('venues:read', <VenuePage />),
          },
          {
            path: '/venues/:id/edit',
            element: guard('venues:write', <EditVenuePage />),
          },
          {
            path: paths.games,
            element: guard('games:read', <GamesPage />),
          },
          {
            path: paths.newGame,
            element: guard('games:write', <NewGamePage />),
          },
          {
            path: '/games/:id',
            element: guard('games:read', <GamePage />),
          },
          {
            path: '/games/:id/edit',
            element: guard('games:write', <EditGamePage />),
          },
          {
            path: paths.calls,
            element: guard('calls:read', <CallsPage />),
            loader: prefetching(prefetchCalls, CallsPage.preload),
          },
          {
            path: '/calls/:id',
            element: guard('calls:read', <CallPage />),
          },
          {
            path: paths.carePlans,
            element: guard('care-plans:read', <CarePlansPage />),
            loader: prefetching(prefetchCarePlans, CarePlansPage.preload),
          },
          {
            path: paths.newCarePlan,
            element: guard('care-plans:write', <NewCarePlanPage />),
            loader: prefetching(() => {}, NewCarePlanPage.preload),
          },
          {
            path: '/care-plans/:id',
            element: guard('care-plans:read', <CarePlanPage />),
            loader: prefetching(prefetchCarePlan, CarePlanPage.preload),
          },
          {
            path: '/care-plans/:id/edit',
            element: guard('care-plans:write', <EditCarePlanPage />),
            loader: prefetching(prefetchCarePlan, EditCarePlanPage.preload),
          },
          {
            path: paths.workOrders,
            element: guard('care-plans:read', <WorkOrdersPage />),
            loader: prefetching(prefetchWorkOrders, WorkOrdersPage.preload),
          },
          {
            path: '/work-orders/:id',
            element: guard('care-plans:read', <WorkOrderPage />),
            loader: prefetching(prefetchWorkOrder, WorkOrderPage.preload),
          },
          {
            path: paths.routeDays,
            element: guard('route-days:plan', <RouteDaysPage />),
            loader: prefetching(prefetchRouteDays, RouteDaysPage.preload),
          },
          {
            path: paths.partsLists,
            element: guard('bench:read', <PartsListsPage />),
            loader: prefetching(prefetchPartsLists, PartsListsPage.preload),
          },
          {
            path: '/parts-lists/:boardId',
            element: guard('bench:read', <PartsListPage />),
            loader: prefetching(prefetchPartsList, PartsListPage.preload),
          },
          {
            path: '/boards/:id',
            element: guard('bench:read', <BoardPage />),
            loader: prefetching(prefetchBoard, BoardPage.preload),
          },
          {
            path: paths.recapDue,
            element: guard('bench:read', <RecapDuePage />),
            loader: prefetching(prefetchRecapDue, RecapDuePage.preload),
          },
          { path: paths.bench, element: guard('bench:read', <BenchPage />), loader: prefetching(prefetchBench, BenchPage.preload) },
          {
            path: '/bench/jobs/:id',
            element: guard('bench:read', <BenchJobPage />),
            loader: prefetching(prefetchBenchJob, BenchJobPage.preload),
          },
          {
            path: '/bench/jobs/:id/sheet',
            element: guard('bench:read', <JobSheetPage />),
            loader: prefetching(prefetchBenchJob, JobSheetPage.preload),
          },
          {
            path: '/bench/new/:boardInstanceId',
            element: guard('bench:work', <NewBenchJobPage />),
            loader: prefetching(prefetchNewBenchJob, NewBenchJobPage.preload),
          },
          {
            path: paths.benchTemplates(),
            element: guard('bench:read', <BenchTemplatesPage />),
            loader: prefetching(prefetchBenchTemplates, BenchTemplatesPage.preload),
          },
          {
            path: paths.newBenchTemplate(),
            element: guard('bench-templates:write', <NewBenchTemplatePage />),
            loader: prefetching(() => {}, NewBenchTemplatePage.preload),
          },
          {
            path: '/bench/templates/:id',
            element: guard('bench:read', <BenchTemplatePage />),
            loader: prefetching(prefetchBenchTemplate, BenchTemplatePage.preload),
          },
          {
            path: '/bench/templates/:id/edit',
            element: guard('bench-templates:write', <EditBenchTemplatePage />),
            loader: prefetching(prefetchBenchTemplate, EditBenchTemplatePage.preload),
          },
          // The technician's phone: My day, a stop, and the changes not sent yet.
          { path: paths.myDay, element: guard('route-days:read', <MyDayPage />), loader: prefetching(() => {}, MyDayPage.preload) },
          {
            path: paths.myStop(':venueId'),
            element: guard('route-days:read', <MyStopPage />),
            loader: prefetching(() => {}, MyStopPage.preload),
          },
          { path: paths.myChanges, element: <MyChangesPage />, loader: prefetching(() => {}, MyChangesPage.preload) },
          // Parts catalogue, stocks, what to order, and the technician's van.
          { path: paths.parts, element: guard('stock:read', <PartsPage />), loader: prefetching(prefetchParts, PartsPage.preload) },
          { path: paths.part(':id'), element: guard('stock:read', <PartPage />), loader: prefetching(prefetchPart, PartPage.preload) },
          { path: paths.stock, element: guard('stock:read', <StockPage />), loader: prefetching(prefetchStock, StockPage.preload) },
          {
            path: paths.reorder,
            element: guard('stock:manage', <ReorderPage />),
            loader: prefetching(prefetchReorder, ReorderPage.preload),
          },
          {
            path: paths.stockLocation(':id'),
            element: guard('stock:read', <StockLocationPage />),
            loader: prefetching(prefetchStockLocation, StockLocationPage.preload),
          },
          { path: paths.vanStock, element: guard('stock:read', <VanPage />), loader: prefetching(prefetchVan, VanPage.preload) },
          {
            path: paths.settings,
            element: guard('settings:manage', <SettingsPage />),
          },
          {
            path: paths.team,
            element: guard('team:read', <TeamPage />),
          },
          {
            path: paths.activity,
            element: guard('audit:read', <ActivityPage />),
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
]);
