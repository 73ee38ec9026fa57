import { useEffect, useMemo, useRef, useState } from 'react';
import type { Comment } from '../../../../shared/api/reviews';
import { can, canResolveComment } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { Button, ErrorNote, Field, Spinner, SubmitButton, TextArea } from '../../../app/ui/controls';
import { Sym } from '../../../app/ui/quantity';
import { useToast } from '../../../app/ui/toasts';
import { useAddComment, useComments, useResolveComment } from '../api/reviews';
import { GENERAL, type ReviewContext, type Reviewer as Me, type ThreadKey } from '../review-context';
import { threadOrder } from '../thread-order';
import { authorLabel, CommentItem } from './CommentItem';

/** One thread: the comments on a quantity (or on the whole budget), replies and the form to add one. */
export function Thread({ ctx, me, thread, onClose }: { ctx: ReviewContext; me: Me; thread: ThreadKey; onClose?(): void }) {
  const comments = useComments(ctx.budgetId);
  const add = useAddComment(ctx.budgetId);
  const resolve = useResolveComment(ctx.budgetId);
  const toast = useToast();
  const [body, setBody] = useState('');
  const [replyTo, setReplyTo] = useState<Comment | null>(null);
  const [touched, setTouched] = useState(false);
  const headingRef = useRef<HTMLHeadingElement>(null);
  const boxRef = useRef<HTMLTextAreaElement>(null);
  const symbol = thread === GENERAL ? null : thread;
  const list = threadOrder((comments.data ?? []).filter((c) => c.symbol === symbol));
  const byId = useMemo(() => new Map((comments.data ?? []).map((c) => [c.id, c])), [comments.data]);
  const mayComment = can(me.role, 'comment.create') && !ctx.viewingOld;
  const known = symbol === null || ctx.symbols.includes(symbol);

  useEffect(() => {
    if (symbol === null) return;
    headingRef.current?.focus();
    headingRef.current?.scrollIntoView({ block: 'nearest' });
  }, [symbol]);

  const error = touched && body.trim() === '' ? 'Write the comment first.' : null;
  const submit = () => {
    setTouched(true);
    if (body.trim() === '') return;
    add.mutate(
      { version: ctx.currentVersion, symbol, parentId: replyTo?.id ?? null, body: body.trim() },
      {
        onSuccess: () => {
          setBody('');
          setReplyTo(null);
          setTouched(false);
          toast(symbol ? `Comment on ${symbol} added.` : 'Comment on the budget added.');
        },
        onError: (e) => toast(`The comment was not added: ${errorMessage(e)}`, 'error'),
      },
    );
  };

  const title = symbol ? (
    <>
      Comments on <Sym s={symbol} />
    </>
  ) : (
    'Comments on the whole budget'
  );
  return (
    <section aria-label={symbol ? `Comments on ${symbol}` : 'Comments on the whole budget'} data-testid={symbol ? `thread-${symbol}` : 'thread-budget'} className="flex flex-col gap-2">
      <div className="flex items-center justify-between gap-2">
        <h3 ref={headingRef} tabIndex={-1} className="text-sm font-semibold text-stone-900">
          {title}
        </h3>
        {onClose ? (
          <Button size="sm" variant="ghost" onClick={onClose} aria-label="Close the thread">
            ✕ Close
          </Button>
        ) : null}
      </div>
      {comments.isPending ? (
        <Spinner label="Loading comments" />
      ) : comments.isError ? (
        <ErrorNote title="The comments could not be loaded">{errorMessage(comments.error)}</ErrorNote>
      ) : list.length === 0 ? (
        <p className="text-xs text-stone-600">No comments yet{mayComment ? '.' : '; your role reads comments only.'}</p>
      ) : (
        <ul className="flex flex-col gap-1.5">
          {list.map((c) => (
            <CommentItem
              key={c.id}
              c={c}
              byId={byId}
              me={me}
              currentVersion={ctx.currentVersion}
              mayResolve={c.parentId === null && canResolveComment(me, ctx.facts, c.authorId)}
              busy={resolve.isPending}
              onReply={
                mayComment
                  ? (x) => {
                      setReplyTo(x);
                      boxRef.current?.focus();
                    }
                  : undefined
              }
              onResolve={(x, resolved) =>
                resolve.mutate(
                  { id: x.id, resolved },
                  {
                    onSuccess: () => toast(resolved ? 'Thread resolved.' : 'Thread reopened.', 'info'),
                    onError: (e) => toast(errorMessage(e), 'error'),
                  },
                )
              }
            />
          ))}
        </ul>
      )}
      {mayComment && known ? (
        <form
          className="flex flex-col gap-1.5"
          onSubmit={(e) => {
            e.preventDefault();
            submit();
          }}
        >
          {replyTo ? (
            <p className="flex items-center gap-2 text-xs text-stone-700">
              ↪ Replying to {authorLabel(replyTo, me)}
              <Button size="sm" variant="ghost" onClick={() => setReplyTo(null)}>
                Cancel reply
              </Button>
            </p>
          ) : null}
          <Field label={replyTo ? 'Your reply' : symbol ? `New comment on ${symbol}` : 'New comment on the budget'} error={error}>
            {(p) => (
              <TextArea
                {...p}
                ref={boxRef}
                rows={3}
                value={body}
                maxLength={10_000}
                onChange={(e) => setBody(e.target.value)}
                onKeyDown={(e) => {
                  if ((e.ctrlKey || e.metaKey) && e.key === 'Enter') {
                    e.preventDefault();
                    submit();
                  }
                }}
              />
            )}
          </Field>
          <div className="flex items-center justify-between gap-2">
            <span className="text-[11px] text-stone-600">Pinned to version {ctx.currentVersion}. Ctrl+Enter sends.</span>
            <SubmitButton size="sm" pending={add.isPending} pendingLabel="Adding…">
              {replyTo ? 'Add reply' : 'Add comment'}
            </SubmitButton>
          </div>
        </form>
      ) : mayComment && !known ? (
        <p className="text-xs text-stone-600">This quantity is not in version {ctx.currentVersion}; comments on it are kept for the record.</p>
      ) : null}
    </section>
  );
}
