import type { Db, Tx } from '../../db/database';

export async function isFollowing(db: Db | Tx, userId: string, substanceId: number): Promise<boolean> {
  const row = await db
    .selectFrom('substanceFollow')
    .select('userId')
    .where('userId', '=', userId)
    .where('substanceId', '=', substanceId)
    .executeTakeFirst();
  return row !== undefined;
}

export async function insertFollow(db: Db | Tx, userId: string, substanceId: number): Promise<void> {
  await db.insertInto('substanceFollow').values({ userId, substanceId, createdAt: new Date().toISOString() }).execute();
}

/** Returns whether a follow was removed. */
export async function deleteFollow(db: Db | Tx, userId: string, substanceId: number): Promise<boolean> {
  const result = await db
    .deleteFrom('substanceFollow')
    .where('userId', '=', userId)
    .where('substanceId', '=', substanceId)
    .executeTakeFirst();
  return Number(result.numDeletedRows) > 0;
}

export async function listFollowsOf(db: Db | Tx, userId: string) {
  return db
    .selectFrom('substanceFollow')
    .innerJoin('substance', 'substance.id', 'substanceFollow.substanceId')
    .select(['substanceFollow.substanceId', 'substance.name as substanceName', 'substanceFollow.createdAt as followedAt'])
    .where('substanceFollow.userId', '=', userId)
    .orderBy('substance.name')
    .execute();
}
