import { createBrowserRouter, Navigate } from 'react-router-dom';
import { paths } from './paths.ts';
import { AppShell } from './app-shell.tsx';
import { RequirePermission, RequireSignedIn } from './guards.tsx';
import { useMe } from '../api/me.ts';
import { Loading } from '../components/states.tsx';
import { SignInPage } from '../features/auth/sign-in-page.tsx';
import { SignUpPage } from '../features/auth/sign-up-page.tsx';
import { RequestLinkPage, ResetPasswordPage } from '../features/auth/password-pages.tsx';
import { LinkSignInPage } from '../features/auth/link-sign-in-page.tsx';
import { InvitationPage } from '../features/auth/invitation-page.tsx';
import { StartPage } from './start-page.tsx';
import { LandingPage } from '../features/home/landing-page.tsx';
import { NotFoundPage } from './not-found-page.tsx';
import { RouteError } from './route-error.tsx';
import { lazyPage } from './lazy-page.tsx';

// Staff screens load on first visit; the sign-in and landing pages stay in the first bundle.
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
      { path: paths.home, element: <Root /> },
      { path: paths.signIn, element: <SignInPage /> },
      { path: paths.signUp, element: <SignUpPage /> },
      { path: paths.signInLink, element: <RequestLinkPage kind="sign-in-link" /> },
      { path: paths.signInLinkOpen, element: <LinkSignInPage /> },
      { path: paths.forgotPassword, element: <RequestLinkPage kind="password-reset" /> },
      { path: paths.resetPassword, element: <ResetPasswordPage /> },
      { path: paths.invitation, element: <InvitationPage /> },
      {
        element: (
          <RequireSignedIn>
            <AppShell />
          </RequireSignedIn>
        ),
        children: [
          { path: paths.today, element: <StartPage /> },
          {
            path: paths.venues,
            element: (
              <RequirePermission permission="venues:read">
                <VenuesPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.newVenue,
            element: (
              <RequirePermission permission="venues:write">
                <NewVenuePage />
              </RequirePermission>
            ),
          },
          {
            path: '/venues/:id',
            element: (
              <RequirePermission permission="venues:read">
                <VenuePage />
              </RequirePermission>
            ),
          },
          {
            path: '/venues/:id/edit',
            element: (
              <RequirePermission permission="venues:write">
                <EditVenuePage />
              </RequirePermission>
            ),
          },
          {
            path: paths.games,
            element: (
              <RequirePermission permission="games:read">
                <GamesPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.newGame,
            element: (
              <RequirePermission permission="games:write">
                <NewGamePage />
              </RequirePermission>
            ),
          },
          {
            path: '/games/:id',
            element: (
              <RequirePermission permission="games:read">
                <GamePage />
              </RequirePermission>
            ),
          },
          {
            path: '/games/:id/edit',
            element: (
              <RequirePermission permission="games:write">
                <EditGamePage />
              </RequirePermission>
            ),
          },
          {
            path: paths.calls,
            element: (
              <RequirePermission permission="calls:read">
                <CallsPage />
              </RequirePermission>
            ),
          },
          {
            path: '/calls/:id',
            element: (
              <RequirePermission permission="calls:read">
                <CallPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.settings,
            element: (
              <RequirePermission permission="settings:manage">
                <SettingsPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.team,
            element: (
              <RequirePermission permission="team:read">
                <TeamPage />
              </RequirePermission>
            ),
          },
          {
            path: paths.activity,
            element: (
              <RequirePermission permission="audit:read">
                <ActivityPage />
              </RequirePermission>
            ),
          },
          { path: '*', element: <NotFoundPage /> },
        ],
      },
    ],
  },
]);
