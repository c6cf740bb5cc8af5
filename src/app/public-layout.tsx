import { Outlet } from 'react-router';
import { SiteFooter } from './site-footer';
import { Wordmark } from './wordmark';

/** Sign-in and invitation pages: the mark, a centred column, the footer. */
export function PublicLayout() {
  return (
    <div className="flex min-h-screen flex-col bg-paper">
      <header className="bg-ink px-6 py-3">
        <Wordmark />
      </header>
      <main id="main" className="flex flex-1 flex-col px-6 py-12">
        <Outlet />
      </main>
      <SiteFooter />
    </div>
  );
}
