import { useState } from 'react';
import { canApprove, canReturn, canSubmit } from '../../../../shared/policy/policy';
import { ApiError, errorMessage } from '../../../app/http';
import { Button, ErrorNote, Field, FormDialog, Modal, Spinner, SubmitButton, TextArea, TextInput } from '../../../app/ui/controls';
import { useToast } from '../../../app/ui/toasts';
import { useReviewState, useTransition } from '../api/reviews';
import type { ReviewContext, Reviewer as Me } from '../review-context';
import { OpenThreadList, SigningBrief } from './SigningBrief';

function transitionError(e: unknown): string {
  if (e instanceof ApiError) {
    if (e.code === 'signature_rejected') return 'The password does not match your account. The approval was not signed.';
    if (e.code === 'invalid_transition') return `This step is no longer possible: ${e.message}. Reload the budget to see its status.`;
    if (e.code === 'stale_version') return 'The budget changed meanwhile. Reload it and check the new version before deciding.';
  }
  return errorMessage(e);
}

/**
 * The approve dialog: what the signature covers (verdict, warnings, open threads, changes,
 * evidence), what signing means, a reason where one is owed, and the password as signature.
 */
function ApproveDialog({ ctx, me, onClose }: { ctx: ReviewContext; me: Me; onClose(): void }) {
  const state = useReviewState(ctx.budgetId);
  const transition = useTransition(ctx.budgetId);
  const toast = useToast();
  const [password, setPassword] = useState('');
  const [reason, setReason] = useState('');
  const [touched, setTouched] = useState(false);
  const [error, setError] = useState<{ field: 'reason' | 'password'; message: string } | null>(null);
  const caveats = state.data?.caveats ?? [];
  const needsReason = caveats.length > 0;
  const reasonError =
    touched && needsReason && !reason.trim() ? 'Say why you sign despite the points above; the reason is kept with your signature.' : error?.field === 'reason' ? error.message : null;
  const passwordError = touched && !password ? 'Enter your password to sign.' : error?.field === 'password' ? error.message : null;
  return (
    <Modal open onClose={onClose} title={`Approve version ${ctx.currentVersion}`} wide>
      {state.isPending ? (
        <Spinner label="Loading what you are about to sign" />
      ) : state.isError ? (
        <ErrorNote title="What you would sign could not be loaded">{errorMessage(state.error)}</ErrorNote>
      ) : (
        <form
          className="flex flex-col gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            setTouched(true);
            if (!password || (needsReason && !reason.trim())) return;
            setError(null);
            transition.mutate(
              { to: 'approved', password, ...(reason.trim() ? { reason: reason.trim() } : {}) },
              {
                onSuccess: (r) => {
                  onClose();
                  toast(`Version ${r.version} approved and signed by ${me.name}.`);
                },
                onError: (err) => setError({ field: err instanceof ApiError && err.field === 'reason' ? 'reason' : 'password', message: transitionError(err) }),
              },
            );
          }}
        >
          <div
            role="region"
            aria-label="What you sign"
            tabIndex={0}
            className="max-h-[28vh] overflow-y-auto rounded-md border border-stone-200 p-3 focus:outline-none focus-visible:ring-2 focus-visible:ring-accent-600"
          >
            <SigningBrief state={state.data} />
          </div>
          <div data-testid="signing-meaning" className="rounded-md border border-accent-600 bg-accent-50 px-3 py-2 text-sm text-stone-900">
            <p className="font-semibold">What your signature means</p>
            <p>
              By signing you state that you have examined this uncertainty budget — its model, its input quantities and how each was evaluated, its evidence and its result — and that you find it fit
              to support the laboratory&rsquo;s reported results under its ISO/IEC 17025 procedures. The signature covers version {ctx.currentVersion} exactly as stored (document SHA-256{' '}
              <span className="num break-all text-xs">{state.data.documentSha256}</span>); any later change becomes a new version that needs its own approval.
            </p>
          </div>
          {needsReason ? (
            <Field label={`Why do you approve although ${caveats.map((c) => c.message).join(', and ')}?`} error={reasonError}>
              {(p) => <TextArea {...p} rows={3} value={reason} maxLength={10_000} onChange={(e) => setReason(e.target.value)} />}
            </Field>
          ) : null}
          <Field label="Your password (signature)" error={passwordError}>
            {(p) => <TextInput {...p} type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} autoFocus={!needsReason} />}
          </Field>
          <div className="flex justify-end gap-2">
            <Button onClick={onClose}>Cancel</Button>
            <SubmitButton pending={transition.isPending} pendingLabel="Signing…">
              Sign and approve
            </SubmitButton>
          </div>
        </form>
      )}
    </Modal>
  );
}

/** Submitting while threads are open: list them and let the owner decide. */
function SubmitOverOpenThreads({ ctx, onSubmit, onClose, pending }: { ctx: ReviewContext; onSubmit(): void; onClose(): void; pending: boolean }) {
  const state = useReviewState(ctx.budgetId);
  const open = state.data?.openThreads ?? [];
  return (
    <Modal open onClose={onClose} title={`Submit version ${ctx.currentVersion} with ${open.length} open comment thread${open.length === 1 ? '' : 's'}?`} wide>
      <p className="text-sm text-stone-700">These threads are not resolved. A reviewer who approves over them has to say why. Resolve the ones you have answered, or submit as it is.</p>
      <OpenThreadList threads={open} />
      <div className="flex justify-end gap-2">
        <Button onClick={onClose}>Go back and resolve</Button>
        <Button variant="primary" disabled={pending} onClick={onSubmit}>
          {pending ? 'Submitting…' : 'Submit anyway'}
        </Button>
      </div>
    </Modal>
  );
}

/** Submit, approve (signed with the password) and return: each shown only where the policy allows it. */
export function ReviewActions({ ctx, me }: { ctx: ReviewContext; me: Me }) {
  const transition = useTransition(ctx.budgetId);
  const review = useReviewState(ctx.viewingOld ? undefined : ctx.budgetId);
  const toast = useToast();
  const [approveOpen, setApproveOpen] = useState(false);
  const [returnOpen, setReturnOpen] = useState(false);
  const [submitOpen, setSubmitOpen] = useState(false);
  const [comment, setComment] = useState('');
  const [touched, setTouched] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (ctx.viewingOld) return null;
  const { facts } = ctx;
  const maySubmit = facts.status === 'draft' && canSubmit(me, facts);
  const mayApprove = facts.status === 'in_review' && canApprove(me, facts, ctx.versionAuthorId);
  const mayReturn = facts.status === 'in_review' && canReturn(me, facts);
  const ownReview = facts.status === 'in_review' && (me.role === 'reviewer' || me.role === 'admin') && !mayApprove;

  const close = () => {
    setApproveOpen(false);
    setReturnOpen(false);
    setSubmitOpen(false);
    setComment('');
    setTouched(false);
    setError(null);
  };

  const submit = () =>
    transition.mutate(
      { to: 'in_review' },
      {
        onSuccess: (r) => {
          close();
          toast(`Version ${r.version} submitted for review. Reviewers are notified by e-mail.`);
        },
        onError: (e) => toast(transitionError(e), 'error'),
      },
    );

  return (
    <>
      {maySubmit ? (
        <Button
          variant="primary"
          disabled={ctx.dirty || transition.isPending}
          title={ctx.dirty ? 'Save your changes as a version first: the saved version is what gets reviewed' : `Ask a reviewer to check version ${ctx.currentVersion}`}
          onClick={() => ((review.data?.openThreads.length ?? 0) > 0 ? setSubmitOpen(true) : submit())}
        >
          {transition.isPending && !approveOpen && !returnOpen && !submitOpen ? 'Submitting…' : 'Submit for review'}
        </Button>
      ) : null}
      {mayApprove ? (
        <Button variant="primary" onClick={() => setApproveOpen(true)}>
          Approve
        </Button>
      ) : null}
      {mayReturn ? (
        <Button variant="danger" onClick={() => setReturnOpen(true)}>
          Return to author
        </Button>
      ) : null}
      {ownReview && !mayReturn ? (
        <span className="self-center text-xs text-stone-600">You own or wrote this version, so another reviewer approves it.</span>
      ) : ownReview ? (
        <span className="self-center text-xs text-stone-600">You wrote this version, so another reviewer approves it.</span>
      ) : null}

      {approveOpen ? <ApproveDialog ctx={ctx} me={me} onClose={close} /> : null}
      {submitOpen ? <SubmitOverOpenThreads ctx={ctx} onSubmit={submit} onClose={close} pending={transition.isPending} /> : null}

      <FormDialog
        open={returnOpen}
        onClose={close}
        title={`Return version ${ctx.currentVersion} to its author`}
        onSubmit={() => {
          setTouched(true);
          if (!comment.trim()) return;
          setError(null);
          transition.mutate(
            { to: 'draft', comment: comment.trim() },
            {
              onSuccess: () => {
                close();
                toast('Returned to the author with your comment.');
              },
              onError: (err) => setError(transitionError(err)),
            },
          );
        }}
        submitLabel="Send back"
        pendingLabel="Returning…"
        pending={transition.isPending}
        variant="danger"
      >
        <p className="text-sm text-stone-700">The budget goes back to draft. Your comment is added to the budget and mailed to the owner.</p>
        <Field label="Why is it returned?" error={touched && !comment.trim() ? 'Say what the author should change; the comment is required.' : error}>
          {(p) => <TextArea {...p} rows={4} value={comment} onChange={(e) => setComment(e.target.value)} autoFocus maxLength={10_000} />}
        </Field>
      </FormDialog>
    </>
  );
}
