import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { EditorPage } from '../../features/editor/components/EditorPage';
import { MonteCarloPanel } from '../../features/monte-carlo/components/MonteCarloPanel';
import { EvidencePanel } from '../../features/evidence/components/EvidencePanel';
import { ReviewActions } from '../../features/reviews/components/ReviewActions';
import { ReturnedNotice } from '../../features/reviews/components/ReturnedNotice';
import { canAttach, isEditableStatus } from '../../../shared/policy/policy';
import { CommentBadge } from '../../features/reviews/components/CommentBadge';
import { ReviewPanel } from '../../features/reviews/components/ReviewPanel';
import type { ThreadKey } from '../../features/reviews/review-context';
import { TemplateToggle } from '../../features/templates/components/TemplatesPage';
import { useSignedInUser } from './signed-in-user';

/** The editor with its slots filled, one chunk loaded when a budget is opened. */
export default function EditorRoute() {
  const { id, n } = useParams();
  // evidence on an approved version makes a new draft version: the editor starts again from it
  const [generation, setGeneration] = useState(0);
  return <EditorWithReview key={`${id}-${n ?? 'current'}-${generation}`} id={id} n={n} onNewVersion={() => setGeneration((g) => g + 1)} />;
}

/** The editor with the review feature in its slots: comment badges on rows, the thread beside the table, the review actions. */
function EditorWithReview({ id, n, onNewVersion }: { id?: string; n?: string; onNewVersion(): void }) {
  const me = useSignedInUser();
  const budgetId = id && id !== 'new' ? Number(id) : undefined;
  const [thread, setThread] = useState<ThreadKey | null>(null);
  return (
    <EditorPage
      me={me}
      budgetId={budgetId}
      versionNumber={n ? Number(n) : undefined}
      renderMonteCarlo={(props) => <MonteCarloPanel {...props} />}
      slots={
        budgetId === undefined
          ? undefined
          : {
              renderRowAdornment: (symbol) => <CommentBadge budgetId={budgetId} symbol={symbol} open={thread === symbol} onOpen={(s) => setThread((t) => (t === s ? null : s))} />,
              renderHeaderActions: (ctx) => (
                <>
                  <ReviewActions ctx={ctx} me={me} />
                  {ctx.viewingOld ? null : <TemplateToggle budgetId={ctx.budgetId} isTemplate={ctx.facts.isTemplate} role={me.role} />}
                </>
              ),
              renderSidePanel: (ctx) => <ReviewPanel ctx={ctx} me={me} thread={thread} onThread={setThread} />,
              renderTopNotice: (ctx) => (ctx.viewingOld ? null : <ReturnedNotice budgetId={ctx.budgetId} meId={me.id} />),
              renderEvidence: (ctx) => (
                <EvidencePanel
                  ctx={{
                    budgetId: ctx.budgetId,
                    version: ctx.version,
                    symbols: ctx.symbols,
                    mayAttach: !ctx.viewingOld && !ctx.dirty && isEditableStatus(ctx.facts.status) && canAttach(me, ctx.facts),
                    approved: ctx.facts.status === 'approved',
                  }}
                  onNewVersion={onNewVersion}
                />
              ),
            }
      }
    />
  );
}
