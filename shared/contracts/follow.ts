/**
 * Contract of following a substance (mail about its parameter sets): the answers of POST/DELETE
 * /api/substances/:id/follow and GET /api/me/follows. Built in server/features/follows/follows.view.ts.
 */
import { z } from 'zod';

export const followView = z.strictObject({ substanceId: z.number().int(), substanceName: z.string(), followedAt: z.string() });
export type Follow = z.infer<typeof followView>;
export const followListView = z.strictObject({ follows: z.array(followView) });
export type FollowList = z.infer<typeof followListView>;

/** The answer of following or unfollowing: where the person stands now. */
export const followStateView = z.strictObject({ substanceId: z.number().int(), following: z.boolean() });
export type FollowState = z.infer<typeof followStateView>;
