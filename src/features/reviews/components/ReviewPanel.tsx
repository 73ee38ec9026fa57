import { useEffect, useMemo, useRef, useState } from 'react';
import type { Comment } from '../../../../shared/api/reviews';
import { can, canResolveComment, type BudgetFacts, type Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { Button, ErrorNote, Field, Spinner, SubmitButton, TextArea } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { useToast } from '../../../app/ui/toasts';
import { useAddComment, useComments, useResolveComment, useReviewState } from '../api/reviews';
import { DecisionLine } from './SigningBrief';

interface Me {
  id: number;
  role: Role;
  name: string;
}

/** What the editor tells the review components about the budget on screen. */
export interface ReviewContext {
  budgetId: number;
  version: number;
  currentVersion: number;
  viewingOld: boolean;
  facts: BudgetFacts;
  returned: boolean;
  versionAuthorId: number;
  symbols: string[];
  dirty: boolean;
}

/** "general" is the thread about the whole budget. */
export type ThreadKey = string;
export const GENERAL: ThreadKey = '__budget__';

/** The author as a thread shows them: the signed-in user is "(you)". */
function authorLabel(c: Comment, me: Me): string {
  return c.authorId === me.id ? `${me.name} (you)` : c.authorName;
}

/** A thread's comments in reading order: each first comment followed by its replies. */
function threadOrder(list: Comment[]): Comment[] {
  const ids = new Set(list.map((c) => c.id));
  const replies = new Map<number, Comment[]>();
  for (const c of list) if (c.parentId !== null && ids.has(c.parentId)) replies.set(c.parentId, [...(replies.get(c.parentId) ?? []), c]);
  return list.filter((c) => c.parentId === null || !ids.has(c.parentId)).flatMap((c) => [c, ...(replies.get(c.id) ?? [])]);
}

function BubbleIcon() {
  return (
    <svg aria-hidden viewBox="0 0 16 16" className="h-3 w-3" fill="none" stroke="currentColor" strokeWidth="1.6">
      <path d="M2.5 3.5h11v7h-6l-3 2.5v-2.5h-2z" strokeLinejoin="round" />
    </svg>
  );
}

/** The count badge on a budget-table row: opens the comment thread of that quantity. */
export function CommentBadge({ budgetId, symbol, open, onOpen }: { budgetId: number; symbol: string; open: boolean; onOpen(symbol: string): void }) {
  const comments = useComments(budgetId);
  const mine = (comments.data ?? []).filter((c) => c.symbol === symbol);
  const unresolved = mine.filter((c) => !c.resolved).length;
  const label = mine.length ? `${mine.length} comment${mine.length === 1 ? '' : 's'} on ${symbol}` : `Comment on ${symbol}`;
  return (
    <button
      type="button"
      aria-label={label}
      aria-expanded={open}
      title={mine.length ? `${mine.length} comment${mine.length === 1 ? '' : 's'}, ${unresolved} open` : 'Comment on this contribution'}
      onClick={(e) => {
        e.stopPropagation();
        onOpen(symbol);
      }}
      onKeyDown={(e) => e.stopPropagation()}
      className={`no-print ml-1.5 inline-flex min-w-[1.75rem] items-center justify-center gap-0.5 rounded-full border px-1.5 text-[11px] font-semibold leading-5 ${
        open
          ? 'border-accent-700 bg-accent-700 text-white'
          : unresolved
            ? 'border-caution-500 bg-caution-50 text-caution-700'
            : mine.length
              ? 'border-stone-400 bg-white text-stone-700'
              : 'border-dashed border-stone-300 bg-white text-stone-500 hover:border-stone-500'
      }`}
    >
      <BubbleIcon />
      {mine.length ? <span className="num">{mine.length}</span> : <span aria-hidden>+</span>}
    </button>
  );
}

function CommentItem({
  c,
  byId,
  me,
  mayResolve,
  onReply,
  onResolve,
  busy,
  currentVersion,
}: {
  c: Comment;
  byId: Map<number, Comment>;
  me: Me;
  mayResolve: boolean;
  onReply?(c: Comment): void;
  onResolve(c: Comment, resolved: boolean): void;
  busy: boolean;
  currentVersion: number;
}) {
  const to = c.parentId;
  const parent = to !== null ? byId.get(to) : undefined;
  return (
    <li
      data-testid={`comment-${c.id}`}
      className={`rounded-md border px-2.5 py-2 text-sm ${c.resolved ? 'border-stone-200 bg-stone-50 text-stone-600' : 'border-stone-300 bg-white text-stone-900'} ${to !== null ? 'ml-4' : ''}`}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-x-2 text-xs text-stone-600">
        <span className="font-semibold text-stone-800">{authorLabel(c, me)}</span>
        <span>
          {formatDateTime(c.createdAt)} · <span className="num">v{c.versionNumber}</span>
          {c.versionNumber !== currentVersion ? ' (older version)' : ''}
        </span>
      </div>
      {parent ? (
        <p className="mt-1 border-l-2 border-stone-300 pl-2 text-xs text-stone-600">
          ↪ in reply to {authorLabel(parent, me)}: “{parent.body.slice(0, 80)}
          {parent.body.length > 80 ? '…' : ''}”
        </p>
      ) : to !== null ? (
        <p className="mt-1 text-xs text-stone-600">↪ in reply to comment #{to}</p>
      ) : null}
      <p className="mt-1 whitespace-pre-wrap break-words">{c.body}</p>
      <div className="mt-1.5 flex flex-wrap items-center gap-2">
        {c.resolved ? (
          <span className="inline-flex items-center gap-1 rounded-full border border-stone-300 px-2 text-xs font-medium text-stone-700">
            <span aria-hidden>✓</span> Resolved{c.resolvedByName ? ` by ${c.resolvedBy === me.id ? 'you' : c.resolvedByName}` : ''}
            {c.resolvedAt ? `, ${formatDateTime(c.resolvedAt)}` : ''}
          </span>
        ) : (
          <span className="inline-flex items-center gap-1 rounded-full border border-caution-500 bg-caution-50 px-2 text-xs font-medium text-caution-700">
            <span aria-hidden>●</span> Open
          </span>
        )}
        <span className="flex-1" />
        {onReply ? (
          <Button size="sm" variant="ghost" onClick={() => onReply(c)} aria-label={`Reply to comment ${c.id}`}>
            Reply
          </Button>
        ) : null}
        {mayResolve ? (
          <Button size="sm" disabled={busy} onClick={() => onResolve(c, !c.resolved)} aria-label={c.resolved ? `Reopen thread of comment ${c.id}` : `Resolve thread of comment ${c.id}`}>
            {c.resolved ? 'Reopen thread' : 'Resolve thread'}
          </Button>
        ) : null}
      </div>
    </li>
  );
}

/** One thread: the comments on a quantity (or on the whole budget), replies and the form to add one. */
function Thread({ ctx, me, thread, onClose }: { ctx: ReviewContext; me: Me; thread: ThreadKey; onClose?(): void }) {
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
    <section
      aria-label={symbol ? `Comments on ${symbol}` : 'Comments on the whole budget'}
      data-testid={symbol ? `thread-${symbol}` : 'thread-budget'}
      className="flex flex-col gap-2"
    >
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

/** The review column beside the budget: the open thread of a row, or the overview of every thread. */
export function ReviewPanel({ ctx, me, thread, onThread }: { ctx: ReviewContext; me: Me; thread: ThreadKey | null; onThread(t: ThreadKey | null): void }) {
  const comments = useComments(ctx.budgetId);
  const review = useReviewState(ctx.budgetId);
  const decisions = review.data?.decisions ?? [];
  const all = comments.data ?? [];
  const open = all.filter((c) => !c.resolved && c.parentId === null).length;
  const bySymbol = new Map<string, { total: number; open: number }>();
  for (const c of all) {
    if (!c.symbol) continue;
    const s = bySymbol.get(c.symbol) ?? { total: 0, open: 0 };
    s.total++;
    if (!c.resolved) s.open++;
    bySymbol.set(c.symbol, s);
  }
  return (
    <section aria-labelledby="review-h" data-testid="review-panel" className="no-print rounded-lg border border-stone-200 bg-white p-3">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id="review-h" className="text-sm font-semibold text-stone-900">
          Review
        </h2>
        <span className="text-xs text-stone-600">
          {all.length} comment{all.length === 1 ? '' : 's'}, {open} open thread{open === 1 ? '' : 's'}
        </span>
      </div>
      {thread && thread !== GENERAL ? (
        <Thread key={thread} ctx={ctx} me={me} thread={thread} onClose={() => onThread(null)} />
      ) : (
        <div className="flex flex-col gap-3">
          {bySymbol.size ? (
            <div>
              <p className="mb-1 text-xs font-medium text-stone-700">Threads on contributions</p>
              <ul className="flex flex-wrap gap-1">
                {[...bySymbol].map(([s, n]) => (
                  <li key={s}>
                    <button
                      type="button"
                      onClick={() => onThread(s)}
                      className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-xs ${n.open ? 'border-caution-500 bg-caution-50 text-caution-700' : 'border-stone-300 text-stone-700'}`}
                    >
                      <span className="sr-only">Open the thread on </span>
                      <Sym s={s} /> <span className="num">{n.total}</span>
                      <span className="sr-only">
                        {' '}
                        comments, {n.open} open
                      </span>
                      {n.open ? <span aria-hidden>●</span> : <span aria-hidden>✓</span>}
                    </button>
                  </li>
                ))}
              </ul>
            </div>
          ) : (
            <p className="text-xs text-stone-600">To comment on one contribution, use the comment badge beside its symbol in the budget table.</p>
          )}
          <Thread ctx={ctx} me={me} thread={GENERAL} />
          {decisions.length ? (
            <section aria-label="Review decisions" data-testid="review-decisions">
              <p className="mb-1 text-xs font-medium text-stone-700">Approvals and returns</p>
              <ul className="flex flex-col gap-1">
                {[...decisions].reverse().map((d) => (
                  <DecisionLine key={d.id} d={d} />
                ))}
              </ul>
            </section>
          ) : null}
        </div>
      )}
    </section>
  );
}
