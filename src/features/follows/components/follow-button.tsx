import { Button } from '@/components/ui/button';
import { useIsFollowing, useSetFollowing } from '../api/follows';

/** Follow / unfollow a substance: followers get mail when its parameter sets change state. */
export function FollowButton({ substanceId, substanceName }: { substanceId: number; substanceName?: string }) {
  const following = useIsFollowing(substanceId);
  const setFollowing = useSetFollowing(substanceId);
  const label = following ? 'Following' : 'Follow';
  return (
    <Button
      aria-pressed={following ?? false}
      title={
        following
          ? `You get mail about ${substanceName ?? 'this substance'}; click to stop`
          : `Get mail when parameter sets of ${substanceName ?? 'this substance'} change`
      }
      busy={setFollowing.isPending}
      disabled={following === undefined}
      onClick={() => setFollowing.mutate(!following)}
    >
      <span aria-hidden="true">{following ? '✓' : '+'}</span>
      {label}
    </Button>
  );
}
