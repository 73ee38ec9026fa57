import type { Comment } from '../../../../shared/api/reviews';
import { Button } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import type { Reviewer as Me } from '../review-context';

/** The author as a thread shows them: the signed-in user is "(you)". */
export function authorLabel(c: Comment, me: Me): string {
  return c.authorId === me.id ? `${me.name} (you)` : c.authorName;
}

/** One comment of a thread: who wrote it on which version, what it replies to, its state and actions. */
export function CommentItem({
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
