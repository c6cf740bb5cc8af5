import { Outlet, useMatch, useParams } from 'react-router';
import { lastTeamId } from '@/lib/last-team';
import { useMe } from '@/api/me/get-me';
import { SideNav } from './side-nav';
import { SiteFooter } from './site-footer';
import { TeamSwitcher } from './team-switcher';
import { UserMenu } from './user-menu';
import { Wordmark } from './wordmark';

/** Top bar, side navigation, the page, the footer. Rendered only below RequireSignIn. */
export function AppShell() {
  const { data: me } = useMe();
  const { teamId } = useParams();
  // The marking workspace wants every pixel of width for the frame; other pages read better at a measure.
  const fullWidth = useMatch('/t/:teamId/clips/:clipId/workspace') !== null;
  if (!me) return null;
  // Outside a team page (mail, settings) the side bar keeps the last team open.
  const sideTeam = me.teams.find((t) => t.id === teamId) ?? me.teams.find((t) => t.id === lastTeamId()) ?? me.teams[0];

  return (
    <div className="flex min-h-screen flex-col bg-paper">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded-md focus:bg-paper-raised focus:px-3 focus:py-1.5">
        Skip to content
      </a>
      <header className="flex h-13 items-center gap-6 bg-ink px-4 text-paper">
        <Wordmark />
        <TeamSwitcher teams={me.teams} currentTeamId={sideTeam?.id} />
        <div className="flex-1" />
        <UserMenu me={me} />
      </header>
      <div className="flex flex-1">
        <aside className="w-56 shrink-0 border-r border-line bg-paper-sunk/50">
          <SideNav team={sideTeam} />
        </aside>
        <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-8 py-6 outline-none">
          <div className={fullWidth ? 'w-full' : 'mx-auto max-w-6xl'}>
            <Outlet />
          </div>
        </main>
      </div>
      <SiteFooter />
    </div>
  );
}
