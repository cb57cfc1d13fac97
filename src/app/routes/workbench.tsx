import { Link } from 'react-router-dom';
import { hasPolicy, ROLE_DESCRIPTIONS, ROLE_LABELS } from '@shared/auth/roles';
import { NAV_ITEMS } from '@/config/navigation';
import { KindBadge } from '@/components/ui/badge';
import { ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useSignedIn } from '@/lib/signed-in';
import { NeedsActionList } from '@/features/parameter-sets/components/needs-action';
import { useSimulations } from '@/features/simulations/api/simulations';
import { useSubstances } from '@/features/substances/api/substances';

function ModellerWork() {
  const substances = useSubstances();
  const sims = useSimulations();
  if (substances.isPending) return <LoadingState />;
  if (substances.isError) return <ErrorState error={substances.error} onRetry={() => substances.refetch()} />;
  const running = (sims.data ?? []).filter((s) => s.status === 'running' || s.status === 'queued').length;
  return (
    <div className="grid gap-3">
      <ul className="divide-y divide-rule/70">
        {substances.data.slice(0, 6).map((s) => (
          <li key={s.id} className="flex items-center justify-between gap-3 py-2">
            <Link to={`/substances/${s.id}`} className="font-semibold underline decoration-rule underline-offset-4 hover:decoration-copper">
              {s.name}
            </Link>
            <span className="flex flex-wrap justify-end gap-1">
              {(s.kinds ?? []).map((k) => (
                <KindBadge key={k} kind={k} />
              ))}
            </span>
          </li>
        ))}
      </ul>
      <p className="text-sm text-ink-soft">
        {running ? `${running} simulation(s) queued or running.` : 'No simulation is running.'}{' '}
        <Link to="/simulations" className="text-copper underline">
          Simulations
        </Link>
      </p>
    </div>
  );
}

/** The landing page after sign-in: who you are here, what waits for you, and where your work is. */
export function WorkbenchRoute() {
  const me = useSignedIn();
  const destinations = NAV_ITEMS.filter((i) => i.to !== '/' && (!i.policy || hasPolicy(me.roles, i.policy)));
  return (
    <>
      <PageHeader
        eyebrow="Workbench"
        title={`Good to see you, ${me.name.split(' ')[0]}`}
        subtitle="Lennard-Jones 12-6 parameters, fitted to measurements and checked by a second person."
      />
      <div className="grid gap-5 md:grid-cols-2">
        {(hasPolicy(me.roles, 'parameterSet:draft') || hasPolicy(me.roles, 'parameterSet:review')) && (
          <Panel
            title="Needs my action"
            className="md:col-span-2"
            actions={
              hasPolicy(me.roles, 'parameterSet:review') ? (
                <Link to="/review" className="text-sm font-semibold text-copper underline underline-offset-4">
                  Review desk
                </Link>
              ) : undefined
            }
          >
            <NeedsActionList />
          </Panel>
        )}
        {hasPolicy(me.roles, 'fit:run') && (
          <Panel title="Substances">
            <ModellerWork />
          </Panel>
        )}
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
          <ul className="grid gap-2 sm:grid-cols-2">
            {destinations.map((d) => (
              <li key={d.to}>
                <Link
                  to={d.to}
                  className="block rounded-md border border-rule px-4 py-3 font-semibold hover:border-copper hover:text-copper"
                >
                  {d.label} →
                </Link>
              </li>
            ))}
          </ul>
        </Panel>
      </div>
    </>
  );
}
