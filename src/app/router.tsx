import type { ComponentType } from 'react';
import { Route, RouterProvider, createBrowserRouter, createRoutesFromElements } from 'react-router';
import { CAN, type Role } from '@shared/roles';
import { AppShell } from './app-shell';
import { HomeRedirect } from './home-redirect';
import { NotFoundPage } from './not-found-page';
import { PublicLayout } from './public-layout';
import { RequireRole } from './require-role';
import { RequireSignIn } from './require-sign-in';
import { TeamGate } from './team-gate';
import { TEAM_HOME_LINKS, TEAM_HOME_PANELS } from './team-home-slots';

/**
 * Every page is its own chunk, fetched the first time its route matches: the
 * sign-in page does not wait for the charts (recharts) of the fit pages or the
 * canvas (konva) of the workspace, which live only in the chunks that use them.
 */
function page<M>(load: () => Promise<M>, pick: (module: M) => ComponentType) {
  return async () => ({ Component: pick(await load()) });
}

/** A page only some roles may open; RequireRole explains the refusal to the rest. */
function rolePage<M>(roles: readonly Role[], load: () => Promise<M>, pick: (module: M) => ComponentType) {
  return async () => {
    const Page = pick(await load());
    return {
      Component: function RoleLimitedPage() {
        return (
          <RequireRole roles={roles}>
            <Page />
          </RequireRole>
        );
      },
    };
  };
}

// Each feature contributes its pages here; features never import each other.
// Team pages go inside <Route path="/t/:teamId">: TeamGate has checked
// membership there, so useCurrentTeam() works. Role-limited pages use rolePage(CAN.x, …).
// Nav entries live in ./nav.ts.
const routes = createRoutesFromElements(
  <>
    <Route element={<PublicLayout />}>
      <Route path="/sign-in" lazy={page(() => import('@/features/auth/components/sign-in-page'), (m) => m.SignInPage)} />
      <Route path="/invite/:token" lazy={page(() => import('@/features/auth/components/accept-invitation-page'), (m) => m.AcceptInvitationPage)} />
    </Route>
    <Route element={<RequireSignIn />}>
      <Route element={<AppShell />}>
        <Route index element={<HomeRedirect />} />
        <Route path="/mail" lazy={page(() => import('@/features/mail/components/my-mail-page'), (m) => m.MyMailPage)} />
        <Route path="/settings" lazy={page(() => import('@/features/account/components/settings-page'), (m) => m.SettingsPage)} />
        <Route path="/t/:teamId" element={<TeamGate />}>
          <Route
            index
            lazy={page(
              () => import('@/features/teams/components/team-home-page'),
              ({ TeamHomePage }) =>
                function TeamHome() {
                  return <TeamHomePage links={TEAM_HOME_LINKS} panels={TEAM_HOME_PANELS} />;
                },
            )}
          />
          <Route path="members" lazy={page(() => import('@/features/members/components/members-page'), (m) => m.MembersPage)} />
          <Route path="outbox" lazy={rolePage(CAN.manageMembers, () => import('@/features/mail/components/outbox-page'), (m) => m.OutboxPage)} />
          <Route path="clips/:clipId/workspace" lazy={page(() => import('@/features/workspace/components/workspace-page'), (m) => m.WorkspacePage)} />
          <Route path="shots" lazy={page(() => import('@/features/records/components/shots-page'), (m) => m.ShotsPage)} />
          <Route path="shots/new" lazy={rolePage(CAN.editShots, () => import('@/features/records/components/shot-new-page'), (m) => m.ShotNewPage)} />
          <Route path="shots/:shotId/edit" lazy={rolePage(CAN.editShots, () => import('@/features/records/components/shot-edit-page'), (m) => m.ShotEditPage)} />
          <Route
            path="shots/:shotId"
            lazy={page(
              () => Promise.all([import('@/features/records/components/shot-detail-page'), import('@/features/clips/components/shot-clips-panel')]),
              ([{ ShotDetailPage }, { ShotClipsPanel }]) =>
                function ShotDetail() {
                  return <ShotDetailPage clipPanel={(shot) => <ShotClipsPanel {...shot} />} />;
                },
            )}
          />
          <Route path="series" lazy={page(() => import('@/features/records/components/series-page'), (m) => m.SeriesPage)} />
          <Route path="kit" lazy={page(() => import('@/features/records/components/kit-page'), (m) => m.KitPage)} />
          <Route path="fits/:fitId" lazy={page(() => import('@/features/fits/components/fit-page'), (m) => m.FitPage)} />
          <Route path="shots/:shotId/fits" lazy={page(() => import('@/features/fits/components/shot-fits-page'), (m) => m.ShotFitsPage)} />
          <Route path="results" lazy={page(() => import('@/features/fits/components/shot-overview-page'), (m) => m.ShotOverviewPage)} />
          <Route path="presets" lazy={page(() => import('@/features/presets/components/presets-page'), (m) => m.PresetsPage)} />
          <Route path="presets/:presetId" lazy={page(() => import('@/features/presets/components/preset-page'), (m) => m.PresetPage)} />
          <Route path="forecast" lazy={page(() => import('@/features/presets/components/forecast-page'), (m) => m.ForecastPage)} />
        </Route>
        <Route path="*" element={<NotFoundPage />} />
      </Route>
    </Route>
  </>,
);

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
