import { NavLink, Outlet, useNavigate } from 'react-router-dom';
import { ROLE_LABELS } from '@shared/auth/roles';
import { hasPolicy } from '@shared/auth/roles';
import { NAV_ITEMS } from '@/config/navigation';
import { useMe } from '@/features/auth/api/me';
import { useSignOut } from '@/features/auth/api/sign-in';
import { Button } from '@/components/ui/button';
import { LogoMark } from '@/components/ui/logo-mark';

/** The signed-in frame: product mark, the role's navigation, who is signed in, and the page. */
export function AppShell() {
  const me = useMe().data!;
  const signOut = useSignOut();
  const navigate = useNavigate();
  const items = NAV_ITEMS.filter((item) => !item.policy || hasPolicy(me.roles, item.policy));
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-50 focus:rounded focus:bg-paper-raised focus:px-3 focus:py-1">
        Skip to content
      </a>
      <header className="border-b border-rule bg-paper-raised/80 backdrop-blur">
        <div className="mx-auto flex max-w-7xl items-center gap-6 px-6 py-3">
          <NavLink to="/" className="flex items-center gap-2 text-ink" aria-label="Epsigma home">
            <LogoMark />
            <span className="text-lg font-bold tracking-tight">Epsigma</span>
          </NavLink>
          <nav aria-label="Main" className="flex flex-1 flex-wrap items-center gap-1">
            {items.map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end={item.to === '/'}
                className={({ isActive }) =>
                  `rounded-md px-3 py-1.5 text-sm font-semibold transition-colors ${isActive ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-deep hover:text-ink'}`
                }
              >
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="flex items-center gap-3 text-sm">
            <NavLink to="/account" className="text-right leading-tight hover:underline" title="Your account">
              <span className="block font-semibold">{me.name}</span>
              <span className="block text-xs text-ink-faint">{me.roles.map((r) => ROLE_LABELS[r]).join(' · ')}</span>
            </NavLink>
            <Button variant="quiet" busy={signOut.isPending} onClick={() => signOut.mutate(undefined, { onSuccess: () => navigate('/sign-in') })}>
              Sign out
            </Button>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-6 py-8">
        <Outlet />
      </main>
      <footer className="border-t border-rule px-6 py-4 text-center text-xs text-ink-faint">
        Epsigma fits Lennard-Jones 12-6 model parameters. Fitted model parameters are not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.
      </footer>
    </div>
  );
}
