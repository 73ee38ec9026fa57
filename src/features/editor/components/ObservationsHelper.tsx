import { useMemo, useRef, useState } from 'react';
import type { DistributionOf } from '../../../../shared/budget/schema';
import { arithmeticMean, experimentalStandardDeviation } from '../../../../shared/distributions/type-a';
import { describeIgnoredLine, parseObservationText, type IgnoredLine } from '../../../../shared/observations/parse-observations';
import { errorMessage, ApiError } from '../../../app/http';
import { Button, Field, Select, TextArea } from '../../../app/ui/controls';
import { formatCount, formatSignificant } from '../../../app/ui/numbers';
import { ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
import { formatUnit } from '../../../app/ui/units';
import { useUploadObservations } from '../api/editor';

/** The lines of the pasted text that gave no value, each with why. */
function IgnoredLines({ lines }: { lines: IgnoredLine[] }) {
  if (lines.length === 0) return null;
  return (
    <div role="status" className="rounded-md border border-caution-500 bg-caution-50 px-2 py-1.5 text-xs text-caution-700">
      <p className="font-semibold">
        {lines.length} line{lines.length > 1 ? 's' : ''} not read:
      </p>
      <ul aria-label="Lines not read" className="num max-h-32 overflow-y-auto">
        {lines.map((l) => (
          <li key={l.line}>{describeIgnoredLine(l)}</li>
        ))}
      </ul>
    </div>
  );
}

/** A strip plot of the observations: one tick per value, the mean and ± s marked. */
function StripPlot({ values, mean, s, unit }: { values: number[]; mean: number; s: number; unit?: string }) {
  const min = Math.min(...values, mean - s);
  const max = Math.max(...values, mean + s);
  const span = max - min || Math.abs(mean) || 1;
  const x = (v: number) => 8 + ((v - min) / span) * 284;
  return (
    <svg viewBox="0 0 300 44" className="h-11 w-full max-w-sm" role="img" aria-label={`Strip plot of ${values.length} observations, mean ${formatSignificant(mean, 6)} ${formatUnit(unit)}`}>
      <line x1={8} x2={292} y1={24} y2={24} stroke="#d6d3d1" />
      <rect x={x(mean - s)} y={14} width={Math.max(1, x(mean + s) - x(mean - s))} height={20} fill="#d5eaea" />
      {values.map((v, i) => (
        <line key={i} x1={x(v)} x2={x(v)} y1={16} y2={32} stroke="#44403c" strokeWidth={1.5} opacity={0.75} />
      ))}
      <line x1={x(mean)} x2={x(mean)} y1={8} y2={40} stroke="#176464" strokeWidth={2} />
      <text x={x(mean)} y={7} textAnchor="middle" fontSize={8} fill="#114f4f">
        mean
      </text>
    </svg>
  );
}

export function ObservationsHelper({
  spec,
  unit,
  onValues,
  readOnly,
  canUpload,
  error,
}: {
  spec: DistributionOf<'observations'>;
  unit?: string;
  onValues(values: number[]): void;
  readOnly?: boolean;
  canUpload: boolean;
  error?: string | null;
}) {
  const values = useMemo(() => (Array.isArray(spec.values) ? spec.values.filter((v) => Number.isFinite(v)) : []), [spec.values]);
  const [text, setText] = useState(() => values.join('\n'));
  const [ignored, setIgnored] = useState<IgnoredLine[]>([]);
  const [ambiguity, setAmbiguity] = useState<string | null>(null);
  const [upload, setUpload] = useState<{ name: string; columns: (string | null)[]; file: File } | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const send = useUploadObservations();

  const stats = useMemo(() => {
    if (values.length < 2) return null;
    const mean = arithmeticMean(values);
    const s = experimentalStandardDeviation(values);
    return { n: values.length, mean, s, sm: s / Math.sqrt(values.length) };
  }, [values]);

  const applyText = (t: string) => {
    setText(t);
    const r = parseObservationText(t);
    setIgnored(r.ignored);
    setAmbiguity(r.ambiguity);
    onValues(r.values);
  };

  const sendFile = (file: File, column?: string) => {
    send.mutate(
      { file, column },
      {
        onSuccess: (r) => {
          setUpload(null);
          setText(r.values.join('\n'));
          setIgnored(r.errors.map((e) => ({ line: e.row, reason: e.message })));
          setAmbiguity(null);
          onValues(r.values);
        },
        onError: (e) => {
          const cols = e instanceof ApiError ? ((e.body?.error as { columns?: (string | null)[] } | undefined)?.columns ?? null) : null;
          if (cols && e instanceof ApiError && (e.code === 'choose_column' || e.code === 'unknown_column')) setUpload({ name: file.name, columns: cols, file });
        },
      },
    );
  };

  const u = formatUnit(unit);
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 md:grid-cols-[1fr_1fr]">
        {readOnly ? (
          <ReadOnlyList>
            <ReadOnlyField label={`Observations (${formatCount(values.length)})${u ? `, ${u}` : ''}`}>
              <ol aria-label="Observations" className="num grid max-h-40 grid-cols-[repeat(auto-fill,minmax(6rem,1fr))] gap-x-3 overflow-y-auto">
                {values.map((v, i) => (
                  <li key={i}>{String(v)}</li>
                ))}
              </ol>
            </ReadOnlyField>
          </ReadOnlyList>
        ) : (
          <div className="flex flex-col gap-2">
            <Field
              label="Observations (paste a column from a spreadsheet)"
              error={ambiguity ? `Not read: ${ambiguity}.` : error}
              hint="One value per line, or several separated by tabs or semicolons; 50,02 and 50.02 are both read, 1 234,5 and 1,234.5 too."
            >
              {(p) => <TextArea {...p} rows={6} className="num" value={text} onChange={(e) => applyText(e.target.value)} />}
            </Field>
            <IgnoredLines lines={ignored} />
          </div>
        )}
        <div className="flex flex-col gap-2 text-sm">
          {stats ? (
            <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
              <dt className="text-stone-600">n</dt>
              <dd className="num">{formatCount(stats.n)}</dd>
              <dt className="text-stone-600">mean q̄</dt>
              <dd className="num">
                {formatSignificant(stats.mean, 7)} {u}
              </dd>
              <dt className="text-stone-600">s(q)</dt>
              <dd className="num">
                {formatSignificant(stats.s, 3)} {u}
              </dd>
              <dt className="text-stone-600">s(q̄) = s/√n</dt>
              <dd className="num">
                {formatSignificant(stats.sm, 3)} {u}
              </dd>
              <dt className="text-stone-600">ν = n − 1</dt>
              <dd className="num">{stats.n - 1}</dd>
            </dl>
          ) : (
            <p className="text-stone-600">Enter at least two observations to see n, the mean, s and s/√n.</p>
          )}
          {stats ? <StripPlot values={values} mean={stats.mean} s={stats.s} unit={unit} /> : null}
          {canUpload && !readOnly ? (
            <div className="flex flex-wrap items-center gap-2">
              <input
                ref={fileRef}
                type="file"
                accept=".csv,.txt,.tsv,text/csv,text/plain"
                className="sr-only"
                tabIndex={-1}
                aria-label="CSV file of observations"
                onChange={(e) => {
                  const f = e.target.files?.[0];
                  e.target.value = '';
                  if (f) sendFile(f);
                }}
              />
              <Button size="sm" onClick={() => fileRef.current?.click()} disabled={send.isPending}>
                {send.isPending ? 'Reading…' : 'Upload CSV…'}
              </Button>
              {send.isError && !upload ? (
                <span role="alert" className="text-xs text-caution-700">
                  {errorMessage(send.error)}
                </span>
              ) : null}
            </div>
          ) : null}
          {upload ? (
            <Field label={`“${upload.name}” has several columns: choose one`}>
              {(p) => (
                <Select {...p} defaultValue="" onChange={(e) => e.target.value && sendFile(upload.file, e.target.value)}>
                  <option value="">Choose a column…</option>
                  {upload.columns.map((c, i) => (
                    <option key={i} value={c ?? String(i + 1)}>
                      {c ?? `Column ${i + 1}`}
                    </option>
                  ))}
                </Select>
              )}
            </Field>
          ) : null}
        </div>
      </div>
    </div>
  );
}
