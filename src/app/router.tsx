import { BrowserRouter, Route, Routes } from 'react-router';
import { AcceptInvitationPage } from '@/features/auth/components/accept-invitation-page';
import { SignInPage } from '@/features/auth/components/sign-in-page';
import { TeamHomePage } from '@/features/teams/components/team-home-page';
import { AppShell } from './app-shell';
import { HomeRedirect } from './home-redirect';
import { NotFoundPage } from './not-found-page';
import { PublicLayout } from './public-layout';
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
            <Route path="/t/:teamId" element={<TeamGate />}>
              <Route index element={<TeamHomePage links={TEAM_HOME_LINKS} panels={TEAM_HOME_PANELS} />} />
            </Route>
            <Route path="*" element={<NotFoundPage />} />
          </Route>
        </Route>
      </Routes>
    </BrowserRouter>
  );
}
