import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Follow, FollowList, FollowState } from '@shared/contracts/follow';

export type { Follow };

export const followKeys = {
  all: ['follows'] as const,
  mine: () => [...followKeys.all, 'mine'] as const,
};

export const myFollowsQueryOptions = () =>
  queryOptions({ queryKey: followKeys.mine(), queryFn: () => api<FollowList>('/me/follows').then((r) => r.follows) });

export const useMyFollows = () => useQuery(myFollowsQueryOptions());

/** Whether the signed-in user follows the substance (undefined while loading). */
export const useIsFollowing = (substanceId: number) => {
  const follows = useMyFollows();
  return follows.data ? follows.data.some((f) => f.substanceId === substanceId) : undefined;
};

export const useSetFollowing = (substanceId: number) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (following: boolean) => api<FollowState>(`/substances/${substanceId}/follow`, { method: following ? 'POST' : 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: followKeys.all }),
  });
};
