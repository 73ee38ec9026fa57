import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { VersionMeta } from '../../../../shared/api/budgets';
import type { Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { Breadcrumb } from '../../../app/ui/breadcrumb';
import { Button, EmptyState, ErrorNote, Field, Select, Spinner } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { StatusBadge } from '../../../budget/components/StatusBadge';
import { versionStatus } from '../../../../shared/policy/version-status';
import { useBudgetHeader, useVersions } from '../api/versions';

/** Pick any two versions and open their side-by-side comparison. */
function CompareForm({ budgetId, versions }: { budgetId: number; versions: VersionMeta[] }) {
  const navigate = useNavigate();
  const [from, setFrom] = useState(versions[0].number);
  const [to, setTo] = useState(versions[versions.length - 1].number);
  const same = from === to;
  const pick = (label: string, value: number, onPick: (n: number) => void, error: string | null = null) => (
    <Field label={label} className="w-40" error={error}>
      {(p) => (
        <Select {...p} value={value} onChange={(e) => onPick(Number(e.target.value))}>
          {versions.map((v) => (
            <option key={v.number} value={v.number}>
              v{v.number}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
  return (
    <form
      aria-label="Compare two versions"
      className="flex flex-wrap items-end gap-3 rounded-lg border border-stone-200 bg-white p-3"
      onSubmit={(e) => {
        e.preventDefault();
        if (!same) navigate(`/budgets/${budgetId}/compare?from=${from}&to=${to}`);
      }}
    >
      {pick('Compare version', from, setFrom)}
      {pick('with version', to, setTo, same ? 'Pick two different versions.' : null)}
      <Button type="submit" variant="primary" disabled={same}>
        Compare
      </Button>
    </form>
  );
}

export function VersionsPage({ budgetId }: { me: { id: number; role: Role }; budgetId: number }) {
  const versions = useVersions(budgetId);
  const budget = useBudgetHeader(budgetId);
  const b = budget.data;
  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-4 px-6 py-6">
      <Breadcrumb
        trail={[
          { label: 'Budgets', to: '/budgets' },
          { label: b?.title ?? `budget ${budgetId}`, to: `/budgets/${budgetId}` },
          { label: 'versions' },
        ]}
      />
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold tracking-tight">Version history</h1>
        {b ? <StatusBadge status={b.status} returned={b.returned} prefix="budget now:" /> : null}
      </div>
      <p className="text-sm text-stone-600">Every save creates a version; versions never change. Each row shows that version's own status: an older draft that was never approved is superseded.</p>
      {versions.isPending ? (
        <Spinner label="Loading versions" />
      ) : versions.isError ? (
        <ErrorNote title="The versions could not be loaded">{errorMessage(versions.error)}</ErrorNote>
      ) : versions.data.length === 0 ? (
        <EmptyState title="No versions" />
      ) : (
        <>
        {versions.data.length > 1 ? <CompareForm budgetId={budgetId} versions={versions.data} /> : null}
        <div className="overflow-x-auto rounded-lg border border-stone-200 bg-white">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Versions of the budget, newest first</caption>
            <thead className="border-b border-stone-200 bg-stone-50 text-xs text-stone-700">
              <tr>
                <th scope="col" className="px-3 py-2 text-right font-semibold">Version</th>
                <th scope="col" className="px-3 py-2 font-semibold">Saved</th>
                <th scope="col" className="px-3 py-2 font-semibold">Author</th>
                <th scope="col" className="px-3 py-2 font-semibold">Change note</th>
                <th scope="col" className="px-3 py-2 font-semibold">Status</th>
                <th scope="col" className="px-3 py-2 font-semibold">Seed</th>
                <th scope="col" className="px-3 py-2 font-semibold"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {[...versions.data].reverse().map((v) => {
                const current = b?.currentVersion === v.number;
                return (
                  <tr key={v.number} className={`border-b border-stone-100 last:border-0 ${current ? 'bg-stone-50' : ''}`}>
                    <td className="num px-3 py-2 text-right font-semibold">v{v.number}</td>
                    <td className="whitespace-nowrap px-3 py-2 text-stone-700">{formatDateTime(v.createdAt)}</td>
                    <td className="px-3 py-2">{v.authorName}</td>
                    <td className="px-3 py-2 text-stone-800">{v.note || <span className="text-stone-500">no note</span>}</td>
                    <td className="px-3 py-2">
                      <div className="flex flex-wrap gap-1">
                        {b ? <StatusBadge status={versionStatus(b, v)} /> : null}
                        {v.approvedAt ? <span className="text-xs text-stone-600">{formatDateTime(v.approvedAt)}</span> : null}
                        {current ? <span className="rounded-full border border-stone-300 px-2 py-0.5 text-xs text-stone-700">current</span> : null}
                      </div>
                    </td>
                    <td className="num px-3 py-2 text-xs text-stone-700">{v.seed}</td>
                    <td className="whitespace-nowrap px-3 py-2 text-right">
                      <Link to={current ? `/budgets/${budgetId}` : `/budgets/${budgetId}/versions/${v.number}`} className="text-accent-700 hover:underline">
                        Open
                      </Link>
                      <span className="mx-1 text-stone-400">·</span>
                      <a href={`/api/budgets/${budgetId}/export?version=${v.number}`} download className="text-accent-700 hover:underline">
                        Export
                      </a>
                      <span className="mx-1 text-stone-400">·</span>
                      <Link to={`/budgets/${budgetId}/versions/${v.number}/report`} className="text-accent-700 hover:underline" aria-label={`Report of version ${v.number}`}>
                        Report
                      </Link>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        </>
      )}
    </div>
  );
}
