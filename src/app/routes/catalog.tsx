import { Link, useSearchParams } from 'react-router-dom';
import { PROPERTY_KIND_IDS, type PropertyKind } from '@shared/measurements/property-kinds';
import { CUTOFF_SCHEMES, type CutoffScheme } from '@shared/physics/cutoff-schemes';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { UnitSwitch } from '@/components/ui/unit-switch';
import { catalogSearch, useCatalog, usePreferences, useUpdatePreferences, type CatalogFilters } from '@/features/catalog/api/catalog';
import { CatalogFilterBar } from '@/features/catalog/components/catalog-filters';
import { CatalogTable } from '@/features/catalog/components/catalog-table';
import { ParameterSetCaution } from '@/features/parameter-sets/components/caution';

/** Filters live in the address, so a search can be bookmarked and shared. */
function filtersFrom(params: URLSearchParams): CatalogFilters {
  const num = (k: string) =>
    params.get(k) !== null && Number.isFinite(Number(params.get(k))) && params.get(k) !== '' ? Number(params.get(k)) : undefined;
  const scheme = params.get('scheme');
  return {
    q: params.get('q') ?? undefined,
    scheme: scheme && (CUTOFF_SCHEMES as readonly string[]).includes(scheme) ? (scheme as CutoffScheme) : undefined,
    kind: (params.get('kind') ?? '').split(',').filter((k): k is PropertyKind => (PROPERTY_KIND_IDS as readonly string[]).includes(k)),
    tMinK: num('tMinK'),
    tMaxK: num('tMaxK'),
  };
}

/** Where consumers look: the current approved version of every substance and scheme. */
export function CatalogRoute() {
  const [params, setParams] = useSearchParams();
  const filters = filtersFrom(params);
  const sets = useCatalog(filters);
  const prefs = usePreferences();
  const update = useUpdatePreferences();
  const energy = prefs.data?.energyUnit ?? 'K';
  const length = prefs.data?.lengthUnit ?? 'Å';
  return (
    <>
      <PageHeader
        eyebrow="Catalog"
        title="Approved parameter sets"
        subtitle="One row per substance and scheme: the current approved version. Older versions are on each set's card."
        action={
          <Link
            className="rounded-md bg-copper px-3.5 py-1.5 text-sm font-semibold text-white shadow-sm hover:bg-copper-dark"
            to="/mixtures"
          >
            Build a mixture
          </Link>
        }
      />
      <div className="grid gap-6">
        <ParameterSetCaution />
        <Panel>
          <CatalogFilterBar filters={filters} onChange={(f) => setParams(new URLSearchParams(catalogSearch(f)), { replace: true })} />
        </Panel>
        <Panel
          actions={
            <UnitSwitch energy={energy} length={length} onChange={(u) => update.mutate({ energyUnit: u.energy, lengthUnit: u.length })} />
          }
          title={sets.data ? `${sets.data.length} ${sets.data.length === 1 ? 'set' : 'sets'}` : 'Sets'}
        >
          {sets.isPending ? (
            <LoadingState />
          ) : sets.isError ? (
            <ErrorState error={sets.error} onRetry={() => sets.refetch()} />
          ) : sets.data.length === 0 ? (
            <EmptyState title="No approved set matches">
              Widen the temperature range, clear a filter, or follow a substance to hear when a set is approved.
            </EmptyState>
          ) : (
            <CatalogTable sets={sets.data} energy={energy} length={length} />
          )}
        </Panel>
      </div>
    </>
  );
}
