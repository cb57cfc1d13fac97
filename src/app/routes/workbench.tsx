import { Link } from 'react-router-dom';
import { hasPolicy, ROLE_DESCRIPTIONS, ROLE_LABELS } from '@shared/auth/roles';
import { NAV_ITEMS } from '@/config/navigation';
import { PageHeader, Panel } from '@/components/ui/states';
import { useMe } from '@/features/auth/api/me';

/** The landing page after sign-in: who you are here and where your work is. */
export function WorkbenchRoute() {
  const me = useMe().data!;
  const destinations = NAV_ITEMS.filter((i) => i.to !== '/' && (!i.policy || hasPolicy(me.roles, i.policy)));
  return (
    <>
      <PageHeader eyebrow="Workbench" title={`Good to see you, ${me.name.split(' ')[0]}`} subtitle="Lennard-Jones 12-6 parameters, fitted to measurements and checked by a second person." />
      <div className="grid gap-5 md:grid-cols-2">
        <Panel title="Your roles">
          <ul className="space-y-3">
            {me.roles.map((role) => (
              <li key={role}>
                <span className="font-semibold">{ROLE_LABELS[role]}</span>
                <span className="text-ink-soft"> — {ROLE_DESCRIPTIONS[role]}</span>
              </li>
            ))}
          </ul>
        </Panel>
        <Panel title="Go to">
          {destinations.length ? (
            <ul className="grid gap-2 sm:grid-cols-2">
              {destinations.map((d) => (
                <li key={d.to}>
                  <Link to={d.to} className="block rounded-md border border-rule px-4 py-3 font-semibold hover:border-copper hover:text-copper">
                    {d.label} →
                  </Link>
                </li>
              ))}
            </ul>
          ) : (
            <p className="text-ink-soft">Your roles have no workspace pages yet.</p>
          )}
        </Panel>
      </div>
    </>
  );
}
