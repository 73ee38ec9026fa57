import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState, type ReactNode } from 'react';
import { Link, useBlocker, useNavigate } from 'react-router-dom';
import type { BudgetView, VersionMeta } from '../../../../shared/api/budgets';
import type { BudgetResult } from '../../../../shared/budget/result';
import type { BudgetDocument, InputQuantity } from '../../../../shared/budget/schema';
import { addPhysicalConstant } from '../../../../shared/constants/add-constant';
import { canEditBudget, can, isEditableStatus, type BudgetStatus } from '../../../../shared/policy/policy';
import { versionStatus } from '../../../../shared/policy/version-status';
import { ApiError, errorMessage } from '../../../app/http';
import type { MonteCarloSlotProps } from '../../../app/slots';
import { Breadcrumb } from '../../../app/ui/breadcrumb';
import { Button, ErrorNote, Field, NumberInput, Spinner, TextInput } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { givenNumber, ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
import { modelValues, presentResult } from '../../../../shared/presentation/result-model';
import { StatusBadge } from '../../../app/ui/status-badge';
import { useToast } from '../../../app/ui/toasts';
import { formatUnit } from '../../../app/ui/units';
import { budgetQuery, useBudget, useBudgetVersion, useSaveBudget } from '../api/editor';
import { clearDraft, loadDraft, storeDraft, type StoredDraft } from '../draft-storage';
import { explainInput, explainResult, type Selection } from '../explain';
import { problemAt, useLiveResult } from '../live';
import { saveState } from '../save-rule';
import { BudgetTable, ContributionsChart } from './BudgetTable';
import { ConstantsSection } from './ConstantsSection';
import { CorrelationsEditor } from './CorrelationsEditor';
import { ExplainPanel } from './ExplainPanel';
import { InputsList, type KeyedInput } from './InputsList';
import { ModelEditor } from './ModelEditor';
import { RecordFields } from './RecordFields';
import { ResultCard } from './ResultCard';
import { ConflictDialog, LeaveDialog, SaveDialog } from './SaveDialogs';

interface Me {
  id: number;
  role: Parameters<typeof can>[0] & string;
  name: string;
}

/** What the editor tells the review slots (filled by the app) about the budget on screen. */
export interface BudgetSlotProps {
  budgetId: number;
  /** The version on screen. */
  version: number;
  currentVersion: number;
  viewingOld: boolean;
  facts: { ownerId: number; status: BudgetStatus; isTemplate: boolean };
  returned: boolean;
  /** Author of the current version (who may not approve it). */
  versionAuthorId: number;
  /** Input symbols of the version on screen. */
  symbols: string[];
  dirty: boolean;
}

/** Optional slots the app fills with other features' components. */
export interface EditorSlots {
  /** Rendered in the symbol cell of each budget-table row (e.g. a comment badge). */
  renderRowAdornment?(symbol: string): ReactNode;
  /** Extra buttons in the header (e.g. submit, approve, return). */
  renderHeaderActions?(props: BudgetSlotProps): ReactNode;
  /** A panel in the side column beside the budget (e.g. review threads). */
  renderSidePanel?(props: BudgetSlotProps): ReactNode;
  /** A notice at the top of the budget (e.g. why it was returned). */
  renderTopNotice?(props: BudgetSlotProps): ReactNode;
  /** The evidence of the version on screen, below the side panel. */
  renderEvidence?(props: BudgetSlotProps): ReactNode;
}

let keySeq = 0;
const newKey = () => `q${++keySeq}`;

function newDocument(): BudgetDocument {
  return {
    format: 'dubito-budget/1',
    title: 'New budget',
    measurand: { symbol: 'y', unit: undefined, description: '' },
    model: 'y = x1 + x2',
    inputs: [
      { symbol: 'x1', description: 'first input quantity', distribution: { kind: 'normal', value: 1, u: 0.01 } },
      { symbol: 'x2', description: 'second input quantity', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.01 } },
    ],
    coverageProbability: 0.95,
    monteCarlo: { trials: 200000, seed: `dubito-${Math.random().toString(36).slice(2, 8)}` },
  };
}

/** Where a cloned budget came from: the template or budget and its version. */
function SourceNote({ source }: { source: NonNullable<BudgetView['source']> }) {
  const origin = useBudget(source.budgetId);
  const kind = origin.data?.isTemplate ? 'template' : 'budget';
  return (
    <p data-testid="budget-source" className="text-xs text-stone-700">
      <span aria-hidden>↳ </span>Cloned from {origin.data ? kind : 'budget'}{' '}
      <Link to={`/budgets/${source.budgetId}`} className="font-medium text-accent-700 underline">
        {origin.data?.title ?? `budget ${source.budgetId}`}
      </Link>
      {source.version ? (
        <>
          , <span className="num">version {source.version}</span>
        </>
      ) : null}
      .
    </p>
  );
}

function Section({ id, title, children, actions, description }: { id: string; title: string; children: ReactNode; actions?: ReactNode; description?: ReactNode }) {
  return (
    <section aria-labelledby={`${id}-h`} className="rounded-lg border border-stone-200 bg-stone-50/60 p-4">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
        <div>
          <h2 id={`${id}-h`} className="text-base font-semibold text-stone-900">
            {title}
          </h2>
          {description ? <p className="text-xs text-stone-600">{description}</p> : null}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}

export function EditorPage({
  me,
  budgetId,
  versionNumber,
  renderMonteCarlo,
  slots,
}: {
  me: Me;
  budgetId?: number;
  versionNumber?: number;
  renderMonteCarlo(props: MonteCarloSlotProps): ReactNode;
  slots?: EditorSlots;
}) {
  const budget = useBudget(budgetId);
  const version = useBudgetVersion(budgetId, versionNumber);
  const loaded: BudgetView | undefined = budget.data;

  if (budgetId !== undefined && (budget.isPending || (versionNumber !== undefined && version.isPending))) {
    return (
      <div className="p-8">
        <Spinner label="Loading the budget" />
      </div>
    );
  }
  if (budget.isError || version.isError) {
    const e = budget.error ?? version.error;
    return (
      <div className="mx-auto max-w-xl p-8">
        <ErrorNote heading title={e instanceof ApiError && e.status === 404 ? 'No such budget or version' : 'The budget could not be loaded'}>{errorMessage(e)}</ErrorNote>
        <Link to="/budgets" className="mt-3 inline-block text-sm text-accent-700 underline">
          Back to the budgets
        </Link>
      </div>
    );
  }
  const viewingOld = versionNumber !== undefined && loaded && versionNumber !== loaded.currentVersion;
  const start = viewingOld && version.data ? { document: version.data.document, result: version.data.result, version: version.data.number } : loaded ? { document: loaded.document, result: loaded.result, version: loaded.currentVersion } : null;
  const shown = viewingOld && version.data ? version.data : (loaded?.version ?? null);
  return <Editor me={me} budgetId={budgetId} view={loaded ?? null} shown={shown} start={start} viewingOld={!!viewingOld} renderMonteCarlo={renderMonteCarlo} slots={slots ?? {}} />;
}

function Editor({
  me,
  budgetId,
  view,
  shown,
  start,
  viewingOld,
  renderMonteCarlo,
  slots,
}: {
  me: Me;
  budgetId?: number;
  view: BudgetView | null;
  /** The version on screen: an older one when viewing history, else the current one. */
  shown: VersionMeta | null;
  start: { document: BudgetDocument; result: BudgetResult; version: number } | null;
  viewingOld: boolean;
  renderMonteCarlo(props: MonteCarloSlotProps): ReactNode;
  slots: EditorSlots;
}) {
  const initialDoc = useMemo(() => start?.document ?? newDocument(), [start?.document]);
  const [doc, setDocState] = useState<BudgetDocument>(initialDoc);
  const [keys, setKeys] = useState<string[]>(() => initialDoc.inputs.map(newKey));
  const [baseline, setBaseline] = useState(() => (start ? JSON.stringify(start.document) : ''));
  const [baseVersion, setBaseVersion] = useState(start?.version ?? 0);
  const [openKeys, setOpenKeys] = useState<Set<string>>(() => new Set(budgetId === undefined ? keys.slice(0, 1) : []));
  const [selection, setSelection] = useState<Selection | null>(null);
  const [saveOpen, setSaveOpen] = useState(false);
  const [saveError, setSaveError] = useState<string | null>(null);
  const [conflict, setConflict] = useState<{ currentVersion: number } | null>(null);
  const [unlocked, setUnlocked] = useState(false);
  const [offered, setOffered] = useState<StoredDraft | null>(() => {
    if (viewingOld) return null;
    const d = loadDraft(budgetId);
    if (!d) return null;
    return JSON.stringify(d.document) !== JSON.stringify(initialDoc) ? d : null;
  });
  const lastNote = useRef('');
  const allowLeave = useRef(false);
  const navigate = useNavigate();
  const toast = useToast();
  const qc = useQueryClient();
  const save = useSaveBudget();

  const live = useLiveResult(doc, start);
  const model = useMemo(() => (live.result && live.valid ? presentResult(live.valid, live.result) : null), [live.result, live.valid]);
  const dirty = baseline === '' ? true : JSON.stringify(doc) !== baseline;
  const saveRule = saveState({ dirty, saving: save.isPending, liveBehind: live.behind, hasLiveResult: !!live.result, liveStopped: live.stopped });
  const isNew = budgetId === undefined;

  const facts = view ? { ownerId: view.ownerId, status: view.status, isTemplate: view.isTemplate } : null;
  const mayEdit = isNew ? can(me.role, 'budget.create') : !!facts && canEditBudget(me, facts);
  const statusAllows = !facts || isEditableStatus(facts.status);
  const approvedLock = facts?.status === 'approved' && !unlocked;
  const readOnly = viewingOld || !mayEdit || !statusAllows || approvedLock;

  const setDoc = useCallback((fn: (d: BudgetDocument) => BudgetDocument) => setDocState((d) => fn(d)), []);
  const items: KeyedInput[] = doc.inputs.map((input, i) => ({ key: keys[i] ?? `missing${i}`, input }));
  const setItems = (next: KeyedInput[]) => {
    setKeys(next.map((i) => i.key));
    setDoc((d) => ({ ...d, inputs: next.map((i) => i.input) }));
  };

  // keep the draft in this browser until it is saved
  useEffect(() => {
    if (readOnly || !dirty || offered) return;
    const t = setTimeout(() => storeDraft(budgetId, { document: doc, baseVersion, savedAt: Date.now() }), 300);
    return () => clearTimeout(t);
  }, [doc, dirty, readOnly, budgetId, baseVersion, offered]);

  useEffect(() => {
    if (!dirty || readOnly) return;
    const h = (e: BeforeUnloadEvent) => {
      e.preventDefault();
    };
    window.addEventListener('beforeunload', h);
    return () => window.removeEventListener('beforeunload', h);
  }, [dirty, readOnly]);

  const blocker = useBlocker(({ currentLocation, nextLocation }) => !readOnly && dirty && !allowLeave.current && currentLocation.pathname !== nextLocation.pathname);

  const doSave = (note: string, base: number, from: BudgetDocument = doc) => {
    lastNote.current = note;
    setSaveError(null);
    const document = JSON.parse(JSON.stringify(from)) as BudgetDocument;
    save.mutate(isNew ? { kind: 'create', document, note } : { kind: 'update', id: budgetId!, baseVersion: base, document, note }, {
      onSuccess: (r) => {
        clearDraft(budgetId);
        setBaseline(JSON.stringify(document));
        setBaseVersion(r.version);
        setSaveOpen(false);
        setConflict(null);
        setUnlocked(false);
        toast(`Saved as version ${r.version}.`);
        if (isNew) {
          allowLeave.current = true;
          navigate(`/budgets/${r.id}`, { replace: true });
        }
      },
      onError: (e) => {
        if (e instanceof ApiError && e.status === 409 && e.code === 'stale_version') {
          const current = Number((e.body?.error as { currentVersion?: number } | undefined)?.currentVersion ?? (e.body as { currentVersion?: number } | undefined)?.currentVersion);
          setSaveOpen(false);
          setConflict({ currentVersion: Number.isFinite(current) ? current : base + 1 });
          return;
        }
        setSaveError(e instanceof ApiError && e.status === 422 ? `The server refused the budget: ${e.message}` : errorMessage(e));
        if (!saveOpen) toast(`Not saved: ${errorMessage(e)}`, 'error');
      },
    });
  };

  useEffect(() => {
    const h = (e: KeyboardEvent) => {
      if ((e.ctrlKey || e.metaKey) && e.key.toLowerCase() === 's') {
        e.preventDefault();
        if (!readOnly && saveRule.enabled) setSaveOpen(true);
      }
    };
    window.addEventListener('keydown', h);
    return () => window.removeEventListener('keydown', h);
  }, [readOnly, saveRule.enabled]);

  const reloadCurrent = async () => {
    if (!budgetId) return;
    const fresh = await qc.fetchQuery({ ...budgetQuery(budgetId), staleTime: 0 });
    clearDraft(budgetId);
    setDocState(fresh.document);
    setKeys(fresh.document.inputs.map(newKey));
    setBaseline(JSON.stringify(fresh.document));
    setBaseVersion(fresh.currentVersion);
    setConflict(null);
    toast(`Loaded version ${fresh.currentVersion}.`, 'info');
  };

  const explanation = useMemo(() => {
    if (!selection || !live.result) return null;
    if (selection.type === 'result') return explainResult(live.result, selection.item, doc.model, (doc.correlations ?? []).some((c) => c.r !== 0));
    const q = doc.inputs.find((x) => x.symbol === selection.symbol);
    return q ? explainInput(live.result, q, live.result.measurand.unit) : null;
  }, [selection, live.result, doc]);

  const modelProblem = live.problems.find((p) => p.field === 'model') ?? null;
  const generalProblems = live.problems.filter((p) => !p.field || p.field === 'monteCarlo' || p.field.startsWith('coverageProbability') || p.field === 'inputs' || p.field === 'title');
  const selectedSymbol = selection?.type === 'input' ? selection.symbol : undefined;

  const addInput = () => {
    const used = new Set(doc.inputs.map((q) => q.symbol));
    let n = doc.inputs.length + 1;
    while (used.has(`x${n}`)) n++;
    const key = newKey();
    const q: InputQuantity = { symbol: `x${n}`, distribution: { kind: 'normal', value: 0, u: 1 } };
    setKeys((k) => [...k, key]);
    setDoc((d) => ({ ...d, inputs: [...d.inputs, q] }));
    setOpenKeys((s) => new Set(s).add(key));
  };

  const slotProps: BudgetSlotProps | null =
    view && budgetId !== undefined
      ? {
          budgetId,
          version: baseVersion,
          currentVersion: view.currentVersion,
          viewingOld,
          facts: { ownerId: view.ownerId, status: view.status, isTemplate: view.isTemplate },
          returned: view.returned,
          versionAuthorId: view.version.authorId,
          symbols: (start?.document ?? doc).inputs.map((q) => q.symbol),
          dirty: dirty && !readOnly,
        }
      : null;

  // the status of the version on screen, not the budget's: an old draft of an approved budget is not approved
  const status = <StatusBadge status={view && shown ? versionStatus(view, shown) : 'draft'} />;

  return (
    <div className="mx-auto grid max-w-[1600px] grid-cols-1 gap-5 px-4 py-4 lg:grid-cols-[minmax(0,1fr)_360px] lg:px-6">
      <div className="flex min-w-0 flex-col gap-4">
        {model ? (
          <div className="sticky top-[52px] z-20 -mx-4 flex flex-wrap items-baseline gap-x-5 gap-y-0.5 border-b border-stone-300 bg-white/95 px-4 py-1.5 text-sm shadow-sm lg:hidden" aria-hidden>
            <span className="num font-semibold">
              {model.measurand.symbol} = {model.reported.estimate.text} {model.measurand.unit.text}
            </span>
            <span className="num">U = {model.reported.expandedUncertainty.text} {model.measurand.unit.text}</span>
            {model.reported.coverageFactor ? <span className="num text-stone-700">k = {model.reported.coverageFactor.text}</span> : null}
          </div>
        ) : null}
        <header className="flex flex-col gap-2">
          <Breadcrumb trail={[{ label: 'Budgets', to: '/budgets' }, { label: isNew ? 'new budget' : `budget ${budgetId}` }]} />
          <div className="flex flex-wrap items-center gap-3">
            {readOnly ? (
              <h1 className="min-w-0 flex-1 px-1 py-0.5 text-xl font-semibold tracking-tight text-stone-900">{doc.title}</h1>
            ) : (
              <>
                {/* the title field is the page's heading; its text is the heading for a reader that lists headings */}
                <h1 className="sr-only">{doc.title || 'New budget'}</h1>
                <label htmlFor="budget-title" className="sr-only">
                  Title
                </label>
                <input
                  id="budget-title"
                  value={doc.title}
                  onChange={(e) => setDoc((d) => ({ ...d, title: e.target.value }))}
                  aria-invalid={!!problemAt(live.problems, 'title')}
                  className="min-w-0 flex-1 rounded-md border border-transparent bg-transparent px-1 py-0.5 text-xl font-semibold tracking-tight text-stone-900 hover:border-stone-300 focus:border-stone-300 aria-[invalid=true]:border-caution-500"
                />
              </>
            )}
            {status}
            {view?.isTemplate ? <span className="rounded-full border border-stone-400 bg-stone-100 px-2 py-0.5 text-xs font-semibold text-stone-700">Template</span> : null}
            {!isNew ? (
              <Link to={`/budgets/${budgetId}/versions`} className="num text-sm text-stone-700 hover:text-accent-700 hover:underline">
                {viewingOld ? `v${baseVersion} of ${view?.currentVersion}` : `v${baseVersion}`}
              </Link>
            ) : null}
            {dirty && !readOnly ? <span className="rounded bg-caution-50 px-2 py-0.5 text-xs font-medium text-caution-700">● unsaved changes</span> : null}
          </div>
          {view && shown ? (
            <p data-testid="budget-people" className="text-xs text-stone-700">
              Owner <span className="font-medium">{view.ownerName}</span> · version {shown.number} saved by <span className="font-medium">{shown.authorName}</span>
              {shown.approverName ? (
                <>
                  {' '}
                  · approved by <span className="font-medium">{shown.approverName}</span>
                </>
              ) : null}
            </p>
          ) : null}
          {view?.source ? <SourceNote source={view.source} /> : null}
          {problemAt(live.problems, 'title') ? <p className="text-xs text-caution-700">Title: {problemAt(live.problems, 'title')}</p> : null}
          <div className="flex flex-wrap gap-2">
            {!readOnly ? (
              <Button variant="primary" onClick={() => setSaveOpen(true)} disabled={!saveRule.enabled} title={saveRule.title}>
                {save.isPending ? 'Saving…' : 'Save version…'}
              </Button>
            ) : null}
            {!readOnly && saveRule.note ? <p className="self-center text-xs text-stone-700">{saveRule.note}</p> : null}
            {approvedLock && mayEdit && !viewingOld ? (
              <Button variant="primary" onClick={() => setUnlocked(true)}>
                Edit as a new draft
              </Button>
            ) : null}
            {!isNew ? (
              <>
                {slotProps && slots.renderHeaderActions ? slots.renderHeaderActions(slotProps) : null}
                <Button onClick={() => navigate(`/budgets/${budgetId}/versions`)}>Versions</Button>
                <Link
                  to={`/budgets/${budgetId}/versions/${baseVersion}/report`}
                  className="inline-flex items-center rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm font-medium text-stone-800 hover:bg-stone-100"
                >
                  Report
                </Link>
                <a href={`/api/budgets/${budgetId}/export?version=${baseVersion}`} download className="inline-flex items-center rounded-md border border-stone-300 bg-white px-3 py-1.5 text-sm font-medium text-stone-800 hover:bg-stone-100">
                  Export file
                </a>
              </>
            ) : null}
          </div>
        </header>

        {slotProps && slots.renderTopNotice ? slots.renderTopNotice(slotProps) : null}
        {offered ? (
          <div role="status" className="flex flex-wrap items-center gap-3 rounded-md border border-caution-500 bg-caution-50 px-3 py-2 text-sm text-caution-700">
            <span className="flex-1">
              An unsaved draft from {formatDateTime(offered.savedAt)} is kept in this browser
              {offered.baseVersion && view && offered.baseVersion < view.currentVersion ? ` (started from version ${offered.baseVersion}; the budget is now at version ${view.currentVersion})` : ''}.
            </span>
            <Button
              size="sm"
              variant="primary"
              onClick={() => {
                setDocState(offered.document);
                setKeys(offered.document.inputs.map(newKey));
                if (offered.baseVersion) setBaseVersion(offered.baseVersion);
                if (view?.status === 'approved') setUnlocked(true);
                setOffered(null);
              }}
            >
              Restore the draft
            </Button>
            <Button
              size="sm"
              onClick={() => {
                clearDraft(budgetId);
                setOffered(null);
              }}
            >
              Discard it
            </Button>
          </div>
        ) : null}
        {viewingOld ? (
          <p className="rounded-md border border-stone-300 bg-stone-100 px-3 py-2 text-sm text-stone-800">
            You are looking at version {baseVersion}, read-only. <Link to={`/budgets/${budgetId}`} className="font-medium text-accent-700 underline">Open the current version</Link>.
          </p>
        ) : facts && facts.status === 'in_review' ? (
          <p className="rounded-md border border-accent-600 bg-accent-50 px-3 py-2 text-sm text-accent-700">This budget is in review: it is read-only until it is approved or returned.</p>
        ) : approvedLock ? (
          <p className="rounded-md border border-accent-700 bg-accent-50 px-3 py-2 text-sm text-accent-700">
            ✓ Version {view?.approvedVersion ?? baseVersion} is approved and cannot change.{mayEdit ? ' Editing starts a new draft version; the approved one stays on record.' : ''}
          </p>
        ) : !mayEdit && !isNew ? (
          <p className="rounded-md border border-stone-300 bg-stone-100 px-3 py-2 text-sm text-stone-800">Read-only: only the owner{me.role === 'trainee' ? ' (and only while it is a draft)' : ''} can change this budget.</p>
        ) : null}

        <Section id="measurand" title="Measurand" description="The quantity the budget determines.">
          {readOnly ? (
            <ReadOnlyList className="md:grid-cols-[8rem_8rem_1fr_9rem]">
              <ReadOnlyField label="Symbol" numeric>{doc.measurand.symbol}</ReadOnlyField>
              <ReadOnlyField label="Unit" numeric>{formatUnit(doc.measurand.unit) || 'dimensionless'}</ReadOnlyField>
              <ReadOnlyField label="Description">{doc.measurand.description}</ReadOnlyField>
              <ReadOnlyField label="Coverage probability p" numeric>{givenNumber(doc.coverageProbability ?? 0.95)}</ReadOnlyField>
            </ReadOnlyList>
          ) : (
          <div className="grid gap-3 md:grid-cols-[8rem_8rem_1fr_9rem]">
            <Field label="Symbol" error={problemAt(live.problems, 'measurand.symbol')}>
              {(p) => <TextInput {...p} className="num" value={doc.measurand.symbol} onChange={(e) => setDoc((d) => ({ ...d, measurand: { ...d.measurand, symbol: e.target.value } }))} />}
            </Field>
            <Field label="Unit" error={problemAt(live.problems, 'measurand.unit')} hint={doc.measurand.unit ? `shown as ${formatUnit(doc.measurand.unit) || 'dimensionless'}` : 'e.g. mm'}>
              {(p) => (
                <TextInput {...p} className="num" value={doc.measurand.unit ?? ''} onChange={(e) => setDoc((d) => ({ ...d, measurand: { ...d.measurand, unit: e.target.value || undefined } }))} />
              )}
            </Field>
            <Field label="Description" error={problemAt(live.problems, 'measurand.description')}>
              {(p) => (
                <TextInput {...p} value={doc.measurand.description ?? ''} onChange={(e) => setDoc((d) => ({ ...d, measurand: { ...d.measurand, description: e.target.value || undefined } }))} />
              )}
            </Field>
            <Field label="Coverage probability p" error={problemAt(live.problems, 'coverageProbability')}>
              {(p) => <NumberInput {...p} value={doc.coverageProbability ?? 0.95} onValue={(v) => setDoc((d) => ({ ...d, coverageProbability: v }))} />}
            </Field>
          </div>
          )}
          <RecordFields doc={doc} readOnly={readOnly} onChange={(patch) => setDoc((d) => ({ ...d, ...patch }))} />
        </Section>

        <Section id="model" title="Model">
          {readOnly ? (
            <ReadOnlyList>
              <ReadOnlyField label="Model equation(s)">
                <pre className="num overflow-x-auto whitespace-pre rounded-md bg-white px-3 py-2 leading-6">{doc.model}</pre>
              </ReadOnlyField>
            </ReadOnlyList>
          ) : (
            <ModelEditor value={doc.model} values={model ? modelValues(model) : undefined} problem={modelProblem} onChange={(model) => setDoc((d) => ({ ...d, model }))} />
          )}
        </Section>

        <Section id="inputs" title={`Input quantities (${doc.inputs.length})`} description={readOnly ? 'Open a row to see how the input was evaluated.' : 'Drag the handle, or focus it and press space and the arrow keys, to change the order.'}>
          <InputsList
            items={items}
            onItems={setItems}
            problems={live.problems}
            openKeys={openKeys}
            onToggle={(k) =>
              setOpenKeys((s) => {
                const n = new Set(s);
                if (n.has(k)) n.delete(k);
                else n.add(k);
                return n;
              })
            }
            readOnly={readOnly}
            canUpload={can(me.role, 'observations.upload')}
            selectedSymbol={selectedSymbol}
            onAdd={addInput}
          />
        </Section>

        <div className="grid gap-4 xl:grid-cols-2">
          <Section id="constants" title="Constants">
            <ConstantsSection
              constants={doc.constants ?? []}
              problems={live.problems}
              readOnly={readOnly}
              onChange={(constants) => setDoc((d) => ({ ...d, constants: constants.length ? constants : undefined }))}
              onPick={(c, asInput) => {
                const next = addPhysicalConstant(doc, c, asInput);
                if (next.inputs.length > doc.inputs.length) setKeys((k) => [...k, newKey()]);
                setDocState(next);
                toast(`Added ${c.symbol} (${c.name}) ${asInput ? 'as an input with its standard uncertainty' : 'as a constant'}. Use it in the model.`, 'info');
              }}
            />
          </Section>
          <Section id="correlations" title="Correlations">
            <CorrelationsEditor
              correlations={doc.correlations ?? []}
              inputs={doc.inputs}
              problems={live.problems}
              readOnly={readOnly}
              onChange={(correlations) => setDoc((d) => ({ ...d, correlations: correlations.length ? correlations : undefined }))}
            />
          </Section>
        </div>

        {generalProblems.length ? (
          <ErrorNote title="The budget cannot be computed yet">
            <ul className="ml-4 list-disc">
              {generalProblems.map((p, i) => (
                <li key={i}>{p.message}</li>
              ))}
            </ul>
          </ErrorNote>
        ) : null}

        <Section id="budget" title="Uncertainty budget" description="Recomputed on every edit. Select a row to see how its numbers were obtained.">
          {model ? (
            <div className="grid gap-3 2xl:grid-cols-[minmax(0,1fr)_300px]">
              <BudgetTable
                model={model}
                selected={selectedSymbol}
                onSelect={(symbol) => setSelection({ type: 'input', symbol })}
                adornment={slotProps ? slots.renderRowAdornment : undefined}
              />
              <ContributionsChart model={model} selected={selectedSymbol} onSelect={(symbol) => setSelection({ type: 'input', symbol })} />
            </div>
          ) : (
            <p className="text-sm text-stone-600">The table appears as soon as the budget has no problems. Each problem is shown beside its field.</p>
          )}
        </Section>

        {renderMonteCarlo({
          document: live.valid,
          gum: live.result?.gum ?? null,
          measurand: { symbol: doc.measurand.symbol, unit: live.result?.measurand.unit ?? doc.measurand.unit },
          stored: start && !dirty ? { result: start.result, label: `stored with version ${start.version}` } : null,
          settings: doc.monteCarlo,
          onSettings: (monteCarlo) => setDoc((d) => ({ ...d, monteCarlo })),
          readOnly,
        })}
      </div>

      <aside className="flex flex-col gap-3 lg:sticky lg:top-16 lg:max-h-[calc(100vh-5rem)] lg:self-start lg:overflow-y-auto" aria-label="Result and explanations">
        <ResultCard
          model={model}
          stale={live.stale}
          move={live.move}
          problemsCount={live.problems.length}
          selected={selection?.type === 'result' ? selection.item : undefined}
          onSelect={(item) => setSelection({ type: 'result', item })}
        />
        <ExplainPanel explanation={explanation} onClose={() => setSelection(null)} />
        {slotProps && slots.renderSidePanel ? slots.renderSidePanel(slotProps) : null}
        {slotProps && slots.renderEvidence ? slots.renderEvidence(slotProps) : null}
      </aside>

      <SaveDialog open={saveOpen} onClose={() => setSaveOpen(false)} onSave={(note) => doSave(note, baseVersion)} saving={save.isPending} isNew={isNew} error={saveError} />
      {conflict && budgetId ? (
        <ConflictDialog
          budgetId={budgetId}
          baseVersion={baseVersion}
          currentVersion={conflict.currentVersion}
          mine={doc}
          saving={save.isPending}
          onClose={() => setConflict(null)}
          onReload={reloadCurrent}
          onSaveMerged={(merged) => {
            setDocState(merged);
            setKeys(merged.inputs.map(newKey));
            setBaseVersion(conflict.currentVersion);
            doSave(lastNote.current || `merged with version ${conflict.currentVersion}`, conflict.currentVersion, merged);
          }}
        />
      ) : null}
      <LeaveDialog open={blocker.state === 'blocked'} onStay={() => blocker.reset?.()} onLeave={() => blocker.proceed?.()} />
    </div>
  );
}
