import type { Follow } from '../../../shared/contracts/follow';
import type { listFollowsOf } from './follows.repository';

/** One followed substance as GET /api/me/follows shows it. */
export function toFollowView(row: Awaited<ReturnType<typeof listFollowsOf>>[number]): Follow {
  return { substanceId: row.substanceId, substanceName: row.substanceName, followedAt: row.followedAt };
}
