import { BrowserRouter, Route, Routes } from 'react-router';
import { AcceptInvitationPage } from '@/features/auth/components/accept-invitation-page';
import { SignInPage } from '@/features/auth/components/sign-in-page';
import { TeamHomePage } from '@/features/teams/components/team-home-page';
import { MembersPage } from '@/features/members/components/members-page';
import { OutboxPage } from '@/features/mail/components/outbox-page';
import { MyMailPage } from '@/features/mail/components/my-mail-page';
import { SettingsPage } from '@/features/account/components/settings-page';
import { WorkspacePage } from '@/features/workspace/components/workspace-page';
import { KitPage } from '@/features/records/components/kit-page';
import { SeriesPage } from '@/features/records/components/series-page';
import { ShotEditPage } from '@/features/records/components/shot-edit-page';
import { ShotDetailPage } from '@/features/records/components/shot-detail-page';
import { ShotNewPage } from '@/features/records/components/shot-new-page';
import { ShotClipsPanel } from '@/features/clips/components/shot-clips-panel';
import { ShotsPage } from '@/features/records/components/shots-page';
import { FitPage } from '@/features/fits/components/fit-page';
import { ShotFitsPage } from '@/features/fits/components/shot-fits-page';
import { ShotOverviewPage } from '@/features/fits/components/shot-overview-page';
import { PresetsPage } from '@/features/presets/components/presets-page';
import { PresetPage } from '@/features/presets/components/preset-page';
import { ForecastPage } from '@/features/presets/components/forecast-page';
import { CAN } from '@shared/roles';
import { AppShell } from './app-shell';
import { HomeRedirect } from './home-redirect';
import { NotFoundPage } from './not-found-page';
import { PublicLayout } from './public-layout';
import { RequireRole } from './require-role';
import { RequireSignIn } from './require-sign-in';
import { TeamGate } from './team-gate';
import { TEAM_HOME_LINKS, TEAM_HOME_PANELS } from './team-home-slots';

// Each feature contributes its pages here; features never import each other.
// Team pages go inside <Route path="/t/:teamId">: TeamGate has checked
// membership there, so useCurrentTeam() works. Wrap role-limited pages in
// <RequireRole roles={CAN.x}>. Nav entries live in ./nav.ts.
export function AppRouter() {
  return (
    <BrowserRouter>
      <Routes>
        <Route element={<PublicLayout />}>
          <Route path="/sign-in" element={<SignInPage />} />
          <Route path="/invite/:token" element={<AcceptInvitationPage />} />
        </Route>
        <Route element={<RequireSignIn />}>
          <Route element={<AppShell />}>
            <Route index element={<HomeRedirect />} />
            <Route path="/mail" element={<MyMailPage />} />
            <Route path="/settings" element={<SettingsPage />} />
            <Route path="/t/:teamId" element={<TeamGate />}>
              <Route index element={<TeamHomePage links={TEAM_HOME_LINKS} panels={TEAM_HOME_PANELS} />} />
              <Route path="members" element={<MembersPage />} />
              <Route path="outbox" element={<RequireRole roles={CAN.manageMembers}><OutboxPage /></RequireRole>} />
              <Route path="clips/:clipId/workspace" element={<WorkspacePage />} />
              <Route path="shots" element={<ShotsPage />} />
              <Route path="shots/new" element={<RequireRole roles={CAN.editShots}><ShotNewPage /></RequireRole>} />
              <Route path="shots/:shotId/edit" element={<RequireRole roles={CAN.editShots}><ShotEditPage /></RequireRole>} />
              <Route path="shots/:shotId" element={<ShotDetailPage clipPanel={(shot) => <ShotClipsPanel {...shot} />} />} />
              <Route path="series" element={<SeriesPage />} />
              <Route path="kit" element={<KitPage />} />
              <Route path="fits/:fitId" element={<FitPage />} />
              <Route path="shots/:shotId/fits" element={<ShotFitsPage />} />
              <Route path="results" element={<ShotOverviewPage />} />
              <Route path="presets" element={<PresetsPage />} />
              <Route path="presets/:presetId" element={<PresetPage />} />
              <Route path="forecast" element={<ForecastPage />} />
            </Route>
            <Route path="*" element={<NotFoundPage />} />
          </Route>
        </Route>
      </Routes>
    </BrowserRouter>
  );
}
