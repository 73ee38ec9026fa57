import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import type { BudgetListItem } from '../../../../shared/api/budgets';
import { can, type Role } from '../../../../shared/policy/policy';
import { errorMessage } from '../../../app/http';
import { Button, EmptyState, ErrorNote, Field, FormDialog, Spinner, TextInput } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { Sym, Unit } from '../../../app/ui/quantity';
import { useToast } from '../../../app/ui/toasts';
import { useCloneBudget, useSetTemplate, useTemplateDetails, useTemplates } from '../api/templates';

function UseDialog({ template, onClose }: { template: BudgetListItem; onClose(): void }) {
  const [title, setTitle] = useState(template.title.replace(/^Template:\s*/i, ''));
  const clone = useCloneBudget();
  const toast = useToast();
  const navigate = useNavigate();
  const [touched, setTouched] = useState(false);
  const error = touched && !title.trim() ? 'Give the new draft a title.' : null;
  return (
    <FormDialog
      onClose={onClose}
      title="Start a draft from this template"
      onSubmit={() => {
        setTouched(true);
        if (!title.trim()) return;
        clone.mutate(
          { id: template.id, title: title.trim() },
          {
            onSuccess: (r) => {
              toast(`Draft created from “${template.title}”.`);
              navigate(`/budgets/${r.id}`);
            },
            onError: (err) => toast(`No draft was created: ${errorMessage(err)}`, 'error'),
          },
        );
      }}
      submitLabel="Create draft"
      pendingLabel="Creating…"
      pending={clone.isPending}
    >
      <p className="text-sm text-stone-700">The draft is yours: a copy of version {template.currentVersion} of the template that records where it came from. The template itself does not change.</p>
      <Field label="Title of the new draft" error={error}>
        {(p) => <TextInput {...p} value={title} onChange={(e) => setTitle(e.target.value)} autoFocus maxLength={300} />}
      </Field>
    </FormDialog>
  );
}

export function TemplatesPage({ role }: { role: Role }) {
  const templates = useTemplates();
  const list = templates.data ?? [];
  const details = useTemplateDetails(list.map((t) => t.id));
  const [using, setUsing] = useState<BudgetListItem | null>(null);
  const mayClone = can(role, 'budget.clone');
  const navigate = useNavigate();
  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4 px-6 py-6">
      <div>
        <h1 className="text-2xl font-semibold tracking-tight">Templates</h1>
        <p className="text-sm text-stone-600">Budgets the laboratory keeps as starting points. Using one creates a draft of your own that records its source.</p>
      </div>
      {templates.isPending ? (
        <Spinner label="Loading templates" />
      ) : templates.isError ? (
        <ErrorNote title="The templates could not be loaded">{errorMessage(templates.error)}</ErrorNote>
      ) : list.length === 0 ? (
        <EmptyState title="No templates yet">{can(role, 'template.manage') ? 'Open a budget and choose “Mark as template”.' : 'An administrator marks budgets as templates.'}</EmptyState>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3" aria-label="Template gallery">
          {list.map((t, i) => {
            const d = details[i]?.data?.document;
            return (
              <li key={t.id} data-testid={`template-${t.id}`} className="flex flex-col gap-3 rounded-lg border border-stone-200 bg-white p-4">
                <div>
                  <h2 className="text-base font-semibold text-stone-900">{t.title}</h2>
                  <p className="text-xs text-stone-600">
                    v{t.currentVersion} · {t.ownerName} · {formatDateTime(t.updatedAt)}
                  </p>
                </div>
                {d ? (
                  <>
                    <dl className="grid grid-cols-[6.5rem_1fr] gap-x-2 gap-y-1 text-sm">
                      <dt className="text-stone-600">Measurand</dt>
                      <dd>
                        <Sym s={d.measurand.symbol} className="font-semibold" /> <Unit u={d.measurand.unit} className="text-stone-700" />
                        {d.measurand.description ? <span className="block text-xs text-stone-700">{d.measurand.description}</span> : null}
                      </dd>
                      <dt className="text-stone-600">Inputs</dt>
                      <dd className="num">{d.inputs.length}</dd>
                    </dl>
                    <figure>
                      <figcaption className="sr-only">Model</figcaption>
                      <pre className="num max-h-28 overflow-auto whitespace-pre-wrap break-all rounded-md border border-stone-200 bg-stone-50 px-2 py-1.5 text-xs text-stone-800">{d.model}</pre>
                    </figure>
                  </>
                ) : details[i]?.isError ? (
                  <p className="text-xs text-caution-700">The template's content could not be loaded.</p>
                ) : (
                  <Spinner label="Loading" />
                )}
                <div className="mt-auto flex flex-wrap gap-2">
                  {mayClone ? (
                    <Button variant="primary" onClick={() => setUsing(t)} aria-label={`Use this template: ${t.title}`}>
                      Use this template
                    </Button>
                  ) : null}
                  <Button onClick={() => navigate(`/budgets/${t.id}`)}>Open</Button>
                </div>
              </li>
            );
          })}
        </ul>
      )}
      {using ? <UseDialog template={using} onClose={() => setUsing(null)} /> : null}
    </div>
  );
}

/** Admins mark a budget as a template, or take it out of the gallery. */
export function TemplateToggle({ budgetId, isTemplate, role }: { budgetId: number; isTemplate: boolean; role: Role }) {
  const set = useSetTemplate();
  const toast = useToast();
  if (!can(role, 'template.manage')) return null;
  return (
    <Button
      disabled={set.isPending}
      aria-pressed={isTemplate}
      onClick={() =>
        set.mutate(
          { id: budgetId, isTemplate: !isTemplate },
          {
            onSuccess: () => toast(isTemplate ? 'Removed from the template gallery.' : 'Marked as a template: it is now in the gallery.'),
            onError: (e) => toast(errorMessage(e), 'error'),
          },
        )
      }
    >
      {isTemplate ? 'Remove from templates' : 'Mark as template'}
    </Button>
  );
}
