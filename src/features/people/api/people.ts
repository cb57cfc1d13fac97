import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PeopleList, PersonView } from '@shared/contracts/person';
import type { CreatePersonBody, UpdatePersonBody } from '@shared/schemas/people';
import { api } from '@/lib/api-client';

export type Person = PersonView;

export const peopleKeys = {
  all: ['people'] as const,
  list: () => [...peopleKeys.all, 'list'] as const,
};

export const peopleQueryOptions = () =>
  queryOptions({ queryKey: peopleKeys.list(), queryFn: () => api<PeopleList>('/people').then((r) => r.people) });

export const usePeople = () => useQuery(peopleQueryOptions());

export const useCreatePerson = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreatePersonBody) => api<Person>('/people', { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: peopleKeys.all }),
  });
};

export const useUpdatePerson = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...body }: UpdatePersonBody & { id: string }) => api<Person>(`/people/${id}`, { method: 'PATCH', body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: peopleKeys.all }),
  });
};
