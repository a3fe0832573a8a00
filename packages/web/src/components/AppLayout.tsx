import { useQueryClient } from '@tanstack/react-query';
import { NavLink, Outlet, ScrollRestoration, useNavigate } from 'react-router';
import { api } from '../api/client.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { Logo } from './Logo.js';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-1.5 text-sm font-medium ${
    isActive ? 'bg-[#f2a33a] text-petrol' : 'text-[#e6efe9] hover:bg-white/10'
  }`;

/** Signed-in frame: petrol top bar with navigation and the user's role, content on paper below. */
export function AppLayout() {
  const me = useMe();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const signOut = async (everywhere: boolean) => {
    await api.auth.logout(everywhere).catch(() => undefined);
    qc.clear();
    navigate('/signin', { replace: true });
  };
  return (
    <div className="flex min-h-screen flex-col">
      <header className="no-print bg-petrol text-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-4 px-4 py-2.5">
          <NavLink to="/designs" className="flex items-center gap-2" aria-label="Sigmatail home">
            <Logo className="h-7 w-7" />
            <span className="text-lg font-semibold tracking-tight">Sigmatail</span>
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
            <NavLink to="/designs" className={linkClass}>
              Designs
            </NavLink>
            <NavLink to="/runs" className={linkClass}>
              Runs
            </NavLink>
            <NavLink to="/compare" className={linkClass}>
              Compare
            </NavLink>
            <NavLink to="/production" className={linkClass}>
              Production
            </NavLink>
            {can(me.role, 'admin') && (
              <NavLink to="/admin" className={linkClass}>
                Admin
              </NavLink>
            )}
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <span className="hidden text-[#cfe0da] sm:inline">{me.workspace.name}</span>
            <span className="rounded bg-white/10 px-2 py-0.5" data-testid="current-user">
              {me.name} · <span className="font-medium text-[#f2a33a]">{me.role}</span>
            </span>
            <button
              type="button"
              className="rounded-md px-2 py-1 text-[#e6efe9] underline-offset-2 hover:underline"
              onClick={() => signOut(false)}
            >
              Sign out
            </button>
            <button
              type="button"
              className="rounded-md border border-white/20 px-2 py-0.5 text-xs text-[#cfe0da] underline-offset-2 hover:underline"
              aria-label="Sign out everywhere"
              title="End every session of your account, on every device"
              onClick={() => signOut(true)}
            >
              Sign out everywhere
            </button>
          </div>
        </div>
      </header>
      <main className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      {/* New pages open at the top; back and forward return to where the reader was. */}
      <ScrollRestoration />
      <footer className="no-print border-t border-rule py-3 text-center text-xs text-dim">
        Sigmatail · high voltage kills: discharge capacitors, respect ratings · a design aid, not a substitute
        for local codes or licensed practice
      </footer>
    </div>
  );
}
