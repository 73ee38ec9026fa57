import { fileSize } from '../../../../shared/presentation/figures';
import { useRef, useState } from 'react';
import type { AddedAttachment, Attachment } from '../../../../shared/api/uploads';
import { errorMessage } from '../../../app/http';
import { Button, ErrorNote, Field, Select, Spinner } from '../../../app/ui/controls';
import { formatDateTime } from '../../../app/ui/numbers';
import { Sym } from '../../../app/ui/quantity';
import { useToast } from '../../../app/ui/toasts';
import { useAttachEvidence, useEvidence } from '../api/evidence';

/** What the editor tells the evidence panel about the version on screen. */
export interface EvidenceContext {
  budgetId: number;
  /** The version on screen; its evidence is what was added to it and to earlier versions. */
  version: number;
  /** Input symbols of that version: evidence may support one of them. */
  symbols: string[];
  /** The caller may attach now (owner, not in review, current version on screen). */
  mayAttach: boolean;
  /** The current version is approved: a file starts a new draft version. */
  approved: boolean;
}

const formatSize = (bytes: number) => fileSize(bytes).text;

function EvidenceItem({ a, budgetId }: { a: Attachment; budgetId: number }) {
  return (
    <li data-testid={`evidence-${a.id}`} className="rounded-md border border-stone-200 px-2.5 py-1.5 text-sm">
      <div className="flex flex-wrap items-baseline justify-between gap-x-2">
        <a href={`/api/budgets/${budgetId}/attachments/${a.id}`} target="_blank" rel="noopener" className="break-all font-medium text-accent-700 underline">
          {a.fileName}
        </a>
        <span className="num text-xs text-stone-700">{formatSize(a.size)}</span>
      </div>
      <p className="text-xs text-stone-700">
        {a.symbol ? (
          <>
            for <Sym s={a.symbol} />
          </>
        ) : (
          'for the whole budget'
        )}{' '}
        · added to v{a.versionNumber} by {a.uploaderName}, {formatDateTime(a.createdAt)}
      </p>
      <p className="num break-all text-[11px] text-stone-600" title="SHA-256 of the stored file">
        SHA-256 {a.sha256}
      </p>
    </li>
  );
}

/** The evidence of the version on screen, and the form to attach a certificate or image to it. */
export function EvidencePanel({ ctx, onNewVersion }: { ctx: EvidenceContext; onNewVersion(a: AddedAttachment): void }) {
  const list = useEvidence(ctx.budgetId, ctx.version);
  const attach = useAttachEvidence(ctx.budgetId);
  const toast = useToast();
  const fileRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [symbol, setSymbol] = useState('');
  const [error, setError] = useState<string | null>(null);
  return (
    <section aria-labelledby="evidence-h" data-testid="evidence-panel" className="no-print rounded-lg border border-stone-200 bg-white p-3">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id="evidence-h" className="text-sm font-semibold text-stone-900">
          Evidence
        </h2>
        <span className="text-xs text-stone-600">version {ctx.version}</span>
      </div>
      {list.isPending ? (
        <Spinner label="Loading the evidence" />
      ) : list.isError ? (
        <ErrorNote title="The evidence could not be loaded">{errorMessage(list.error)}</ErrorNote>
      ) : list.data.length === 0 ? (
        <p className="text-xs text-stone-600">No certificates or images are attached to this version.</p>
      ) : (
        <ul className="flex flex-col gap-1.5">
          {list.data.map((a) => (
            <EvidenceItem key={a.id} a={a} budgetId={ctx.budgetId} />
          ))}
        </ul>
      )}
      {ctx.mayAttach ? (
        <form
          className="mt-3 flex flex-col gap-2 border-t border-stone-200 pt-2"
          onSubmit={(e) => {
            e.preventDefault();
            if (!file) {
              setError('Choose a PDF, PNG, JPEG or WebP file first.');
              return;
            }
            setError(null);
            attach.mutate(
              { file, symbol: symbol || null },
              {
                onSuccess: (a) => {
                  setFile(null);
                  setSymbol('');
                  if (fileRef.current) fileRef.current.value = '';
                  toast(
                    a.newVersion ? `${a.fileName} attached; version ${a.versionNumber} is a new draft, the approved version is unchanged.` : `${a.fileName} attached to version ${a.versionNumber}.`,
                  );
                  if (a.newVersion) onNewVersion(a);
                },
                onError: (err) => setError(errorMessage(err)),
              },
            );
          }}
        >
          <Field label="File (PDF, PNG, JPEG, WebP)" error={error}>
            {(p) => (
              <input
                {...p}
                ref={fileRef}
                type="file"
                accept="application/pdf,image/png,image/jpeg,image/webp"
                onChange={(e) => setFile(e.target.files?.[0] ?? null)}
                className="block w-full text-xs text-stone-800 file:mr-2 file:rounded-md file:border file:border-stone-300 file:bg-white file:px-2 file:py-1 file:text-xs file:font-medium"
              />
            )}
          </Field>
          <Field label="Supports">
            {(p) => (
              <Select {...p} value={symbol} onChange={(e) => setSymbol(e.target.value)}>
                <option value="">the whole budget</option>
                {ctx.symbols.map((s) => (
                  <option key={s} value={s}>
                    input {s}
                  </option>
                ))}
              </Select>
            )}
          </Field>
          {ctx.approved ? <p className="text-xs text-caution-700">This version is approved and cannot change: the file starts a new draft version.</p> : null}
          <Button type="submit" size="sm" variant="primary" disabled={attach.isPending}>
            {attach.isPending ? 'Attaching…' : 'Attach evidence'}
          </Button>
        </form>
      ) : null}
    </section>
  );
}
