import { describe, expect, it } from 'vitest';
import type { Role } from '../auth/roles';
import {
  availableMoves,
  checkMove,
  isVisibleTo,
  MOVE_RULES,
  MOVES,
  PARAMETER_SET_STATES,
  type Move,
  type MoveActor,
  type MoveSubject,
  type ParameterSetState,
} from './transitions';

// The review rules are the issue's own (four-eyes principle: the author of a change never approves it —
// common practice in controlled-document review, no source). Every (move, state) pair is checked below.

const AUTHOR = 'u-author';
const FIT_AUTHOR = 'u-fit-author';
const people: Record<string, MoveActor> = {
  author: { id: AUTHOR, roles: ['modeller'] },
  otherModeller: { id: 'u-m2', roles: ['modeller'] },
  reviewer: { id: 'u-rev', roles: ['reviewer'] },
  admin: { id: 'u-admin', roles: ['admin'] },
  consumer: { id: 'u-cons', roles: ['consumer'] },
  authorWhoReviews: { id: AUTHOR, roles: ['modeller', 'reviewer'] },
  fitAuthorWhoReviews: { id: FIT_AUTHOR, roles: ['modeller', 'reviewer', 'admin'] },
  system: { id: 'system', roles: [], system: true },
};

const subject = (state: ParameterSetState, extra: Partial<MoveSubject> = {}): MoveSubject => ({
  state,
  version: 2,
  authorId: AUTHOR,
  fitAuthorId: FIT_AUTHOR,
  approvedVersion: null,
  ...extra,
});

/** The full table of allowed moves: [move, from, who, to]. Everything not listed must be refused. */
const ALLOWED: Array<[Move, ParameterSetState, keyof typeof people, ParameterSetState]> = [
  ['submit', 'draft', 'author', 'in_review'],
  ['submit', 'draft', 'authorWhoReviews', 'in_review'],
  ['edit', 'draft', 'author', 'draft'],
  ['edit', 'draft', 'authorWhoReviews', 'draft'],
  ['approve', 'in_review', 'reviewer', 'approved'],
  ['request_changes', 'in_review', 'reviewer', 'changes_requested'],
  ['revise', 'changes_requested', 'author', 'changes_requested'],
  ['revise', 'changes_requested', 'otherModeller', 'changes_requested'],
  ['revise', 'changes_requested', 'authorWhoReviews', 'changes_requested'],
  ['revise', 'changes_requested', 'fitAuthorWhoReviews', 'changes_requested'],
  ['retire', 'approved', 'reviewer', 'retired'],
  ['retire', 'approved', 'admin', 'retired'],
  ['retire', 'approved', 'authorWhoReviews', 'retired'],
  ['retire', 'approved', 'fitAuthorWhoReviews', 'retired'],
  ['supersede', 'approved', 'system', 'superseded'],
];

describe('parameter-set moves', () => {
  for (const move of MOVES) {
    for (const state of PARAMETER_SET_STATES) {
      for (const [who, actor] of Object.entries(people)) {
        const allowed = ALLOWED.find(([m, s, w]) => m === move && s === state && w === who);
        it(`${move} from ${state} by ${who}: ${allowed ? `allowed → ${allowed[3]}` : 'refused'}`, () => {
          const d = checkMove(move, subject(state), actor, { text: 'looked at the residuals' });
          if (allowed) expect(d).toEqual({ ok: true, to: allowed[3] });
          else {
            expect(d.ok).toBe(false);
            if (!d.ok) {
              expect([403, 409]).toContain(d.status);
              expect(d.message.length).toBeGreaterThan(10);
            }
          }
        });
      }
    }
  }

  it('answers 403 for the wrong role before looking at the state, 409 for the right role in the wrong state', () => {
    expect(checkMove('submit', subject('approved'), people.consumer)).toMatchObject({ ok: false, status: 403, code: 'forbidden' });
    expect(checkMove('submit', subject('approved'), people.author)).toMatchObject({ ok: false, status: 409, code: 'wrong_state' });
    expect(checkMove('approve', subject('draft'), people.reviewer, { text: 'ok' })).toMatchObject({
      ok: false,
      status: 409,
      code: 'wrong_state',
    });
    expect(checkMove('retire', subject('draft'), people.admin, { text: 'old' })).toMatchObject({
      ok: false,
      status: 409,
      code: 'wrong_state',
    });
    expect(checkMove('edit', subject('approved'), people.author)).toMatchObject({ ok: false, status: 409, code: 'wrong_state' });
  });

  it('four-eyes: the author of the set or of its fit never approves or sends back, whatever roles they hold', () => {
    for (const move of ['approve', 'request_changes'] as const) {
      expect(checkMove(move, subject('in_review'), people.authorWhoReviews, { text: 'fine' })).toMatchObject({
        ok: false,
        status: 403,
        code: 'four_eyes',
      });
      expect(checkMove(move, subject('in_review'), people.fitAuthorWhoReviews, { text: 'fine' })).toMatchObject({
        ok: false,
        status: 403,
        code: 'four_eyes',
      });
      // An admin is not a reviewer: roles first.
      expect(checkMove(move, subject('in_review'), people.admin, { text: 'fine' })).toMatchObject({
        ok: false,
        status: 403,
        code: 'forbidden',
      });
    }
  });

  it('only the author submits or edits a draft', () => {
    expect(checkMove('submit', subject('draft'), people.otherModeller)).toMatchObject({ ok: false, status: 403, code: 'not_author' });
    expect(checkMove('edit', subject('draft'), people.otherModeller)).toMatchObject({ ok: false, status: 403, code: 'not_author' });
  });

  it('a review needs a comment and a retirement a reason (400), after the role and state checks', () => {
    expect(checkMove('approve', subject('in_review'), people.reviewer, { text: '  ' })).toMatchObject({
      ok: false,
      status: 400,
      code: 'comment_required',
    });
    expect(checkMove('request_changes', subject('in_review'), people.reviewer)).toMatchObject({
      ok: false,
      status: 400,
      code: 'comment_required',
    });
    expect(checkMove('retire', subject('approved'), people.reviewer, { text: '' })).toMatchObject({
      ok: false,
      status: 400,
      code: 'reason_required',
    });
    expect(checkMove('submit', subject('draft'), people.author)).toEqual({ ok: true, to: 'in_review' });
  });

  it('supersede is the system’s move only', () => {
    expect(checkMove('supersede', subject('approved'), people.reviewer)).toMatchObject({ ok: false, status: 403, code: 'system_only' });
    expect(checkMove('supersede', subject('approved'), people.admin)).toMatchObject({ ok: false, status: 403, code: 'system_only' });
    expect(checkMove('supersede', subject('retired'), people.system)).toMatchObject({ ok: false, status: 409 });
    expect(checkMove('approve', subject('in_review'), people.system, { text: 'x' })).toMatchObject({ ok: false, status: 403 });
  });

  it('an older version cannot be approved over a newer approved one; an equal or older approved one is superseded', () => {
    expect(checkMove('approve', subject('in_review', { version: 2, approvedVersion: 3 }), people.reviewer, { text: 'ok' })).toMatchObject({
      ok: false,
      status: 409,
      code: 'newer_version_approved',
    });
    expect(checkMove('approve', subject('in_review', { version: 4, approvedVersion: 3 }), people.reviewer, { text: 'ok' })).toEqual({
      ok: true,
      to: 'approved',
    });
  });

  it('a set sent back is revised once', () => {
    expect(checkMove('revise', subject('changes_requested', { revised: true }), people.author)).toMatchObject({
      ok: false,
      status: 409,
      code: 'already_revised',
    });
  });

  it('offers each person exactly the moves the table allows', () => {
    expect(availableMoves(subject('in_review'), people.reviewer)).toEqual(['approve', 'request_changes']);
    expect(availableMoves(subject('in_review'), people.authorWhoReviews)).toEqual([]);
    expect(availableMoves(subject('draft'), people.author)).toEqual(['submit', 'edit']);
    expect(availableMoves(subject('approved'), people.admin)).toEqual(['retire']);
    expect(availableMoves(subject('superseded'), people.admin)).toEqual([]);
  });

  it('consumers see published sets only', () => {
    const consumer: Role[] = ['consumer'];
    expect(PARAMETER_SET_STATES.filter((s) => isVisibleTo(s, consumer))).toEqual(['approved', 'superseded', 'retired']);
    expect(PARAMETER_SET_STATES.every((s) => isVisibleTo(s, ['reviewer']))).toBe(true);
  });

  it('every rule names states that exist', () => {
    for (const rule of Object.values(MOVE_RULES)) for (const s of [...rule.from, rule.to]) expect(PARAMETER_SET_STATES).toContain(s);
  });
});
