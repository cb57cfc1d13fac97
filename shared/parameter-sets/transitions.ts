/**
 * The life of a parameter set, in one place: its states, the moves between them, who may make each
 * move and the guards on top of roles. The server asks `checkMove` before every change and the client
 * asks it to decide which buttons to show; neither has rules of its own.
 *
 *   draft ──submit──▶ in_review ──approve──▶ approved ──supersede (system)──▶ superseded
 *     ▲                   │                     └──────retire──────▶ retired
 *     │             request_changes
 *     │                   ▼
 *     └──revise── changes_requested   (revise drafts a NEW set, the next version, with revisionOf set;
 *                                      the set sent back stays changes_requested as the record of the review)
 */
import { hasPolicy, refusalMessage, type Policy, type Role } from '../auth/roles';

export const PARAMETER_SET_STATES = ['draft', 'in_review', 'approved', 'changes_requested', 'superseded', 'retired'] as const;
export type ParameterSetState = (typeof PARAMETER_SET_STATES)[number];

export const STATE_LABELS: Record<ParameterSetState, string> = {
  draft: 'Draft',
  in_review: 'In review',
  approved: 'Approved',
  changes_requested: 'Changes requested',
  superseded: 'Superseded',
  retired: 'Retired',
};

/** Every move a person (or the system, for supersede) can make on one parameter set. `edit` changes rationale/validity only. */
export const MOVES = ['submit', 'approve', 'request_changes', 'revise', 'retire', 'supersede', 'edit'] as const;
export type Move = (typeof MOVES)[number];

export interface MoveRule {
  from: readonly ParameterSetState[];
  /** State of the set after the move; for `revise` the set keeps its state and a new draft is made. */
  to: ParameterSetState;
  /** null: only the system makes this move (never a request). */
  policy: Policy | null;
  /** Only the author of the set may make it. */
  authorOnly: boolean;
  /** Four-eyes: neither the author of the set nor the author of its fit may make it, whatever roles they hold. */
  fourEyes: boolean;
  /** A comment (review) or reason (retire) is required. */
  needsText: 'comment' | 'reason' | null;
  label: string;
}

export const MOVE_RULES: Record<Move, MoveRule> = {
  submit: {
    from: ['draft'],
    to: 'in_review',
    policy: 'parameterSet:draft',
    authorOnly: true,
    fourEyes: false,
    needsText: null,
    label: 'Submit for review',
  },
  approve: {
    from: ['in_review'],
    to: 'approved',
    policy: 'parameterSet:review',
    authorOnly: false,
    fourEyes: true,
    needsText: 'comment',
    label: 'Approve',
  },
  request_changes: {
    from: ['in_review'],
    to: 'changes_requested',
    policy: 'parameterSet:review',
    authorOnly: false,
    fourEyes: true,
    needsText: 'comment',
    label: 'Request changes',
  },
  revise: {
    from: ['changes_requested'],
    to: 'changes_requested',
    policy: 'parameterSet:draft',
    authorOnly: false,
    fourEyes: false,
    needsText: null,
    label: 'Draft a revision',
  },
  retire: {
    from: ['approved'],
    to: 'retired',
    policy: 'parameterSet:retire',
    authorOnly: false,
    fourEyes: false,
    needsText: 'reason',
    label: 'Retire',
  },
  supersede: {
    from: ['approved'],
    to: 'superseded',
    policy: null,
    authorOnly: false,
    fourEyes: false,
    needsText: null,
    label: 'Superseded by a newer version',
  },
  edit: {
    from: ['draft'],
    to: 'draft',
    policy: 'parameterSet:draft',
    authorOnly: true,
    fourEyes: false,
    needsText: null,
    label: 'Edit rationale and validity',
  },
};

export interface MoveActor {
  /** 'system' for moves the server makes on its own (supersede). */
  id: string;
  roles: readonly Role[];
  system?: boolean;
}

export interface MoveSubject {
  state: ParameterSetState;
  version: number;
  authorId: string;
  fitAuthorId: string;
  /** Highest version of the same substance and scheme that is approved now (null if none). */
  approvedVersion?: number | null;
  /** True when a revision of this set was already drafted. */
  revised?: boolean;
}

export type MoveDecision = { ok: true; to: ParameterSetState } | { ok: false; status: 400 | 403 | 409; code: string; message: string };

const refuse = (status: 400 | 403 | 409, code: string, message: string): MoveDecision => ({ ok: false, status, code, message });

/**
 * Decides one move. Order: who may make it (403: role, author-only, four-eyes), then whether the set's
 * state allows it (409), then the guards that depend on other sets (409), then the required text (400).
 */
export function checkMove(move: Move, subject: MoveSubject, actor: MoveActor, input: { text?: string | null } = {}): MoveDecision {
  const rule = MOVE_RULES[move];
  const verb = rule.label.toLowerCase();
  if (rule.policy === null) {
    if (!actor.system)
      return refuse(403, 'system_only', `Nobody ${verb} a parameter set by hand: it happens when a newer version is approved.`);
  } else {
    if (actor.system || !hasPolicy(actor.roles, rule.policy)) return refuse(403, 'forbidden', refusalMessage(actor.roles, rule.policy));
    if (rule.authorOnly && actor.id !== subject.authorId)
      return refuse(403, 'not_author', `Only the author of this parameter set may ${verb}.`);
    if (rule.fourEyes && actor.id === subject.authorId)
      return refuse(403, 'four_eyes', 'You drafted this parameter set; another reviewer must decide on it.');
    if (rule.fourEyes && actor.id === subject.fitAuthorId)
      return refuse(403, 'four_eyes', 'You ran the fit behind this parameter set; another reviewer must decide on it.');
  }
  if (!rule.from.includes(subject.state)) {
    const allowed = rule.from.map((s) => STATE_LABELS[s]).join(' or ');
    return refuse(409, 'wrong_state', `This parameter set is ${STATE_LABELS[subject.state]}; "${rule.label}" needs it ${allowed}.`);
  }
  if (move === 'approve' && subject.approvedVersion != null && subject.approvedVersion > subject.version) {
    return refuse(
      409,
      'newer_version_approved',
      `v${subject.approvedVersion} of the same substance and scheme is already approved; an older version cannot replace it.`,
    );
  }
  if (move === 'revise' && subject.revised) return refuse(409, 'already_revised', 'A revision of this parameter set was already drafted.');
  if (rule.needsText && !(input.text ?? '').trim())
    return refuse(400, `${rule.needsText}_required`, `Give a ${rule.needsText} for "${rule.label}".`);
  return { ok: true, to: rule.to };
}

/** The moves a person could make on a set now (text still to be given), for the buttons on screen. */
export function availableMoves(subject: MoveSubject, actor: MoveActor): Move[] {
  return MOVES.filter((m) => {
    const d = checkMove(m, subject, actor, { text: 'x' });
    return d.ok;
  });
}

/** States a set reaches only through approval; consumers see sets in these states and no others. */
export const PUBLISHED_STATES: readonly ParameterSetState[] = ['approved', 'superseded', 'retired'];

/** Consumers (readers without a part in the review) see published sets only; everyone else sees all. */
export function isVisibleTo(state: ParameterSetState, roles: readonly Role[]): boolean {
  return PUBLISHED_STATES.includes(state) || hasPolicy(roles, 'parameterSet:comment');
}
