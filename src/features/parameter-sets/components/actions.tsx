import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';
import { STATE_LABELS } from '@shared/parameter-sets/transitions';
import { CUTOFF_SCHEME_LABELS, CUTOFF_SCHEMES } from '@shared/physics/cutoff-schemes';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import {
  CUTOFF_SIGMA_RANGE,
  retireParameterSetBody,
  reviewParameterSetBody,
  reviseParameterSetBody,
  updateParameterSetBody,
} from '@shared/schemas/parameter-sets';
import { Button } from '@/components/ui/button';
import { Field, Input, Select, TextArea } from '@/components/ui/field';
import { asSentence, decimalOf, invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
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
import { toValidity, VALIDITY_PATHS, validityInputOf, ValidityFields, validityInputShape } from './validity-fields';

/** A fit a revision may start from (the substance's succeeded fits, offered by the page). */
export interface FitChoice {
  id: number;
  number: number;
  label: string;
}

/** The moves the server allows this viewer now (from the shared state machine); nothing else is offered. */
export function ParameterSetActions({
  set,
  onRevised,
  fitChoices,
}: {
  set: ParameterSetDetail;
  onRevised: (s: ParameterSetSummary) => void;
  fitChoices?: FitChoice[];
}) {
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
      <div>
        <Button variant="primary" busy={submit.isPending} onClick={() => submit.mutate(undefined)}>
          Submit for review
        </Button>
      </div>
    </div>
  );
}

const reviewFormSchema = reviewParameterSetBody.pick({ comment: true });

function ReviewDecision({ set }: { set: ParameterSetDetail }) {
  const review = useReviewParameterSet(set.id);
  const form = useForm<z.input<typeof reviewFormSchema>, unknown, z.output<typeof reviewFormSchema>>({
    resolver: zodResolver(reviewFormSchema),
    defaultValues: { comment: '' },
  });
  const unplaced = useServerFieldErrors(review.error, form.setError, sameNames(['comment']));
  const message = form.formState.errors.comment?.message;
  // One form, two decisions: each button submits it with its own.
  const decide = (decision: 'approve' | 'request_changes') => form.handleSubmit(({ comment }) => review.mutate({ decision, comment }));
  return (
    <form noValidate className="grid gap-3" aria-label="Review decision" onSubmit={decide('approve')}>
      <Field
        label={FIELD_LABELS.comment}
        htmlFor="review-comment"
        error={asSentence(message)}
        hint="Required for either decision; the author receives it."
      >
        <TextArea id="review-comment" rows={4} {...invalidProps('review-comment', message)} {...form.register('comment')} />
      </Field>
      <FormError error={review.error} unplaced={unplaced} />
      <div className="flex flex-wrap gap-3">
        <Button
          type="submit"
          variant="primary"
          busy={review.isPending && review.variables?.decision === 'approve'}
          disabled={review.isPending}
        >
          Approve
        </Button>
        <Button
          variant="danger"
          busy={review.isPending && review.variables?.decision === 'request_changes'}
          disabled={review.isPending}
          onClick={decide('request_changes')}
        >
          Request changes
        </Button>
      </div>
    </form>
  );
}

const editFormSchema = z
  .object({ rationale: z.string(), validity: validityInputShape })
  .transform((v): z.input<typeof updateParameterSetBody> => ({ rationale: v.rationale, validity: toValidity(v.validity) }))
  .pipe(updateParameterSetBody);

function EditDraft({ set }: { set: ParameterSetDetail }) {
  const edit = useEditParameterSet(set.id);
  const [open, setOpen] = useState(false);
  const form = useForm<z.input<typeof editFormSchema>, unknown, z.output<typeof editFormSchema>>({
    resolver: zodResolver(editFormSchema),
    defaultValues: { rationale: set.rationale, validity: validityInputOf(set.validity) },
  });
  const errors = form.formState.errors;
  const unplaced = useServerFieldErrors(edit.error, form.setError, sameNames(['rationale', ...VALIDITY_PATHS]));
  if (!open)
    return (
      <div>
        <Button onClick={() => setOpen(true)}>Edit rationale and validity</Button>
      </div>
    );
  return (
    <form
      noValidate
      className="grid gap-3"
      aria-label="Edit draft"
      onSubmit={form.handleSubmit((body) => edit.mutate(body, { onSuccess: () => setOpen(false) }))}
    >
      <ValidityFields idPrefix="edit" register={(k) => form.register(`validity.${k}`)} errors={errors.validity} />
      <Field label={FIELD_LABELS.rationale} htmlFor="edit-rationale" error={errors.rationale?.message}>
        <TextArea
          id="edit-rationale"
          rows={3}
          {...invalidProps('edit-rationale', errors.rationale?.message)}
          {...form.register('rationale')}
        />
      </Field>
      <p className="text-xs text-ink-faint">ε, σ and their uncertainties are frozen; for other values draft a new set from another fit.</p>
      <FormError error={edit.error} unplaced={unplaced} />
      <div className="flex gap-3">
        <Button type="submit" variant="primary" busy={edit.isPending}>
          Save draft
        </Button>
        <Button variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

const reviseFormShape = z.object({
  fitId: z.string(),
  scheme: z.union([z.enum(CUTOFF_SCHEMES), z.literal('')]),
  cutoffSigma: z.string(),
  validity: validityInputShape,
  rationale: z.string(),
});

/** The boxes as typed become the request (validity only for this set's own fit), judged by reviseParameterSetBody. */
const reviseFormSchema = (ownFitId: number) =>
  reviseFormShape
    .transform((v): z.input<typeof reviseParameterSetBody> => {
      const sameFit = Number(v.fitId) === ownFitId;
      const cutoffSigma = v.scheme && v.scheme !== 'full-potential' ? decimalOf(v.cutoffSigma) : undefined;
      return {
        rationale: v.rationale,
        ...(sameFit ? { validity: toValidity(v.validity) } : { fitId: Number(v.fitId) }),
        ...(v.scheme ? { scheme: v.scheme } : {}),
        ...(cutoffSigma !== undefined ? { cutoffSigma } : {}),
      };
    })
    .pipe(reviseParameterSetBody);

function ReviseForm({
  set,
  onRevised,
  fitChoices,
}: {
  set: ParameterSetDetail;
  onRevised: (s: ParameterSetSummary) => void;
  fitChoices?: FitChoice[];
}) {
  // The set's own fit first, then the newer succeeded fits of the substance (the server refuses older ones).
  const choices = [
    { id: set.fitId, number: set.fitNumber, label: `Fit #${set.fitNumber} — this set's fit` },
    ...(fitChoices ?? []).filter((f) => f.id !== set.fitId && f.number > set.fitNumber),
  ];
  const revise = useReviseParameterSet(set.id);
  // The scheme the form shows is the scheme it sends: this set's own for the same fit; for another fit, that
  // fit's own scheme unless the author picks one (the server applies the same rules as to a first draft).
  const form = useForm<z.input<typeof reviseFormShape>, unknown, z.output<typeof reviseParameterSetBody>>({
    resolver: zodResolver(reviseFormSchema(set.fitId)),
    defaultValues: {
      fitId: String(set.fitId),
      scheme: set.scheme,
      cutoffSigma: set.cutoffSigma === null ? '2.5' : String(set.cutoffSigma),
      validity: validityInputOf(set.validity),
      rationale: set.rationale,
    },
  });
  const errors = form.formState.errors;
  const [fitId, scheme] = useWatch({ control: form.control, name: ['fitId', 'scheme'] });
  const sameFit = Number(fitId) === set.fitId;
  const unplaced = useServerFieldErrors(
    revise.error,
    form.setError,
    sameNames(['fitId', 'scheme', 'cutoffSigma', 'rationale', ...VALIDITY_PATHS]),
  );
  return (
    <form
      noValidate
      className="grid gap-3"
      aria-label="Draft a revision"
      onSubmit={form.handleSubmit((body) => {
        // Through the promise, not mutate's onSuccess: once the set is revised its page refetches and this form
        // leaves (no "revise" move any more) before a per-call callback would run, and the page would stay put.
        revise.mutateAsync(body).then(onRevised, () => undefined);
      })}
    >
      <p className="text-sm text-ink-soft">
        A revision is a new draft (the next version) linked to this one; this set stays as the record of its review.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field
          label={FIELD_LABELS.fitId}
          htmlFor="revise-fit"
          hint={`This set's fit or a newer succeeded fit of ${set.substanceName}; a different fit brings its own values and data span.`}
          error={errors.fitId?.message}
        >
          <Select
            id="revise-fit"
            {...invalidProps('revise-fit', errors.fitId?.message)}
            {...form.register('fitId', {
              onChange: (e: React.ChangeEvent<HTMLSelectElement>) =>
                form.setValue('scheme', Number(e.target.value) === set.fitId ? set.scheme : ''),
            })}
          >
            {choices.map((f) => (
              <option key={f.id} value={String(f.id)}>
                {f.label}
              </option>
            ))}
          </Select>
        </Field>
        <Field
          label={FIELD_LABELS.scheme}
          htmlFor="revise-scheme"
          hint="B2 and dilute-gas viscosity see the whole potential; density fits use their simulations’ cutoff."
          error={errors.scheme?.message}
        >
          <Select id="revise-scheme" {...invalidProps('revise-scheme', errors.scheme?.message)} {...form.register('scheme')}>
            {!sameFit && <option value="">As the chosen fit was computed</option>}
            {CUTOFF_SCHEMES.map((k) => (
              <option key={k} value={k}>
                {CUTOFF_SCHEME_LABELS[k]}
              </option>
            ))}
          </Select>
        </Field>
        {scheme !== '' && scheme !== 'full-potential' && (
          <Field
            label={FIELD_LABELS.cutoffSigma}
            htmlFor="revise-cutoff"
            hint={`${CUTOFF_SIGMA_RANGE.min} to ${CUTOFF_SIGMA_RANGE.max} σ`}
            error={errors.cutoffSigma?.message}
          >
            <Input
              id="revise-cutoff"
              inputMode="decimal"
              {...invalidProps('revise-cutoff', errors.cutoffSigma?.message)}
              {...form.register('cutoffSigma')}
            />
          </Field>
        )}
      </div>
      {sameFit && <ValidityFields idPrefix="revise" register={(k) => form.register(`validity.${k}`)} errors={errors.validity} />}
      <Field label="Rationale of the revision" htmlFor="revise-rationale" error={errors.rationale?.message}>
        <TextArea
          id="revise-rationale"
          rows={3}
          {...invalidProps('revise-rationale', errors.rationale?.message)}
          {...form.register('rationale')}
        />
      </Field>
      <FormError error={revise.error} unplaced={unplaced} />
      <div>
        <Button type="submit" variant="primary" busy={revise.isPending}>
          Draft revision
        </Button>
      </div>
    </form>
  );
}

function RetireForm({ set }: { set: ParameterSetDetail }) {
  const retire = useRetireParameterSet(set.id);
  const form = useForm<z.input<typeof retireParameterSetBody>, unknown, z.output<typeof retireParameterSetBody>>({
    resolver: zodResolver(retireParameterSetBody),
    defaultValues: { reason: '' },
  });
  const reason = useWatch({ control: form.control, name: 'reason' });
  const message = form.formState.errors.reason?.message;
  const unplaced = useServerFieldErrors(retire.error, form.setError, sameNames(['reason']));
  return (
    <form noValidate className="grid gap-3" aria-label="Retire" onSubmit={form.handleSubmit((body) => retire.mutate(body))}>
      <Field
        label="Reason for retiring"
        htmlFor="retire-reason"
        hint="Followers of the substance are told; the set stays readable, marked retired."
        error={message}
      >
        <TextArea id="retire-reason" rows={2} {...invalidProps('retire-reason', message)} {...form.register('reason')} />
      </Field>
      <FormError error={retire.error} unplaced={unplaced} />
      <div>
        <Button type="submit" variant="danger" busy={retire.isPending} disabled={reason.trim().length < 3}>
          Retire
        </Button>
      </div>
    </form>
  );
}
