import { zodResolver } from '@hookform/resolvers/zod';
import type { ColumnDef } from '@tanstack/react-table';
import { useMemo, useState } from 'react';
import { useForm, type FieldValues, type Path, type UseFormSetError } from 'react-hook-form';
import type { UserAccount } from '../../../../shared/api/accounts';
import { inviteBody, patchUserBody, USER_SORTS, type InviteInput, type UserPatch, type UserSort } from '../../../../shared/api/user-admin';
import { ROLES, type Role } from '../../../../shared/policy/policy';
import { ApiError, errorMessage } from '../../../app/http';
import { SORT_ORDERS, useListParams, useSearchText } from '../../../app/search-params';
import { Button, EmptyState, ErrorNote, Field, FormDialog, Select, Spinner, SubmitButton, TextArea, TextInput } from '../../../app/ui/controls';
import { ClearFilters, DataTable, SearchField, useKeepPageInRange } from '../../../app/ui/data-table';
import { formatDateTime } from '../../../app/ui/numbers';
import { useToast } from '../../../app/ui/toasts';
import { useInvite, useUpdateUser, useUsers } from '../api/admin';

const ROLE_WORD: Record<Role, string> = { admin: 'Administrator', metrologist: 'Metrologist', reviewer: 'Reviewer', auditor: 'Auditor', trainee: 'Trainee' };
const PAGE_SIZE = 25;

/**
 * Puts the server's refusal beside the field it names (an address already taken is the e-mail's);
 * returns false when it names none of the form's fields.
 */
function showServerError<T extends FieldValues>(err: unknown, fields: readonly Path<T>[], setError: UseFormSetError<T>): boolean {
  if (!(err instanceof ApiError)) return false;
  const field = (err.code === 'email_taken' ? 'email' : err.field) as Path<T> | undefined;
  if (!field || !fields.includes(field)) return false;
  setError(field, { message: err.message.startsWith(`${field}: `) ? err.message.slice(field.length + 2) : err.message });
  return true;
}

/** Invites a colleague; the fields are checked by the schema the server validates the invitation with. */
function InviteForm() {
  const invite = useInvite();
  const toast = useToast();
  const form = useForm<InviteInput, unknown, InviteInput>({ resolver: zodResolver(inviteBody), defaultValues: { email: '', name: '', role: 'metrologist' } });
  const { errors } = form.formState;
  return (
    <form
      aria-labelledby="invite-h"
      noValidate
      className="flex flex-col gap-3 rounded-lg border border-stone-200 bg-white p-4"
      onSubmit={form.handleSubmit((body) =>
        invite.mutateAsync(body).then(
          (r) => {
            toast(`Invitation sent to ${r.user.email}; the link is valid until ${formatDateTime(r.expiresAt)}.`);
            form.reset();
          },
          (err: unknown) => {
            if (!showServerError(err, ['email', 'name', 'role'], form.setError)) toast(`Not invited: ${errorMessage(err)}`, 'error');
          },
        ),
      )}
    >
      <div>
        <h2 id="invite-h" className="text-base font-semibold">
          Invite a colleague
        </h2>
        <p className="text-xs text-stone-600">They receive an e-mail with a link to set their password.</p>
      </div>
      <div className="grid gap-3 sm:grid-cols-[1fr_1fr_12rem_auto]">
        <Field label="Name" error={errors.name?.message}>
          {(p) => <TextInput {...p} {...form.register('name')} autoComplete="off" />}
        </Field>
        <Field label="E-mail address" error={errors.email?.message}>
          {(p) => <TextInput {...p} {...form.register('email')} type="email" autoComplete="off" />}
        </Field>
        <Field label="Role" error={errors.role?.message}>
          {(p) => (
            <Select {...p} {...form.register('role')}>
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

/** Confirms a role change or a (de)activation and asks why, checked by the schema the server validates the change with; the reason goes into the audit trail. */
function ConfirmChangeDialog({ u, change, onClose }: { u: UserAccount; change: PendingChange; onClose(): void }) {
  const update = useUpdateUser();
  const toast = useToast();
  const form = useForm<UserPatch, unknown, UserPatch>({ resolver: zodResolver(patchUserBody), defaultValues: { ...change.patch, reason: '' } });
  const [error, setError] = useState<string | null>(null);
  return (
    <FormDialog
      onClose={onClose}
      title={change.title}
      submitLabel={change.submitLabel}
      pendingLabel="Applying…"
      pending={update.isPending}
      variant={change.danger ? 'danger' : 'primary'}
      onSubmit={form.handleSubmit((patch) => {
        setError(null);
        return update.mutateAsync({ id: u.id, ...patch }).then(
          () => {
            toast(change.done);
            onClose();
          },
          (e: unknown) => {
            if (!showServerError(e, ['reason'], form.setError)) setError(errorMessage(e));
          },
        );
      })}
    >
      <p className="text-sm text-stone-700">{change.consequence}</p>
      <Field label="Reason (kept in the audit trail)" error={form.formState.errors.reason?.message ?? error}>
        {(p) => <TextArea {...p} {...form.register('reason')} rows={3} maxLength={1000} autoFocus />}
      </Field>
    </FormDialog>
  );
}

function roleChange(u: UserAccount, role: Role): PendingChange {
  return {
    patch: { role },
    title: `Change the role of ${u.name}`,
    consequence: `${u.name} goes from ${ROLE_WORD[u.role].toLowerCase()} to ${ROLE_WORD[role].toLowerCase()}. Their open sessions end at once, and what they may do changes from their next sign-in.`,
    submitLabel: `Make ${ROLE_WORD[role].toLowerCase()}`,
    done: `${u.name} is now ${ROLE_WORD[role].toLowerCase()}. Their sessions were ended.`,
    danger: false,
  };
}

function accessChange(u: UserAccount, active: boolean): PendingChange {
  return active
    ? {
        patch: { active },
        title: `Activate ${u.name}`,
        consequence: `${u.name} can sign in again with their role of ${ROLE_WORD[u.role].toLowerCase()}.`,
        submitLabel: 'Activate',
        done: `${u.name} can sign in again.`,
        danger: false,
      }
    : {
        patch: { active },
        title: `Deactivate ${u.name}`,
        consequence: `${u.name} is signed out at once and can no longer sign in. Their budgets, comments and signatures stay on record.`,
        submitLabel: 'Deactivate',
        done: `${u.name} is deactivated and signed out.`,
        danger: true,
      };
}

function AccountState({ u }: { u: UserAccount }) {
  if (!u.active)
    return (
      <span className="inline-flex items-center gap-1 rounded-full border border-stone-400 bg-white px-2 py-0.5 text-xs font-semibold text-stone-700">
        <span aria-hidden>⊘</span> Deactivated
      </span>
    );
  if (!u.hasPassword)
    return (
      <span className="inline-flex items-center gap-1 rounded-full border border-caution-500 bg-caution-50 px-2 py-0.5 text-xs font-semibold text-caution-700">
        <span aria-hidden>✉</span> Invited
      </span>
    );
  return (
    <span className="inline-flex items-center gap-1 rounded-full border border-accent-600 bg-accent-50 px-2 py-0.5 text-xs font-semibold text-accent-700">
      <span aria-hidden>●</span> Active
    </span>
  );
}

function userColumns(meId: number, ask: (u: UserAccount, change: PendingChange) => void): ColumnDef<UserAccount, unknown>[] {
  return [
    {
      id: 'name',
      accessorFn: (u) => u.name,
      header: 'Name',
      enableHiding: false,
      meta: { className: 'font-medium' },
      cell: ({ row: { original: u } }) => (
        <>
          {u.name}
          {u.id === meId ? <span className="ml-1 text-xs font-normal text-stone-600">(you)</span> : null}
        </>
      ),
    },
    { id: 'email', accessorFn: (u) => u.email, header: 'E-mail', meta: { className: 'text-stone-700' }, cell: ({ row: { original: u } }) => u.email },
    {
      id: 'role',
      accessorFn: (u) => u.role,
      header: 'Role',
      cell: ({ row: { original: u } }) => {
        const self = u.id === meId;
        return (
          <>
            <label className="sr-only" htmlFor={`role-${u.id}`}>
              Role of {u.name}
            </label>
            <Select
              id={`role-${u.id}`}
              value={u.role}
              disabled={self}
              title={self ? 'You cannot change your own role' : undefined}
              onChange={(e) => ask(u, roleChange(u, e.target.value as Role))}
              className="w-40"
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_WORD[r]}
                </option>
              ))}
            </Select>
          </>
        );
      },
    },
    { id: 'state', header: 'State', enableSorting: false, cell: ({ row: { original: u } }) => <AccountState u={u} /> },
    {
      id: 'created',
      accessorFn: (u) => u.createdAt,
      header: 'Since',
      meta: { className: 'whitespace-nowrap text-xs text-stone-700' },
      cell: ({ row: { original: u } }) => formatDateTime(u.createdAt),
    },
    {
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      enableSorting: false,
      enableHiding: false,
      meta: { className: 'text-right', label: 'Actions' },
      cell: ({ row: { original: u } }) =>
        u.id === meId ? null : u.active ? (
          <Button size="sm" variant="danger" onClick={() => ask(u, accessChange(u, false))} aria-label={`Deactivate ${u.name}`}>
            Deactivate
          </Button>
        ) : (
          <Button size="sm" onClick={() => ask(u, accessChange(u, true))} aria-label={`Activate ${u.name}`}>
            Activate
          </Button>
        ),
    },
  ];
}

export function UsersPage({ meId }: { meId: number }) {
  const list = useListParams();
  const { set, clear, filtered, page } = list;
  const search = useSearchText(list);
  const role = list.oneOf<Role | ''>('role', ROLES, '') || undefined;
  const sort = list.oneOf<UserSort>('sort', USER_SORTS, 'created');
  const order = list.oneOf('dir', SORT_ORDERS, 'asc');
  const users = useUsers({ q: search.query, role }, { limit: PAGE_SIZE, offset: (page - 1) * PAGE_SIZE, sort, order });
  useKeepPageInRange(page, users.data?.total, PAGE_SIZE, (n) => set({ page: String(n) }));
  const [pending, setPending] = useState<{ u: UserAccount; change: PendingChange } | null>(null);
  const columns = useMemo(() => userColumns(meId, (u, change) => setPending({ u, change })), [meId]);
  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-6 py-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Users and roles</h1>
        <p className="text-sm text-stone-600">A role change or a deactivation ends the person’s open sessions at once.</p>
      </div>
      <InviteForm />
      <form
        role="search"
        aria-label="Filter the users"
        className="grid grid-cols-1 gap-3 rounded-lg border border-stone-200 bg-white p-3 sm:grid-cols-[2fr_1fr_auto]"
        onSubmit={(e) => e.preventDefault()}
      >
        <SearchField label="Search names and addresses" search={search} />
        <Field label="Role">
          {(p) => (
            <Select {...p} value={role ?? ''} onChange={(e) => set({ role: e.target.value || undefined })}>
              <option value="">Every role</option>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_WORD[r]}
                </option>
              ))}
            </Select>
          )}
        </Field>
        <ClearFilters disabled={!filtered} onClear={clear} />
      </form>
      {users.isPending ? (
        <Spinner label="Loading users" />
      ) : users.isError ? (
        <ErrorNote title="The users could not be loaded">{errorMessage(users.error)}</ErrorNote>
      ) : (
        <DataTable
          id="users"
          caption="Users of this Dubito installation"
          data={users.data.rows}
          columns={columns}
          getRowId={(u) => String(u.id)}
          busy={users.isPlaceholderData}
          sorting={{ sort, order, onSort: (key, o) => set({ sort: key, dir: o }) }}
          paging={{ page, pageSize: PAGE_SIZE, total: users.data.total, onPage: (n) => set({ page: String(n) }) }}
          rowProps={(u) => ({ 'data-testid': `user-${u.email}`, className: `border-b border-stone-100 last:border-0 ${u.active ? '' : 'bg-stone-50 text-stone-600'}` })}
          empty={<EmptyState title={filtered ? 'No user matches these filters' : 'No users'} />}
        />
      )}
      {pending ? <ConfirmChangeDialog u={pending.u} change={pending.change} onClose={() => setPending(null)} /> : null}
    </div>
  );
}
