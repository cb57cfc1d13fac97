import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CatalogEntry, MixtureAnswer, ParameterCard, PredictionAnswer } from '@shared/contracts/catalog';
import type { CombiningRule } from '@shared/mixing/combining-rules';
import type { PropertyKind } from '@shared/measurements/property-kinds';
import type { CutoffScheme } from '@shared/physics/cutoff-schemes';
import type { PreferencesView as Preferences } from '@shared/contracts/preferences';
import type { UpdatePreferencesBody } from '@shared/schemas/preferences';
import { api } from '@/lib/api-client';

export type { CatalogEntry, MixtureAnswer, ParameterCard, PredictionAnswer } from '@shared/contracts/catalog';

export interface CatalogFilters {
  q?: string;
  scheme?: CutoffScheme;
  kind?: PropertyKind[];
  tMinK?: number;
  tMaxK?: number;
}

/** The query string of a filter set; empty filters are left out so equal searches share a cache entry. */
export function catalogSearch(filters: CatalogFilters): string {
  const p = new URLSearchParams();
  if (filters.q?.trim()) p.set('q', filters.q.trim());
  if (filters.scheme) p.set('scheme', filters.scheme);
  if (filters.kind?.length) p.set('kind', filters.kind.join(','));
  if (filters.tMinK !== undefined) p.set('tMinK', String(filters.tMinK));
  if (filters.tMaxK !== undefined) p.set('tMaxK', String(filters.tMaxK));
  const s = p.toString();
  return s ? `?${s}` : '';
}

export const catalogKeys = {
  all: ['catalog'] as const,
  list: (search: string) => [...catalogKeys.all, 'list', search] as const,
  card: (id: number) => [...catalogKeys.all, 'card', id] as const,
  mixture: (setIds: number[], rule: CombiningRule) => [...catalogKeys.all, 'mixture', setIds.join(','), rule] as const,
  preferences: () => ['preferences'] as const,
  predictions: (id: number, kind: string, temperaturesK: string, pressuresMPa: string) =>
    [...catalogKeys.all, 'predictions', id, kind, temperaturesK, pressuresMPa] as const,
};

/** GET /api/parameter-sets/:id/predictions; runs only when temperatures are given. */
export const predictionsQueryOptions = (id: number, kind: string, temperaturesK: string, pressuresMPa: string) =>
  queryOptions({
    queryKey: catalogKeys.predictions(id, kind, temperaturesK, pressuresMPa),
    queryFn: () =>
      api<PredictionAnswer>(
        `/parameter-sets/${id}/predictions?kind=${kind}&temperaturesK=${encodeURIComponent(temperaturesK)}${kind === 'density' ? `&pressuresMPa=${encodeURIComponent(pressuresMPa)}` : ''}`,
      ),
    enabled: temperaturesK.trim() !== '',
    retry: false,
  });

export const catalogQueryOptions = (filters: CatalogFilters) => {
  const search = catalogSearch(filters);
  return queryOptions({
    queryKey: catalogKeys.list(search),
    queryFn: () => api<{ sets: CatalogEntry[] }>(`/catalog${search}`).then((r) => r.sets),
  });
};

export const parameterCardQueryOptions = (id: number) =>
  queryOptions({ queryKey: catalogKeys.card(id), queryFn: () => api<ParameterCard>(`/catalog/${id}`) });

export const mixtureQueryOptions = (setIds: number[], rule: CombiningRule) =>
  queryOptions({
    queryKey: catalogKeys.mixture(setIds, rule),
    queryFn: () => api<MixtureAnswer>(`/mixtures?sets=${setIds.join(',')}&rule=${rule}`),
    enabled: setIds.length >= 2,
  });

export const preferencesQueryOptions = () =>
  queryOptions({ queryKey: catalogKeys.preferences(), queryFn: () => api<Preferences>('/me/preferences'), staleTime: 5 * 60_000 });

export const useCatalog = (filters: CatalogFilters) => useQuery({ ...catalogQueryOptions(filters), placeholderData: keepPreviousData });
export const useParameterCard = (id: number) => useQuery(parameterCardQueryOptions(id));
export const useMixture = (setIds: number[], rule: CombiningRule) => useQuery(mixtureQueryOptions(setIds, rule));
export const usePreferences = () => useQuery(preferencesQueryOptions());

/** Saves a change of units or scheme; the cache shows it at once and follows the server's answer. */
export const useUpdatePreferences = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdatePreferencesBody) => api<Preferences>('/me/preferences', { method: 'PUT', body }),
    onMutate: (body) => {
      const before = qc.getQueryData<Preferences>(catalogKeys.preferences());
      if (before) {
        const next: Preferences = {
          ...before,
          ...(body.energyUnit ? { energyUnit: body.energyUnit } : {}),
          ...(body.lengthUnit ? { lengthUnit: body.lengthUnit } : {}),
        };
        if (body.scheme === null) delete next.scheme;
        else if (body.scheme) next.scheme = body.scheme;
        qc.setQueryData(catalogKeys.preferences(), next);
      }
      return { before };
    },
    onError: (_e, _b, context) => {
      if (context?.before) qc.setQueryData(catalogKeys.preferences(), context.before);
    },
    onSuccess: (data) => qc.setQueryData(catalogKeys.preferences(), data),
  });
};

/** Download addresses: plain links, so the browser saves the file the server names. */
export const exportHref = (setId: number, format: string, units?: string) =>
  `/api/parameter-sets/${setId}/export?format=${format}${units ? `&units=${encodeURIComponent(units)}` : ''}`;
export const mixtureHref = (setIds: number[], rule: CombiningRule, format: string, units?: string) =>
  `/api/mixtures?sets=${setIds.join(',')}&rule=${rule}&format=${format}${units ? `&units=${encodeURIComponent(units)}` : ''}`;
