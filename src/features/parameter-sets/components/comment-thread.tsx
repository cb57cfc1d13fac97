import { useState } from 'react';
import { formatDateTime } from '@shared/format/dates';
import { Button } from '@/components/ui/button';
import { Field, TextArea } from '@/components/ui/field';
import { useCommentOnParameterSet, type ParameterSetDetail } from '../api/parameter-sets';

export function CommentThread({ set }: { set: ParameterSetDetail }) {
  const [body, setBody] = useState('');
  const comment = useCommentOnParameterSet(set.id);
  return (
    <div className="grid gap-4">
      {set.comments.length === 0 ? (
        <p className="text-sm text-ink-soft">No comments yet.</p>
      ) : (
        <ul className="grid gap-3" aria-label="Comments">
          {set.comments.map((c) => (
            <li key={c.id} className="rounded-md border border-rule bg-paper px-4 py-2">
              <div className="text-xs text-ink-faint"><span className="font-semibold text-ink">{c.authorName}</span> · {formatDateTime(c.createdAt)}</div>
              <p className="mt-1 whitespace-pre-line text-sm">{c.body}</p>
            </li>
          ))}
        </ul>
      )}
      {set.canComment && (
        <form
          className="grid gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (body.trim()) comment.mutate({ body }, { onSuccess: () => setBody('') });
          }}
        >
          <Field label="Add a comment" htmlFor="comment-body" error={comment.error?.message}>
            <TextArea id="comment-body" rows={3} value={body} onChange={(e) => setBody(e.target.value)} />
          </Field>
          <div>
            <Button type="submit" busy={comment.isPending} disabled={!body.trim()}>Post comment</Button>
          </div>
        </form>
      )}
    </div>
  );
}
