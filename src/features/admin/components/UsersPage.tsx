import { useState } from 'react';
import type { UserAccount } from '../../../../shared/api/accounts';
import { ROLES, type Role } from '../../../../shared/policy/policy';
import { ApiError, errorMessage } from '../../../app/http';
import { Button, EmptyState, ErrorNote, Field, FormDialog, Select, Spinner, SubmitButton, TextArea, TextInput } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { useToast } from '../../../app/ui/toasts';
import { useInvite, useUpdateUser, useUsers } from '../api/admin';

const ROLE_WORD: Record<Role, string> = { admin: 'Administrator', metrologist: 'Metrologist', reviewer: 'Reviewer', auditor: 'Auditor', trainee: 'Trainee' };

function InviteForm() {
  const invite = useInvite();
  const toast = useToast();
  const [email, setEmail] = useState('');
  const [name, setName] = useState('');
  const [role, setRole] = useState<Role>('metrologist');
  const [touched, setTouched] = useState(false);
  const emailError = touched && !/^\S+@\S+\.\S+$/.test(email) ? 'Enter an e-mail address.' : invite.error instanceof ApiError && invite.error.code === 'email_taken' ? 'An account with this address exists.' : null;
  const nameError = touched && !name.trim() ? 'Enter the person’s name.' : null;
  return (
    <form
      aria-labelledby="invite-h"
      className="flex flex-col gap-3 rounded-lg border border-stone-200 bg-white p-4"
      onSubmit={(e) => {
        e.preventDefault();
        setTouched(true);
        if (!/^\S+@\S+\.\S+$/.test(email) || !name.trim()) return;
        invite.mutate(
          { email: email.trim(), name: name.trim(), role },
          {
            onSuccess: (r) => {
              toast(`Invitation sent to ${r.user.email}; the link is valid until ${formatDateTime(r.expiresAt)}.`);
              setEmail('');
              setName('');
              setTouched(false);
            },
            onError: (err) => {
              if (!(err instanceof ApiError && err.code === 'email_taken')) toast(`Not invited: ${errorMessage(err)}`, 'error');
            },
          },
        );
      }}
    >
      <div>
        <h2 id="invite-h" className="text-base font-semibold">
          Invite a colleague
        </h2>
        <p className="text-xs text-stone-600">They receive an e-mail with a link to set their password.</p>
      </div>
      <div className="grid gap-3 sm:grid-cols-[1fr_1fr_12rem_auto]">
        <Field label="Name" error={nameError}>
          {(p) => <TextInput {...p} value={name} onChange={(e) => setName(e.target.value)} autoComplete="off" />}
        </Field>
        <Field label="E-mail address" error={emailError}>
          {(p) => <TextInput {...p} type="email" value={email} onChange={(e) => setEmail(e.target.value)} autoComplete="off" />}
        </Field>
        <Field label="Role">
          {(p) => (
            <Select {...p} value={role} onChange={(e) => setRole(e.target.value as Role)}>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_WORD[r]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <div className="flex items-end">
          <SubmitButton pending={invite.isPending} pendingLabel="Sending…">
            Send invitation
          </SubmitButton>
        </div>
      </div>
    </form>
  );
}

/** A change of access waiting for its confirmation and reason. */
interface PendingChange {
  patch: { role?: Role; active?: boolean };
  title: string;
  consequence: string;
  submitLabel: string;
  done: string;
  danger: boolean;
}

/** Confirms a role change or a (de)activation and asks why; the reason goes into the audit trail. */
function ConfirmChangeDialog({ u, change, onClose }: { u: UserAccount; change: PendingChange; onClose(): void }) {
  const update = useUpdateUser();
  const toast = useToast();
  const [reason, setReason] = useState('');
  const [touched, setTouched] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <FormDialog
      onClose={onClose}
      title={change.title}
      submitLabel={change.submitLabel}
      pendingLabel="Applying…"
      pending={update.isPending}
      variant={change.danger ? 'danger' : 'primary'}
      onSubmit={() => {
        setTouched(true);
        if (!reason.trim()) return;
        setError(null);
        update.mutate(
          { id: u.id, ...change.patch, reason: reason.trim() },
          {
            onSuccess: () => {
              toast(change.done);
              onClose();
            },
            onError: (e) => setError(errorMessage(e)),
          },
        );
      }}
    >
      <p className="text-sm text-stone-700">{change.consequence}</p>
      <Field label="Reason (kept in the audit trail)" error={touched && !reason.trim() ? 'Say why; the reason is recorded with the change.' : error}>
        {(p) => <TextArea {...p} rows={3} value={reason} maxLength={2000} onChange={(e) => setReason(e.target.value)} autoFocus />}
      </Field>
    </FormDialog>
  );
}

function UserRow({ u, meId, onChange }: { u: UserAccount; meId: number; onChange(u: UserAccount, change: PendingChange): void }) {
  const update = useUpdateUser();
  const self = u.id === meId;
  const setPending = (change: PendingChange) => onChange(u, change);
  const changeRole = (role: Role) =>
    setPending({
      patch: { role },
      title: `Change the role of ${u.name}`,
      consequence: `${u.name} goes from ${ROLE_WORD[u.role].toLowerCase()} to ${ROLE_WORD[role].toLowerCase()}. Their open sessions end at once, and what they may do changes from their next sign-in.`,
      submitLabel: `Make ${ROLE_WORD[role].toLowerCase()}`,
      done: `${u.name} is now ${ROLE_WORD[role].toLowerCase()}. Their sessions were ended.`,
      danger: false,
    });
  const setActive = (active: boolean) =>
    setPending(
      active
        ? { patch: { active }, title: `Activate ${u.name}`, consequence: `${u.name} can sign in again with their role of ${ROLE_WORD[u.role].toLowerCase()}.`, submitLabel: 'Activate', done: `${u.name} can sign in again.`, danger: false }
        : {
            patch: { active },
            title: `Deactivate ${u.name}`,
            consequence: `${u.name} is signed out at once and can no longer sign in. Their budgets, comments and signatures stay on record.`,
            submitLabel: 'Deactivate',
            done: `${u.name} is deactivated and signed out.`,
            danger: true,
          },
    );
  return (
    <tr data-testid={`user-${u.email}`} className={`border-b border-stone-100 last:border-0 ${u.active ? '' : 'bg-stone-50 text-stone-600'}`}>
      <td className="px-3 py-2 font-medium">
        {u.name}
        {self ? <span className="ml-1 text-xs font-normal text-stone-600">(you)</span> : null}
      </td>
      <td className="px-3 py-2 text-stone-700">{u.email}</td>
      <td className="px-3 py-2">
        <label className="sr-only" htmlFor={`role-${u.id}`}>
          Role of {u.name}
        </label>
        <Select
          id={`role-${u.id}`}
          value={u.role}
          disabled={self || update.isPending}
          title={self ? 'You cannot change your own role' : undefined}
          onChange={(e) => changeRole(e.target.value as Role)}
          className="w-40"
        >
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_WORD[r]}
            </option>
          ))}
        </Select>
      </td>
      <td className="px-3 py-2">
        {!u.active ? (
          <span className="inline-flex items-center gap-1 rounded-full border border-stone-400 bg-white px-2 py-0.5 text-xs font-semibold text-stone-700">
            <span aria-hidden>⊘</span> Deactivated
          </span>
        ) : !u.hasPassword ? (
          <span className="inline-flex items-center gap-1 rounded-full border border-caution-500 bg-caution-50 px-2 py-0.5 text-xs font-semibold text-caution-700">
            <span aria-hidden>✉</span> Invited
          </span>
        ) : (
          <span className="inline-flex items-center gap-1 rounded-full border border-accent-600 bg-accent-50 px-2 py-0.5 text-xs font-semibold text-accent-700">
            <span aria-hidden>●</span> Active
          </span>
        )}
      </td>
      <td className="whitespace-nowrap px-3 py-2 text-xs text-stone-700">{formatDateTime(u.createdAt)}</td>
      <td className="px-3 py-2 text-right">
        {self ? null : u.active ? (
          <Button size="sm" variant="danger" disabled={update.isPending} onClick={() => setActive(false)} aria-label={`Deactivate ${u.name}`}>
            Deactivate
          </Button>
        ) : (
          <Button size="sm" disabled={update.isPending} onClick={() => setActive(true)} aria-label={`Activate ${u.name}`}>
            Activate
          </Button>
        )}
      </td>
    </tr>
  );
}

export function UsersPage({ meId }: { meId: number }) {
  const users = useUsers();
  const [pending, setPending] = useState<{ u: UserAccount; change: PendingChange } | null>(null);
  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-6 py-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Users and roles</h1>
        <p className="text-sm text-stone-600">A role change or a deactivation ends the person’s open sessions at once.</p>
      </div>
      <InviteForm />
      {users.isPending ? (
        <Spinner label="Loading users" />
      ) : users.isError ? (
        <ErrorNote title="The users could not be loaded">{errorMessage(users.error)}</ErrorNote>
      ) : users.data.length === 0 ? (
        <EmptyState title="No users" />
      ) : (
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Users of this Dubito installation</caption>
            <thead className="border-b border-stone-200 bg-stone-50 text-xs text-stone-700">
              <tr>
                <th scope="col" className="px-3 py-2 font-semibold">Name</th>
                <th scope="col" className="px-3 py-2 font-semibold">E-mail</th>
                <th scope="col" className="px-3 py-2 font-semibold">Role</th>
                <th scope="col" className="px-3 py-2 font-semibold">State</th>
                <th scope="col" className="px-3 py-2 font-semibold">Since</th>
                <th scope="col" className="px-3 py-2 font-semibold"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {users.data.map((u) => (
                <UserRow key={u.id} u={u} meId={meId} onChange={(user, change) => setPending({ u: user, change })} />
              ))}
            </tbody>
          </table>
        </div>
      )}
      {pending ? <ConfirmChangeDialog u={pending.u} change={pending.change} onClose={() => setPending(null)} /> : null}
    </div>
  );
}
