import { Router } from 'express';
import { hasPolicy } from '../../../shared/auth/roles';
import { STATE_LABELS } from '../../../shared/parameter-sets/transitions';
import type { AppContext } from '../../app-context';
import { currentUser, requireUser } from '../../common/auth-middleware';
import { listParameterSets, listReviewQueue } from '../parameter-sets/parameter-sets.repository';

type NeedsActionKind = 'changes-requested' | 'draft' | 'awaiting-my-review';

/**
 * GET /api/workbench/needs-action: what waits on the signed-in person — their sets sent back and not yet
 * revised, their drafts, and (for reviewers) sets in review they may decide on (four-eyes applied). Oldest first.
 */
export function workbenchRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/workbench/needs-action', requireUser, async (_req, res) => {
    const me = currentUser(res);
    const item = (
      kind: NeedsActionKind,
      r: { id: number; substanceId: number; substanceName: string; version: number; state: keyof typeof STATE_LABELS; updatedAt: string },
      since: string,
    ) => ({
      kind,
      parameterSetId: r.id,
      substanceId: r.substanceId,
      substanceName: r.substanceName,
      version: r.version,
      state: r.state,
      stateLabel: STATE_LABELS[r.state],
      since,
    });
    const items: ReturnType<typeof item>[] = [];
    if (hasPolicy(me.roles, 'parameterSet:draft')) {
      const mine = (await listParameterSets(ctx.db, { states: ['changes_requested', 'draft'] })).filter((r) => r.createdBy === me.id);
      for (const r of mine) {
        if (r.state === 'changes_requested' && r.revisedBy == null) items.push(item('changes-requested', r, r.updatedAt));
        if (r.state === 'draft') items.push(item('draft', r, r.updatedAt));
      }
    }
    if (hasPolicy(me.roles, 'parameterSet:review')) {
      for (const r of await listReviewQueue(ctx.db, me.id)) items.push(item('awaiting-my-review', r, String(r.submittedAt ?? r.updatedAt)));
    }
    items.sort((a, b) => a.since.localeCompare(b.since));
    res.json({ items });
  });

  return router;
}
