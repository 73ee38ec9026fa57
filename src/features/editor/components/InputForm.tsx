import { useState } from 'react';
import { DISTRIBUTION_KINDS, type Distribution, type DistributionKind, type InputQuantity } from '../../../../shared/budget/schema';
import { roundDecimals, roundSignificant } from '../../../../shared/format/significant-digits';
import { coverageFactorFor } from '../../../../shared/statistics/student-t';
import { Field, NumberInput, Select, TextInput } from '../../../app/ui/controls';
import { formatSignificant } from '../../../app/ui/numbers';
import { givenNumber, ReadOnlyField } from '../../../app/ui/read-only';
import { formatUnit } from '../../../app/ui/units';
import { problemAt, type Problem } from '../live';
import { convertKind, KIND_LABELS } from './kinds';
import { ObservationsHelper } from './ObservationsHelper';

type NormalMode = 'u' | 'Uk' | 'Up';
type RectMode = 'tolerance' | 'limits' | 'resolution';

const NORMAL_MODES = [
  ['u', 'a standard uncertainty u'],
  ['Uk', 'a certificate: expanded uncertainty U with coverage factor k'],
  ['Up', 'a certificate: U at coverage probability p with ν degrees of freedom'],
] as const satisfies readonly (readonly [NormalMode, string])[];

const RECT_MODES = [
  ['tolerance', 'a tolerance ± a around a value'],
  ['limits', 'lower and upper limits'],
  ['resolution', 'the resolution of an indicating instrument'],
] as const satisfies readonly (readonly [RectMode, string])[];

/* eslint-disable @typescript-eslint/no-explicit-any */
type AnyDist = Distribution & Record<string, any>;

export function InputForm({
  input,
  index,
  problems,
  onChange,
  readOnly,
  canUpload,
}: {
  input: InputQuantity;
  index: number;
  problems: Problem[];
  onChange(next: InputQuantity): void;
  readOnly?: boolean;
  canUpload: boolean;
}) {
  const base = `inputs[${index}]`;
  const err = (f: string) => problemAt(problems, `${base}.${f}`);
  const d = input.distribution as AnyDist;
  const setDist = (patch: Record<string, unknown>) => {
    const next: Record<string, unknown> = { ...d, ...patch };
    for (const k of Object.keys(next)) if (next[k] === undefined) delete next[k];
    onChange({ ...input, distribution: next as Distribution });
  };
  const unit = formatUnit(input.unit);
  const unitSuffix = unit ? ` (${unit})` : '';

  const [normalMode, setNormalMode] = useState<NormalMode>(d.kind === 'normal' && d.u === undefined ? (d.dof !== undefined ? 'Up' : 'Uk') : 'u');
  const [p, setP] = useState<number | undefined>(0.95);
  const [rectMode, setRectMode] = useState<RectMode>(d.kind === 'rectangular' && d.lower !== undefined ? 'limits' : 'tolerance');
  const [dofMode, setDofMode] = useState<'inf' | 'direct' | 'reliability'>(d.relativeUncertaintyOfU !== undefined ? 'reliability' : d.dof !== undefined ? 'direct' : 'inf');

  const num = (label: string, field: string, hint?: string, value?: number, onValue?: (v: number | undefined) => void) =>
    readOnly ? (
      <ReadOnlyField key={field} label={label} numeric note={hint}>
        {givenNumber(value !== undefined ? value : (d[field] as number | undefined))}
      </ReadOnlyField>
    ) : (
    <Field label={label} error={err(`distribution.${field}`)} hint={hint}>
      {(fp) => (
        <NumberInput
          {...fp}
          value={value !== undefined ? value : (d[field] as number | undefined)}
          onValue={onValue ?? ((v) => setDist({ [field]: v }))}
        />
      )}
    </Field>
  );

  // One chooser shape for every "how is this given" select on the form.
  const choice = <M extends string>(label: string, value: M, onChoose: (m: M) => void, options: readonly (readonly [M, string])[], extra: { error?: string | null; className?: string } = {}) =>
    readOnly ? (
      <ReadOnlyField label={label} className={extra.className}>
        {options.find(([v]) => v === value)?.[1]}
      </ReadOnlyField>
    ) : (
    <Field label={label} error={extra.error} className={extra.className}>
      {(fp) => (
        <Select {...fp} value={value} onChange={(e) => onChoose(e.target.value as M)}>
          {options.map(([v, text]) => (
            <option key={v} value={v}>
              {text}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );

  const kFromP = (nu: number | undefined, prob: number | undefined) => {
    if (!(prob !== undefined && prob > 0 && prob < 1)) return undefined;
    const dof = nu !== undefined && nu > 0 ? nu : Infinity;
    return roundDecimals(coverageFactorFor(prob, dof), 4);
  };

  const kindFields = () => {
    switch (d.kind) {
      case 'normal':
        return (
          <>
            {choice(
              'Given as',
              normalMode,
              (mode) => {
                setNormalMode(mode);
                if (mode === 'u') setDist({ u: d.u ?? (d.U && d.k ? roundSignificant(d.U / d.k, 6) : undefined), U: undefined, k: undefined });
                else if (mode === 'Uk') setDist({ U: d.U ?? (d.u ? d.u * 2 : undefined), k: d.k ?? 2, u: undefined });
                else {
                  const nu = d.dof ?? 10;
                  setDofMode('direct');
                  setDist({ U: d.U ?? (d.u ? d.u * 2 : undefined), k: kFromP(nu, p), dof: nu, u: undefined, relativeUncertaintyOfU: undefined });
                }
              },
              NORMAL_MODES,
              { className: 'md:col-span-3' },
            )}
            {num(`Value${unitSuffix}`, 'value')}
            {normalMode === 'u' ? num(`Standard uncertainty u${unitSuffix}`, 'u') : null}
            {normalMode === 'Uk' ? (
              <>
                {num(`Expanded uncertainty U${unitSuffix}`, 'U')}
                {num('Coverage factor k', 'k', d.U && d.k ? `u = U/k = ${formatSignificant(d.U / d.k, 3)} ${unit}` : undefined)}
              </>
            ) : null}
            {normalMode === 'Up' ? (
              <>
                {num(`Expanded uncertainty U${unitSuffix}`, 'U')}
                {num('Coverage probability p', 'p', 'e.g. 0.95', p, (v) => {
                  setP(v);
                  setDist({ k: kFromP(d.dof, v) });
                })}
                {num('Degrees of freedom ν', 'dof', d.k ? `k = t_p(ν) = ${formatSignificant(d.k, 4)} (GUM G.3.4)` : undefined, undefined, (v) => setDist({ dof: v, k: kFromP(v, p) }))}
              </>
            ) : null}
          </>
        );
      case 'rectangular':
        return (
          <>
            {choice(
              'Given as',
              rectMode,
              (mode) => {
                setRectMode(mode);
                if (mode === 'limits') {
                  const v = d.value ?? 0;
                  const a = d.halfWidth ?? 1;
                  setDist({ lower: v - a, upper: v + a, value: undefined, halfWidth: undefined });
                } else if (d.lower !== undefined || d.upper !== undefined) {
                  const lo = d.lower ?? 0;
                  const hi = d.upper ?? lo;
                  setDist({ value: (lo + hi) / 2, halfWidth: (hi - lo) / 2 || 1, lower: undefined, upper: undefined });
                }
              },
              RECT_MODES,
              { className: 'md:col-span-3' },
            )}
            {rectMode === 'limits' ? (
              <>
                {num(`Lower limit a₋${unitSuffix}`, 'lower')}
                {num(`Upper limit a₊${unitSuffix}`, 'upper')}
              </>
            ) : rectMode === 'tolerance' ? (
              <>
                {num(`Value${unitSuffix}`, 'value')}
                {num(`Half-width a${unitSuffix}`, 'halfWidth', d.halfWidth ? `u = a/√3 = ${formatSignificant(d.halfWidth / Math.sqrt(3), 3)} ${unit}` : undefined)}
              </>
            ) : (
              <>
                {num(`Correction value${unitSuffix}`, 'value', 'usually 0')}
                {num(
                  `Resolution δ (digit step)${unitSuffix}`,
                  'halfWidth',
                  d.halfWidth ? `a = δ/2, u = δ/(2√3) = ${formatSignificant(d.halfWidth / Math.sqrt(3), 3)} ${unit} (GUM F.2.2.1)` : 'the smallest step of the display',
                  d.halfWidth !== undefined ? roundSignificant(d.halfWidth * 2, 12) : undefined,
                  (v) => setDist({ halfWidth: v === undefined ? undefined : v / 2 }),
                )}
              </>
            )}
          </>
        );
      case 'triangular':
      case 'arcsine':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Half-width a${unitSuffix}`, 'halfWidth')}
          </>
        );
      case 'trapezoidal':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Half-width a${unitSuffix}`, 'halfWidth')}
            {num('β (top to base ratio, 0 to 1)', 'beta')}
          </>
        );
      case 'curvilinear-trapezoidal':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Half-width a${unitSuffix}`, 'halfWidth')}
            {num(`Uncertainty of the half-width d${unitSuffix}`, 'halfWidthUncertainty')}
          </>
        );
      case 'student-t':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Scale s${unitSuffix}`, 'scale')}
            {num('Degrees of freedom ν', 'dof')}
          </>
        );
      case 'constant':
        return num(`Value${unitSuffix}`, 'value');
      case 'observations':
        // read-only, the observations are listed below the definition list of the other facts
        return readOnly ? null : <div className="md:col-span-3">{observations}</div>;
    }
  };
  const observations =
    d.kind === 'observations' ? (
      <ObservationsHelper spec={d} unit={input.unit} readOnly={readOnly} canUpload={canUpload} error={err('distribution.values')} onValues={(values) => setDist({ values })} />
    ) : null;

  const showDof = d.kind !== 'student-t' && d.kind !== 'constant' && !(d.kind === 'normal' && normalMode === 'Up');
  if (readOnly) {
    const dofText =
      d.relativeUncertaintyOfU !== undefined
        ? `${formatSignificant(0.5 / d.relativeUncertaintyOfU ** 2, 3)}, from Δu/u = ${formatSignificant(d.relativeUncertaintyOfU * 100, 3)} % (GUM G.4.2)`
        : d.dof !== undefined
          ? `${d.dof}, given`
          : d.kind === 'observations'
            ? 'n − 1'
            : '∞ (u is known well)';
    return (
      <div className="flex flex-col gap-3">
        <dl aria-label={`Input ${input.symbol}`} className="grid gap-x-4 gap-y-2 md:grid-cols-3">
          <ReadOnlyField label="Symbol" numeric>
            {input.symbol}
          </ReadOnlyField>
          <ReadOnlyField label="Unit" numeric>
            {input.unit ? formatUnit(input.unit) || 'dimensionless' : 'dimensionless'}
          </ReadOnlyField>
          <ReadOnlyField label="Description">{input.description}</ReadOnlyField>
          {choice('Distribution', d.kind as DistributionKind, () => {}, DISTRIBUTION_KINDS.map((k) => [k, KIND_LABELS[k]] as const))}
          {kindFields()}
          {showDof ? <ReadOnlyField label="Degrees of freedom νᵢ">{dofText}</ReadOnlyField> : null}
        </dl>
        {observations}
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="grid gap-3 md:grid-cols-[1fr_1fr_2fr]">
        <Field label="Symbol" error={err('symbol')}>
          {(fp) => <TextInput {...fp} className="num" value={input.symbol} onChange={(e) => onChange({ ...input, symbol: e.target.value })} />}
        </Field>
        <Field label="Unit" error={err('unit')} hint={input.unit ? `shown as ${formatUnit(input.unit) || 'dimensionless'}` : 'e.g. mm, um, degC, kg/m^3; empty = dimensionless'}>
          {(fp) => (
            <TextInput {...fp} className="num" value={input.unit ?? ''} onChange={(e) => onChange({ ...input, unit: e.target.value || undefined })} />
          )}
        </Field>
        <Field label="Description" error={err('description')}>
          {(fp) => (
            <TextInput
              {...fp}
              value={input.description ?? ''}
              placeholder="what this quantity is and where its value comes from"
              onChange={(e) => onChange({ ...input, description: e.target.value || undefined })}
            />
          )}
        </Field>
      </div>
      <div className="grid gap-3 md:grid-cols-3">
        {choice(
          'Distribution',
          d.kind as DistributionKind,
          (kind) => {
            setNormalMode('u');
            setRectMode('tolerance');
            onChange({ ...input, distribution: convertKind(input.distribution, kind) });
          },
          DISTRIBUTION_KINDS.map((k) => [k, KIND_LABELS[k]] as const),
          { error: err('distribution.kind'), className: 'md:col-span-3' },
        )}
        {kindFields()}
      </div>
      {showDof ? (
        <fieldset className="grid gap-3 rounded-md border border-stone-200 p-3 md:grid-cols-3">
          <legend className="px-1 text-xs font-medium text-stone-700">Degrees of freedom νᵢ</legend>
          {choice(
            'ν from',
            dofMode,
            (m) => {
              setDofMode(m);
              if (m === 'inf') setDist({ dof: undefined, relativeUncertaintyOfU: undefined });
              if (m === 'direct') setDist({ relativeUncertaintyOfU: undefined, dof: d.dof ?? (d.kind === 'observations' ? undefined : 50) });
              if (m === 'reliability') setDist({ dof: undefined, relativeUncertaintyOfU: d.relativeUncertaintyOfU ?? 0.1 });
            },
            [
              ['inf', d.kind === 'observations' ? 'n − 1 (default)' : '∞: u is known well (default)'],
              ['direct', 'a value given directly'],
              ['reliability', 'the reliability of u (Δu/u)'],
            ],
            { error: err('distribution.relativeUncertaintyOfU') },
          )}
          {dofMode === 'direct' ? num('νᵢ', 'dof') : null}
          {dofMode === 'reliability' ? (
            num(
              'Relative uncertainty of u, Δu/u (%)',
              'relativeUncertaintyOfU',
              d.relativeUncertaintyOfU ? `ν = ½·(Δu/u)⁻² = ${formatSignificant(0.5 / d.relativeUncertaintyOfU ** 2, 3)} (GUM G.4.2)` : 'e.g. 10 % gives ν = 50',
              d.relativeUncertaintyOfU !== undefined ? roundSignificant(d.relativeUncertaintyOfU * 100, 10) : undefined,
              (v) => setDist({ relativeUncertaintyOfU: v === undefined ? undefined : v / 100 }),
            )
          ) : null}
        </fieldset>
      ) : null}
      {problems
        .filter((pr) => !pr.field.startsWith(`${base}.`) || !/\.(symbol|unit|description|distribution\.\w+)$/.test(pr.field))
        .map((pr, i) => (
          <p key={i} role="alert" className="text-xs font-medium text-caution-700">
            {pr.message}
          </p>
        ))}
    </div>
  );
}
