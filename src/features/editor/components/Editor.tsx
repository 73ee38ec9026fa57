import { useMemo, useState, type ReactNode } from 'react';
import type { BudgetView, VersionMeta } from '../../../../shared/api/budgets';
import { can } from '../../../../shared/policy/policy';
import { presentResult } from '../../../../shared/presentation/result-model';
import type { MonteCarloSlotProps } from '../../../app/slots';
import { AfterFirstRender } from '../../../app/ui/after-first-render';
import { useToast } from '../../../app/ui/toasts';
import { editorAccess, type Editor as EditorUser } from '../access';
import { generalProblems, modelProblem } from '../draft';
import { explainInput, explainResult, type Selection } from '../explain';
import { problemAt, useLiveResult } from '../live';
import type { BudgetSlotProps, EditorSlots } from '../slots';
import { useDraft, type StartingVersion } from '../use-draft';
import { useLeaveGuard } from '../use-leave-guard';
import { useSaveFlow } from '../use-save-flow';
import { BudgetSection, ResultStrip } from './BudgetSection';
import { ConstantsSection } from './ConstantsSection';
import { CorrelationsEditor } from './CorrelationsEditor';
import { EditorHeader } from './EditorHeader';
import { DraftOffer, ReadOnlyNotice } from './EditorNotices';
import { ExplainPanel } from './ExplainPanel';
import { InputsSection } from './InputsSection';
import { MeasurandSection } from './MeasurandSection';
import { ModelSection } from './ModelSection';
import { ResultCard } from './ResultCard';
import { ConflictDialog, LeaveDialog, SaveDialog } from './SaveDialogs';
import { Section } from './Section';

/** The editor of one budget (or a new one), laid out: the sections on the left, the result and explanations on the right. */
export function Editor({
  me,
  budgetId,
  view,
  shown,
  start,
  viewingOld,
  renderMonteCarlo,
  slots,
}: {
  me: EditorUser;
  budgetId?: number;
  view: BudgetView | null;
  /** The version on screen: an older one when viewing history, else the current one. */
  shown: VersionMeta | null;
  start: StartingVersion | null;
  viewingOld: boolean;
  renderMonteCarlo(props: MonteCarloSlotProps): ReactNode;
  slots: EditorSlots;
}) {
  const isNew = budgetId === undefined;
  const facts = view ? { ownerId: view.ownerId, status: view.status, isTemplate: view.isTemplate } : null;
  const [unlocked, setUnlocked] = useState(false);
  const access = editorAccess({ me, isNew, facts, viewingOld, unlocked });
  const { readOnly } = access;
  const draft = useDraft({ budgetId, start, viewingOld, keep: !readOnly });
  const { doc, setDoc, dirty } = draft;
  const [selection, setSelection] = useState<Selection | null>(null);
  const toast = useToast();

  const live = useLiveResult(doc, start);
  const model = useMemo(() => (live.result && live.valid ? presentResult(live.valid, live.result) : null), [live.result, live.valid]);
  const guard = useLeaveGuard(dirty && !readOnly);
  const save = useSaveFlow({
    budgetId,
    draft,
    readOnly,
    live: { liveBehind: live.behind, hasLiveResult: !!live.result, liveStopped: live.stopped },
    onSaved: () => setUnlocked(false),
    allowLeave: guard.allowLeave,
  });

  const explanation = useMemo(() => {
    if (!selection || !live.result) return null;
    if (selection.type === 'result')
      return explainResult(
        live.result,
        selection.item,
        doc.model,
        (doc.correlations ?? []).some((c) => c.r !== 0),
      );
    const q = doc.inputs.find((x) => x.symbol === selection.symbol);
    return q ? explainInput(live.result, q, live.result.measurand.unit) : null;
  }, [selection, live.result, doc]);
  const selectedSymbol = selection?.type === 'input' ? selection.symbol : undefined;
  const selectInput = (symbol: string) => setSelection({ type: 'input', symbol });

  const slotProps: BudgetSlotProps | null =
    view && budgetId !== undefined
      ? {
          budgetId,
          version: draft.baseVersion,
          currentVersion: view.currentVersion,
          viewingOld,
          facts: { ownerId: view.ownerId, status: view.status, isTemplate: view.isTemplate },
          returned: view.returned,
          versionAuthorId: view.version.authorId,
          symbols: (start?.document ?? doc).inputs.map((q) => q.symbol),
          dirty: dirty && !readOnly,
        }
      : null;

  return (
    <div className="mx-auto grid max-w-[1600px] grid-cols-1 gap-5 px-4 py-4 lg:grid-cols-[minmax(0,1fr)_360px] lg:px-6">
      <div className="flex min-w-0 flex-col gap-4">
        {model ? <ResultStrip model={model} /> : null}
        <EditorHeader
          budgetId={budgetId}
          view={view}
          shown={shown}
          title={doc.title}
          onTitle={(title) => setDoc((d) => ({ ...d, title }))}
          titleProblem={problemAt(live.problems, 'title')}
          readOnly={readOnly}
          viewingOld={viewingOld}
          baseVersion={draft.baseVersion}
          dirty={dirty}
          save={{ rule: save.rule, saving: save.saving, open: save.openDialog }}
          unlock={access.approvedLock && access.mayEdit && !viewingOld ? () => setUnlocked(true) : null}
          headerActions={slotProps && slots.renderHeaderActions ? slots.renderHeaderActions(slotProps) : null}
        />

        {slotProps && slots.renderTopNotice ? slots.renderTopNotice(slotProps) : null}
        {draft.offered ? (
          <DraftOffer
            draft={draft.offered}
            currentVersion={view?.currentVersion}
            onRestore={() => {
              draft.restoreOffered();
              if (view?.status === 'approved') setUnlocked(true);
            }}
            onDiscard={draft.discardOffered}
          />
        ) : null}
        <ReadOnlyNotice reason={access.reason} budgetId={budgetId} version={draft.baseVersion} approvedVersion={view?.approvedVersion} mayEdit={access.mayEdit} trainee={me.role === 'trainee'} />

        <MeasurandSection doc={doc} setDoc={setDoc} problems={live.problems} readOnly={readOnly} />
        <ModelSection model={doc.model} onModel={(m) => setDoc((d) => ({ ...d, model: m }))} result={model} problem={modelProblem(live.problems)} readOnly={readOnly} />
        <InputsSection draft={draft} problems={live.problems} readOnly={readOnly} canUpload={can(me.role, 'observations.upload')} selectedSymbol={selectedSymbol} />

        <div className="grid gap-4 xl:grid-cols-2">
          <Section id="constants" title="Constants">
            <ConstantsSection
              constants={doc.constants ?? []}
              problems={live.problems}
              readOnly={readOnly}
              onChange={(constants) => setDoc((d) => ({ ...d, constants: constants.length ? constants : undefined }))}
              onPick={(c, asInput) => {
                draft.addConstant(c, asInput);
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

        <BudgetSection model={model} generalProblems={generalProblems(live.problems)} selected={selectedSymbol} onSelect={selectInput} adornment={slotProps ? slots.renderRowAdornment : undefined} />

        {/* the last section, far below the first screen: rendered just after the page's first render */}
        <AfterFirstRender>
          {renderMonteCarlo({
            document: live.valid,
            measurand: { symbol: doc.measurand.symbol, unit: live.result?.measurand.unit ?? doc.measurand.unit },
            stored: start && !dirty ? { result: start.result, label: `stored with version ${start.version}` } : null,
            settings: doc.monteCarlo,
            onSettings: (monteCarlo) => setDoc((d) => ({ ...d, monteCarlo })),
            readOnly,
          })}
        </AfterFirstRender>
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

      <SaveDialog open={save.dialogOpen} onClose={save.closeDialog} onSave={save.save} saving={save.saving} isNew={isNew} error={save.error} />
      {save.conflict && budgetId !== undefined ? (
        <ConflictDialog
          budgetId={budgetId}
          baseVersion={draft.baseVersion}
          currentVersion={save.conflict.currentVersion}
          mine={doc}
          saving={save.saving}
          onClose={save.closeConflict}
          onReload={save.reloadCurrent}
          onSaveMerged={save.saveMerged}
        />
      ) : null}
      <LeaveDialog open={guard.asking} onStay={guard.stay} onLeave={guard.leave} />
    </div>
  );
}
