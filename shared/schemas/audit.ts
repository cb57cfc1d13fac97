/** The audit log's query: GET /api/audit (server/features/audit/audit.routes.ts) and the audit filters. */
import { z } from 'zod';

const DATE_ONLY = /^\d{4}-\d{2}-\d{2}$/;
const instant = z
  .string()
  .trim()
  .refine(
    (s) => (DATE_ONLY.test(s) || /^\d{4}-\d{2}-\d{2}T/.test(s)) && !Number.isNaN(Date.parse(s)),
    'expected an ISO date (2026-12-01) or date-time',
  );

/** Query of GET /api/audit (the route and the audit filters read it). */
export const auditQuery = z
  .object({
    action: z.string().trim().min(1).max(100).optional(),
    actor: z.string().trim().min(1).max(200).optional(),
    targetType: z.string().trim().min(1).max(100).optional(),
    targetId: z.string().trim().min(1).max(100).optional(),
    from: instant.optional(),
    to: instant.optional(),
    limit: z.coerce.number().int().min(1).max(500).default(100),
    before: z.coerce.number().int().positive().optional(),
  })
  .refine((q) => !q.from || !q.to || toInstant(q.from, 'start') < toInstant(q.to, 'end'), {
    path: ['to'],
    message: '"to" must come after "from"',
  });

/**
 * A date alone means the whole day in UTC: `from=2026-12-01` starts at its midnight, `to=2026-12-01`
 * ends at the next midnight, so from=to=that day lists that day.
 */
export function toInstant(value: string, side: 'start' | 'end'): string {
  const date = new Date(DATE_ONLY.test(value) ? `${value}T00:00:00Z` : value);
  if (DATE_ONLY.test(value) && side === 'end') date.setUTCDate(date.getUTCDate() + 1);
  return date.toISOString();
}

const blank = z.string().trim().max(0);
const orBlank = <T extends z.ZodType>(field: T) => z.union([blank, field]).optional();
/** The audit filters' form: the query's filter fields, each may be left empty (empty means any). */
export const auditFilterForm = z.object({
  action: orBlank(auditQuery.shape.action.unwrap()),
  actor: orBlank(auditQuery.shape.actor.unwrap()),
  targetType: orBlank(auditQuery.shape.targetType.unwrap()),
  targetId: orBlank(auditQuery.shape.targetId.unwrap()),
  from: orBlank(instant),
  to: orBlank(instant),
});
