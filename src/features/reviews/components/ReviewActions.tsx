import { useState } from 'react';
import { canApprove, canReturn, canSubmit, type Role } from '../../../../shared/policy/policy';
import { ApiError, errorMessage } from '../../../app/http';
import { Button, Field, FormDialog, TextArea, TextInput } from '../../../app/ui/controls';
import { useToast } from '../../../app/ui/toasts';
import { useTransition } from '../api/reviews';
import type { ReviewContext } from './ReviewPanel';

interface Me {
  id: number;
  role: Role;
  name: string;
  email?: string;
}

function transitionError(e: unknown): string {
  if (e instanceof ApiError) {
    if (e.code === 'signature_rejected') return 'The password does not match your account. The approval was not signed.';
    if (e.code === 'invalid_transition') return `This step is no longer possible: ${e.message}. Reload the budget to see its status.`;
    if (e.code === 'stale_version') return 'The budget changed meanwhile. Reload it and check the new version before deciding.';
  }
  return errorMessage(e);
}

/** Submit, approve (signed with the password) and return: each shown only where the policy allows it. */
export function ReviewActions({ ctx, me }: { ctx: ReviewContext; me: Me }) {
  const transition = useTransition(ctx.budgetId);
  const toast = useToast();
  const [approveOpen, setApproveOpen] = useState(false);
  const [returnOpen, setReturnOpen] = useState(false);
  const [password, setPassword] = useState('');
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
    setPassword('');
    setComment('');
    setTouched(false);
    setError(null);
  };

  return (
    <>
      {maySubmit ? (
        <Button
          variant="primary"
          disabled={ctx.dirty || transition.isPending}
          title={ctx.dirty ? 'Save your changes as a version first: the saved version is what gets reviewed' : `Ask a reviewer to check version ${ctx.currentVersion}`}
          onClick={() =>
            transition.mutate(
              { to: 'in_review' },
              {
                onSuccess: (r) => toast(`Version ${r.version} submitted for review. Reviewers are notified by e-mail.`),
                onError: (e) => toast(transitionError(e), 'error'),
              },
            )
          }
        >
          {transition.isPending && !approveOpen && !returnOpen ? 'Submitting…' : 'Submit for review'}
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

      <FormDialog
        open={approveOpen}
        onClose={close}
        title={`Approve version ${ctx.currentVersion}`}
        onSubmit={() => {
          setTouched(true);
          if (!password) return;
          setError(null);
          transition.mutate(
            { to: 'approved', password },
            {
              onSuccess: (r) => {
                close();
                toast(`Version ${r.version} approved and signed by ${me.name}.`);
              },
              onError: (err) => setError(transitionError(err)),
            },
          );
        }}
        submitLabel="Sign and approve"
        pendingLabel="Signing…"
        pending={transition.isPending}
      >
        <p className="text-sm text-stone-700">
          Approving signs version {ctx.currentVersion} in your name; it then cannot change. Re-enter your password as your signature.
        </p>
        <Field label="Your password (signature)" error={touched && !password ? 'Enter your password to sign.' : error}>
          {(p) => <TextInput {...p} type="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} autoFocus />}
        </Field>
      </FormDialog>

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
