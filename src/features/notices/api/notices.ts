import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { NoticeList, NoticeView } from '@shared/contracts/notice';
import { api } from '@/lib/api-client';

export type Notice = NoticeView;

export const noticeKeys = {
  all: ['notices'] as const,
  list: () => [...noticeKeys.all, 'list'] as const,
};

/** One's own notices (a fit of one's own finished or failed …), asked again every 15 s while the app is open. */
export const noticesQueryOptions = () =>
  queryOptions({
    queryKey: noticeKeys.list(),
    queryFn: () => api<NoticeList>('/notices'),
    refetchInterval: 15_000,
  });

export const useNotices = () => useQuery(noticesQueryOptions());

export const useMarkNoticeRead = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<void>(`/notices/${id}/read`, { method: 'POST' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: noticeKeys.all }),
  });
};
