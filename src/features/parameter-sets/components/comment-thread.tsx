import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { formatDateTime } from '@shared/format/dates';
import { commentBody } from '@shared/schemas/parameter-sets';
import { Button } from '@/components/ui/button';
import { Field, TextArea } from '@/components/ui/field';
import { invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { useCommentOnParameterSet, type ParameterSetDetail } from '../api/parameter-sets';

export function CommentThread({ set }: { set: ParameterSetDetail }) {
  const comment = useCommentOnParameterSet(set.id);
  const form = useForm<z.input<typeof commentBody>, unknown, z.output<typeof commentBody>>({
    resolver: zodResolver(commentBody),
    defaultValues: { body: '' },
  });
  const body = useWatch({ control: form.control, name: 'body' });
  useServerFieldErrors(comment.error, form.setError, sameNames(['body']));
  // A refusal that names no field (403, 409) stays under the box as before.
  const message = form.formState.errors.body?.message ?? comment.error?.message;
  return (
    <div className="grid gap-4">
      {set.comments.length === 0 ? (
        <p className="text-sm text-ink-soft">No comments yet.</p>
      ) : (
        <ul className="grid gap-3" aria-label="Comments">
          {set.comments.map((c) => (
            <li key={c.id} className="rounded-md border border-rule bg-paper px-4 py-2">
              <div className="text-xs text-ink-faint">
                <span className="font-semibold text-ink">{c.authorName}</span> · {formatDateTime(c.createdAt)}
              </div>
              <p className="mt-1 whitespace-pre-line text-sm">{c.body}</p>
            </li>
          ))}
        </ul>
      )}
      {set.canComment && (
        <form
          noValidate
          className="grid gap-2"
          onSubmit={form.handleSubmit((values) => comment.mutate(values, { onSuccess: () => form.reset() }))}
        >
          <Field label="Add a comment" htmlFor="comment-body" error={message}>
            <TextArea id="comment-body" rows={3} {...invalidProps('comment-body', message)} {...form.register('body')} />
          </Field>
          <div>
            <Button type="submit" busy={comment.isPending} disabled={!body.trim()}>
              Post comment
            </Button>
          </div>
        </form>
      )}
    </div>
  );
}
