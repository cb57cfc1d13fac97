/** A user who wants mail about a substance. */
export interface SubstanceFollowTable {
  userId: string;
  substanceId: number;
  createdAt: string;
}
