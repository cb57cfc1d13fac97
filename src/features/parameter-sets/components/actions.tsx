import { useState } from 'react';
import { STATE_LABELS } from '@shared/parameter-sets/transitions';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES, type CutoffScheme } from '@shared/physics/cutoff-schemes';
import { CUTOFF_SIGMA_RANGE } from '@shared/schemas/parameter-sets';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, TextArea } from '@/components/ui/field';
import {
  useEditParameterSet,
  useRetireParameterSet,
  useReviewParameterSet,
  useReviseParameterSet,
  useSubmitParameterSet,
  type ParameterSetDetail,
  type ParameterSetSummary,
} from '../api/parameter-sets';
import { FormError } from './form-error';
import { toValidity, validityInputOf, ValidityFields } from './validity-fields';

/** A fit a revision may start from (the substance's succeeded fits, offered by the page). */
export interface FitChoice {
  id: number;
  number: number;
  label: string;
}

/** The moves the server allows this viewer now (from the shared state machine); nothing else is offered. */
export function ParameterSetActions({ set, onRevised, fitChoices }: { set: ParameterSetDetail; onRevised: (s: ParameterSetSummary) => void; fitChoices?: FitChoice[] }) {
  const moves = new Set(set.allowedMoves);
  if (moves.size === 0) {
    return <p className="text-sm text-ink-soft">Nothing for you to do on this set now ({STATE_LABELS[set.state]}).</p>;
  }
  return (
    <div className="grid gap-6">
      {moves.has('submit') && <SubmitAction set={set} />}
      {(moves.has('approve') || moves.has('request_changes')) && <ReviewDecision set={set} />}
      {moves.has('edit') && <EditDraft set={set} />}
      {moves.has('revise') && <ReviseForm set={set} onRevised={onRevised} fitChoices={fitChoices} />}
      {moves.has('retire') && <RetireForm set={set} />}
    </div>
  );
}

function SubmitAction({ set }: { set: ParameterSetDetail }) {
  const submit = useSubmitParameterSet(set.id);
  return (
    <div className="grid gap-2">
      <p className="text-sm text-ink-soft">Submitting hands the set to the reviewers; its rationale and validity are then fixed.</p>
      <FormError error={submit.error} />
      <div><Button variant="primary" busy={submit.isPending} onClick={() => submit.mutate(undefined)}>Submit for review</Button></div>
    </div>
  );
}

function ReviewDecision({ set }: { set: ParameterSetDetail }) {
  const review = useReviewParameterSet(set.id);
  const [comment, setComment] = useState('');
  const [missing, setMissing] = useState(false);
  const decide = (decision: 'approve' | 'request_changes') => {
    if (!comment.trim()) return setMissing(true);
    setMissing(false);
    review.mutate({ decision, comment });
  };
  return (
    <form className="grid gap-3" aria-label="Review decision" onSubmit={(e) => e.preventDefault()}>
      <Field label="Review comment" htmlFor="review-comment" error={missing ? 'A review needs a comment.' : undefined} hint="Required for either decision; the author receives it.">
        <TextArea id="review-comment" rows={4} aria-invalid={missing} value={comment} onChange={(e) => {
          setComment(e.target.value);
          if (e.target.value.trim()) setMissing(false);
        }} />
      </Field>
      <FormError error={review.error} />
      <div className="flex flex-wrap gap-3">
        <Button variant="primary" busy={review.isPending && review.variables?.decision === 'approve'} disabled={review.isPending} onClick={() => decide('approve')}>Approve</Button>
        <Button variant="danger" busy={review.isPending && review.variables?.decision === 'request_changes'} disabled={review.isPending} onClick={() => decide('request_changes')}>Request changes</Button>
      </div>
    </form>
  );
}

function EditDraft({ set }: { set: ParameterSetDetail }) {
  const edit = useEditParameterSet(set.id);
  const [open, setOpen] = useState(false);
  const [rationale, setRationale] = useState(set.rationale);
  const [validity, setValidity] = useState(validityInputOf(set.validity));
  if (!open) return <div><Button onClick={() => setOpen(true)}>Edit rationale and validity</Button></div>;
  return (
    <form
      className="grid gap-3"
      aria-label="Edit draft"
      onSubmit={(e) => {
        e.preventDefault();
        edit.mutate({ rationale, validity: toValidity(validity) }, { onSuccess: () => setOpen(false) });
      }}
    >
      <ValidityFields idPrefix="edit" value={validity} onChange={setValidity} />
      <Field label="Rationale" htmlFor="edit-rationale">
        <TextArea id="edit-rationale" rows={3} value={rationale} onChange={(e) => setRationale(e.target.value)} />
      </Field>
      <p className="text-xs text-ink-faint">ε, σ and their uncertainties are frozen; for other values draft a new set from another fit.</p>
      <FormError error={edit.error} />
      <div className="flex gap-3">
        <Button type="submit" variant="primary" busy={edit.isPending}>Save draft</Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>Cancel</Button>
      </div>
    </form>
  );
}

function ReviseForm({ set, onRevised, fitChoices }: { set: ParameterSetDetail; onRevised: (s: ParameterSetSummary) => void; fitChoices?: FitChoice[] }) {
  // The set's own fit first, then the newer succeeded fits of the substance (the server refuses older ones).
  const choices = [{ id: set.fitId, number: set.fitNumber, label: `Fit #${set.fitNumber} — this set's fit` }, ...(fitChoices ?? []).filter((f) => f.id !== set.fitId && f.number > set.fitNumber)];
  const revise = useReviseParameterSet(set.id);
  const [fitId, setFitId] = useState(String(set.fitId));
  // The scheme the form shows is the scheme it sends: this set's own for the same fit; for another fit, that
  // fit's own scheme unless the author picks one (the server applies the same rules as to a first draft).
  const [scheme, setScheme] = useState<CutoffScheme | ''>(set.scheme);
  const [cutoff, setCutoff] = useState(set.cutoffSigma === null ? '2.5' : String(set.cutoffSigma));
  const [validity, setValidity] = useState(validityInputOf(set.validity));
  const [rationale, setRationale] = useState(set.rationale);
  const sameFit = Number(fitId) === set.fitId;
  return (
    <form
      className="grid gap-3"
      aria-label="Draft a revision"
      onSubmit={(e) => {
        e.preventDefault();
        // Through the promise, not mutate's onSuccess: once the set is revised its page refetches and this form
        // leaves (no "revise" move any more) before a per-call callback would run, and the page would stay put.
        revise
          .mutateAsync({
            rationale,
            ...(sameFit ? { validity: toValidity(validity) } : { fitId: Number(fitId) }),
            ...(scheme ? { scheme } : {}),
            ...(scheme && scheme !== 'full-potential' ? { cutoffSigma: Number(cutoff.replace(',', '.')) } : {}),
          })
          .then(onRevised, () => undefined);
      }}
    >
      <p className="text-sm text-ink-soft">A revision is a new draft (the next version) linked to this one; this set stays as the record of its review.</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="From fit" htmlFor="revise-fit" hint={`This set's fit or a newer succeeded fit of ${set.substanceName}; a different fit brings its own values and data span.`}>
          <Select
            id="revise-fit"
            value={fitId}
            onChange={(e) => {
              setFitId(e.target.value);
              setScheme(Number(e.target.value) === set.fitId ? set.scheme : '');
            }}
          >
            {choices.map((f) => <option key={f.id} value={String(f.id)}>{f.label}</option>)}
          </Select>
        </Field>
        <Field label="Cutoff scheme" htmlFor="revise-scheme" hint="B2 and dilute-gas viscosity see the whole potential; density fits use their simulations’ cutoff.">
          <Select id="revise-scheme" value={scheme} onChange={(e) => setScheme(e.target.value as CutoffScheme | '')}>
            {!sameFit && <option value="">As the chosen fit was computed</option>}
            {CUTOFF_SCHEMES.map((k) => <option key={k} value={k}>{CUTOFF_SCHEME_LABELS[k]}</option>)}
          </Select>
        </Field>
        {scheme !== '' && scheme !== 'full-potential' && (
          <Field label="Cutoff r_c (σ)" htmlFor="revise-cutoff" hint={`${CUTOFF_SIGMA_RANGE.min} to ${CUTOFF_SIGMA_RANGE.max} σ`}>
            <Input id="revise-cutoff" inputMode="decimal" value={cutoff} onChange={(e) => setCutoff(e.target.value)} />
          </Field>
        )}
      </div>
      {Number(fitId) === set.fitId && <ValidityFields idPrefix="revise" value={validity} onChange={setValidity} />}
      <Field label="Rationale of the revision" htmlFor="revise-rationale">
        <TextArea id="revise-rationale" rows={3} value={rationale} onChange={(e) => setRationale(e.target.value)} />
      </Field>
      <FormError error={revise.error} />
      <div><Button type="submit" variant="primary" busy={revise.isPending}>Draft revision</Button></div>
    </form>
  );
}

function RetireForm({ set }: { set: ParameterSetDetail }) {
  const retire = useRetireParameterSet(set.id);
  const [reason, setReason] = useState('');
  return (
    <form
      className="grid gap-3"
      aria-label="Retire"
      onSubmit={(e) => {
        e.preventDefault();
        retire.mutate({ reason });
      }}
    >
      <Field label="Reason for retiring" htmlFor="retire-reason" hint="Followers of the substance are told; the set stays readable, marked retired.">
        <TextArea id="retire-reason" rows={2} value={reason} onChange={(e) => setReason(e.target.value)} />
      </Field>
      <FormError error={retire.error} />
      <div><Button type="submit" variant="danger" busy={retire.isPending} disabled={reason.trim().length < 3}>Retire</Button></div>
    </form>
  );
}
