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
