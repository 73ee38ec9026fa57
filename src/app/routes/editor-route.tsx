import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { EditorPage } from '../../features/editor/components/EditorPage';
import { MonteCarloPanel } from '../../features/monte-carlo/components/MonteCarloPanel';
import { ReviewActions } from '../../features/reviews/components/ReviewActions';
import { CommentBadge, ReviewPanel, type ThreadKey } from '../../features/reviews/components/ReviewPanel';
import { TemplateToggle } from '../../features/templates/components/TemplatesPage';
import { useSignedInUser } from './signed-in-user';

/** The editor with its slots filled, one chunk loaded when a budget is opened. */
export default function EditorRoute() {
  const { id, n } = useParams();
  return <EditorWithReview key={`${id}-${n ?? 'current'}`} id={id} n={n} />;
}

/** The editor with the review feature in its slots: comment badges on rows, the thread beside the table, the review actions. */
function EditorWithReview({ id, n }: { id?: string; n?: string }) {
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
            }
      }
    />
  );
}
