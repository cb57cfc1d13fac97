import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import { NavLink, Outlet, useLocation } from 'react-router-dom';
import { hasPolicy, ROLE_LABELS } from '@shared/auth/roles';
import type { Me } from '@shared/schemas/people';
import { NAV_ITEMS } from '@/config/navigation';
import { Button } from '@/components/ui/button';
import { LogoMark } from '@/components/ui/logo-mark';

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-1.5 text-sm font-semibold transition-colors ${isActive ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-deep hover:text-ink'}`;

/**
 * The signed-in frame: product mark, the role's navigation, who is signed in, and the page. Below 1280 px the
 * navigation folds into a "Menu" button (Escape or a choice closes it); the header never grows wider than the screen.
 */
export function AppShell({
  me,
  onSignOut,
  signingOut,
  notices,
}: {
  me: Me;
  onSignOut: () => void;
  signingOut: boolean;
  notices?: ReactNode;
}) {
  const items = NAV_ITEMS.filter((item) => !item.policy || hasPolicy(me.roles, item.policy));
  // The menu is open only on the page where it was opened, so following a link closes it without an effect.
  const [openOn, setOpenOn] = useState<string | null>(null);
  const menuId = useId();
  const location = useLocation();
  const toggle = useRef<HTMLButtonElement>(null);
  const open = openOn === location.pathname;
  const setOpen = (next: boolean) => setOpenOn(next ? location.pathname : null);
  useEffect(() => {
    if (!open) return;
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'Escape') {
        setOpenOn(null);
        toggle.current?.focus();
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [open]);
  const who = (
    <NavLink to="/account" className="min-w-0 leading-tight hover:underline" title="Your account">
      <span className="block truncate font-semibold">{me.name}</span>
      <span className="block truncate text-xs text-ink-faint">{me.roles.map((r) => ROLE_LABELS[r]).join(' · ')}</span>
    </NavLink>
  );
  const signOutButton = (
    <Button variant="quiet" busy={signingOut} onClick={onSignOut}>
      Sign out
    </Button>
  );
  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-50 focus:rounded focus:bg-paper-raised focus:px-3 focus:py-1"
      >
        Skip to content
      </a>
      <header className="border-b border-rule bg-paper-raised/80 backdrop-blur">
        <div className="mx-auto flex max-w-7xl items-center gap-4 px-4 py-3 sm:px-6 xl:gap-6">
          <NavLink to="/" className="flex shrink-0 items-center gap-2 text-ink" aria-label="Epsigma home">
            <LogoMark />
            <span className="text-lg font-bold tracking-tight">Epsigma</span>
          </NavLink>
          <nav aria-label="Main" className="hidden flex-1 flex-wrap items-center gap-1 xl:flex">
            {items.map((item) => (
              <NavLink key={item.to} to={item.to} end={item.to === '/'} className={linkClass}>
                {item.label}
              </NavLink>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-2 xl:gap-3">
            {notices}
            <div className="hidden items-center gap-3 text-right text-sm xl:flex">
              {who}
              {signOutButton}
            </div>
            <button
              ref={toggle}
              type="button"
              aria-expanded={open}
              aria-controls={menuId}
              onClick={() => setOpen(!open)}
              className="inline-flex items-center gap-2 rounded-md border border-rule bg-paper-raised px-3 py-1.5 text-sm font-semibold text-ink hover:bg-paper-deep xl:hidden"
            >
              <svg width="16" height="16" viewBox="0 0 16 16" aria-hidden="true">
                {open ? (
                  <path d="M3 3l10 10M13 3L3 13" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
                ) : (
                  <path d="M2 4h12M2 8h12M2 12h12" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
                )}
              </svg>
              Menu
            </button>
          </div>
        </div>
        {open && (
          <div id={menuId} className="border-t border-rule px-4 pb-4 pt-2 sm:px-6 xl:hidden">
            <nav aria-label="Main" className="grid gap-1 sm:grid-cols-3">
              {items.map((item) => (
                <NavLink key={item.to} to={item.to} end={item.to === '/'} className={linkClass} onClick={() => setOpen(false)}>
                  {item.label}
                </NavLink>
              ))}
            </nav>
            <div className="mt-3 flex items-center justify-between gap-3 border-t border-rule pt-3 text-sm">
              {who}
              {signOutButton}
            </div>
          </div>
        )}
      </header>
      <main id="main" className="mx-auto w-full min-w-0 max-w-7xl flex-1 px-4 py-6 sm:px-6 sm:py-8">
        <Outlet />
      </main>
      <footer className="border-t border-rule px-4 py-4 text-center text-xs text-ink-faint sm:px-6">
        Epsigma fits Lennard-Jones 12-6 model parameters. Fitted model parameters are not validated property data for pressure, safety or
        process design; defer to local codes and licensed engineering practice.
      </footer>
    </div>
  );
}
