import { useState, type MouseEvent } from 'react';
import { Outlet, useLocation, useMatch, useParams } from 'react-router';
import { cx } from '@/components/ui/cx';
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
  // Below 1024 px the side navigation folds into a menu opened from the top bar. The menu
  // belongs to the page it was opened on, so any change of page (a link, back, forward) folds
  // it in the same render that shows the new page, with no frame of the old menu over it.
  const { pathname } = useLocation();
  const [navOpenOn, setNavOpenOn] = useState<string | null>(null);
  const navOpen = navOpenOn === pathname;
  // Following a link folds it at the click: a page whose code is still loading (or the page
  // already shown) must not leave the menu covering the screen.
  const closeNavOnLink = (e: MouseEvent<HTMLElement>) => {
    if (e.target instanceof Element && e.target.closest('a[href]')) setNavOpenOn(null);
  };
  if (!me) return null;
  // Outside a team page (mail, settings) the side bar keeps the last team open.
  const sideTeam = me.teams.find((t) => t.id === teamId) ?? me.teams.find((t) => t.id === lastTeamId()) ?? me.teams[0];

  return (
    <div className="flex min-h-screen flex-col bg-paper">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded-md focus:bg-paper-raised focus:px-3 focus:py-1.5">
        Skip to content
      </a>
      <header className="flex h-13 items-center gap-4 bg-ink px-4 text-paper lg:gap-6">
        <button
          type="button"
          className="-ml-1 inline-flex h-9 items-center gap-2 rounded-md px-2 text-body text-paper hover:bg-paper/10 lg:hidden"
          aria-expanded={navOpen}
          aria-controls="side-navigation"
          onClick={() => setNavOpenOn(navOpen ? null : pathname)}
        >
          <svg aria-hidden viewBox="0 0 16 16" className="h-4 w-4" fill="none" stroke="currentColor" strokeWidth="1.6">
            {navOpen ? <path d="M3 3l10 10M13 3L3 13" /> : <path d="M2 4h12M2 8h12M2 12h12" />}
          </svg>
          Menu
        </button>
        <Wordmark />
        <TeamSwitcher teams={me.teams} currentTeamId={sideTeam?.id} />
        <div className="flex-1" />
        <UserMenu me={me} />
      </header>
      <div className="relative flex flex-1">
        <aside
          id="side-navigation"
          className={cx(
            'w-56 shrink-0 border-r border-line bg-paper-sunk lg:static lg:block lg:bg-paper-sunk/50 lg:shadow-none',
            navOpen ? 'absolute inset-y-0 left-0 z-40 block shadow-xl' : 'hidden',
          )}
          onClick={closeNavOnLink}
        >
          <SideNav team={sideTeam} />
        </aside>
        <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-4 py-6 outline-none md:px-6 lg:px-8">
          <div className={fullWidth ? 'w-full' : 'mx-auto max-w-6xl'}>
            <Outlet />
          </div>
        </main>
      </div>
      <SiteFooter />
    </div>
  );
}
