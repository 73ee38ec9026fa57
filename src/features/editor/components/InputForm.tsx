import { useState } from 'react';
import { DISTRIBUTION_KINDS, type Distribution, type DistributionKind, type InputQuantity, type StatedAs } from '../../../../shared/budget/schema';
import { statedValueOf } from '../../../../shared/budget/stated-value';
import { normalCoverageFactor } from '../../../../shared/distributions/normal';
import { roundSignificant } from '../../../../shared/format/significant-digits';
import { Field, NumberInput, Select, TextInput } from '../../../app/ui/controls';
import { formatSignificant } from '../../../app/ui/numbers';
import { givenNumber, ReadOnlyField, ReadOnlyList } from '../../../app/ui/read-only';
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
  ['tolerance', 'a half-width ± a around a value (specification, tolerance)'],
  ['limits', 'lower and upper limits'],
  ['resolution', 'the resolution of an indicating instrument'],
] as const satisfies readonly (readonly [RectMode, string])[];

/** Where the figure comes from, kept as `distribution.stated.as`; a resolution is chosen as a way of giving a rectangular input. */
const STATED_CHOICES = [
  ['', 'not recorded'],
  ['certificate', 'a calibration certificate'],
  ['specification', 'a manufacturer\'s specification'],
  ['tolerance', 'a tolerance'],
  ['observations', 'repeated observations'],
  ['estimate', 'the laboratory\'s own estimate'],
] as const satisfies readonly (readonly [StatedAs | '', string])[];

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
  /** Sets the form the input was stated in, keeping its source; '' removes it. */
  const statedPatch = (as: StatedAs | '' | undefined) =>
    as ? { stated: { ...(d.stated ?? {}), as } } : { stated: undefined };
  const unit = formatUnit(input.unit);
  const unitSuffix = unit ? ` (${unit})` : '';
  // The uncertainty fields are in their own unit when one is given (12 mK for a value in °C).
  const uncertaintyUnit = d.uncertaintyUnit !== undefined ? formatUnit(d.uncertaintyUnit) || d.uncertaintyUnit : unit;
  const uncSuffix = uncertaintyUnit ? ` (${uncertaintyUnit})` : '';

  const [normalMode, setNormalMode] = useState<NormalMode>(d.kind === 'normal' && d.u === undefined ? (d.p !== undefined ? 'Up' : 'Uk') : 'u');
  const [rectMode, setRectMode] = useState<RectMode>(
    d.kind === 'rectangular' && d.lower !== undefined ? 'limits' : d.stated?.as === 'resolution' ? 'resolution' : 'tolerance',
  );
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

  /** k of the U stated with p (the engine's rule), or undefined while p or ν is not usable. */
  const kOfP = () => {
    try {
      return d.p > 0 && d.p < 1 && (d.dof === undefined || d.dof >= 1) ? (normalCoverageFactor(d) ?? undefined) : undefined;
    } catch {
      return undefined;
    }
  };
  const certificate = () => (d.stated?.as === undefined ? statedPatch('certificate') : {});

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
                const k = d.k ?? kOfP();
                if (mode === 'u') setDist({ u: d.u ?? (d.U && k ? roundSignificant(d.U / k, 6) : undefined), U: undefined, k: undefined, p: undefined });
                else if (mode === 'Uk') setDist({ U: d.U ?? (d.u ? d.u * 2 : undefined), k: k !== undefined ? roundSignificant(k, 4) : 2, p: undefined, u: undefined, ...certificate() });
                else {
                  // ν is optional here: without it k is the normal quantile
                  setDofMode(d.dof !== undefined ? 'direct' : 'inf');
                  setDist({ U: d.U ?? (d.u ? d.u * 2 : undefined), p: d.p ?? 0.95, k: undefined, u: undefined, relativeUncertaintyOfU: undefined, ...certificate() });
                }
              },
              NORMAL_MODES,
              { className: 'md:col-span-3' },
            )}
            {num(`Value${unitSuffix}`, 'value')}
            {normalMode === 'u' ? num(`Standard uncertainty u${uncSuffix}`, 'u') : null}
            {normalMode === 'Uk' ? (
              <>
                {num(`Expanded uncertainty U${uncSuffix}`, 'U')}
                {num('Coverage factor k', 'k')}
              </>
            ) : null}
            {normalMode === 'Up' ? (
              <>
                {num(`Expanded uncertainty U${uncSuffix}`, 'U')}
                {num('Coverage probability p', 'p', readOnly ? undefined : 'e.g. 0.95 for 95 %')}
                {num(
                  'Degrees of freedom ν (as stated; empty = ∞)',
                  'dof',
                  kOfP() !== undefined
                    ? d.dof !== undefined
                      ? `k = t_(1+p)/2(ν) = ${formatSignificant(kOfP()!, 4)} (GUM G.3.4, EA-4/02)`
                      : `k = z_(1+p)/2 = ${formatSignificant(kOfP()!, 4)} (normal, GUM G.6.6)`
                    : undefined,
                )}
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
                // a resolution is recorded as such (a = r/2); leaving it forgets that form
                const form = mode === 'resolution' ? statedPatch('resolution') : d.stated?.as === 'resolution' ? statedPatch('') : {};
                if (mode === 'limits') {
                  const v = d.value ?? 0;
                  const a = d.halfWidth ?? 1;
                  setDist({ lower: v - a, upper: v + a, value: undefined, halfWidth: undefined, uncertaintyUnit: undefined, ...form });
                } else if (d.lower !== undefined || d.upper !== undefined) {
                  const lo = d.lower ?? 0;
                  const hi = d.upper ?? lo;
                  setDist({ value: (lo + hi) / 2, halfWidth: (hi - lo) / 2 || 1, lower: undefined, upper: undefined, ...form });
                } else setDist(form);
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
                {num(`Half-width a${uncSuffix}`, 'halfWidth')}
              </>
            ) : (
              <>
                {num(`Correction value${unitSuffix}`, 'value', 'usually 0')}
                {num(
                  `Resolution r (digit step)${uncSuffix}`,
                  'halfWidth',
                  d.halfWidth ? 'a = r/2 (GUM F.2.2.1)' : 'the smallest step of the display',
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
            {num(`Half-width a${uncSuffix}`, 'halfWidth')}
          </>
        );
      case 'trapezoidal':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Half-width a${uncSuffix}`, 'halfWidth')}
            {num('β (top to base ratio, 0 to 1)', 'beta')}
          </>
        );
      case 'curvilinear-trapezoidal':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Half-width a${uncSuffix}`, 'halfWidth')}
            {num(`Uncertainty of the half-width d${uncSuffix}`, 'halfWidthUncertainty')}
          </>
        );
      case 'student-t':
        return (
          <>
            {num(`Value${unitSuffix}`, 'value')}
            {num(`Scale s${uncSuffix}`, 'scale')}
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

  // How the figure was stated: its form, source and the unit of the uncertainty; the resolution form comes from "Given as".
  const takesUncertaintyUnit =
    d.kind !== 'constant' && !(d.kind === 'rectangular' && rectMode === 'limits') && !(d.kind === 'observations' && d.pooledSd === undefined);
  const statedAs: StatedAs | '' = d.stated?.as ?? '';
  const asStated = (() => {
    try {
      return statedValueOf(input);
    } catch {
      return null;
    }
  })();
  const asStatedNote = asStated
    ? `${asStated.text}${asStated.divisorText && asStated.coverageProbability === null ? `; divisor ${asStated.divisorText}` : ''}; u = ${formatSignificant(asStated.standardUncertainty, 3)} ${unit}`
    : null;
  const statedFields =
    d.kind === 'constant' ? null : readOnly ? (
      <>
        <ReadOnlyField label="Stated as">
          {statedAs === 'resolution' ? RECT_MODES[2][1] : STATED_CHOICES.find(([v]) => v === statedAs)?.[1]}
        </ReadOnlyField>
        <ReadOnlyField label="Source">{d.stated?.source}</ReadOnlyField>
        {d.uncertaintyUnit !== undefined ? (
          <ReadOnlyField label="Uncertainty given in" numeric>
            {uncertaintyUnit}
          </ReadOnlyField>
        ) : null}
        {asStatedNote ? (
          <ReadOnlyField label="As stated" numeric className="md:col-span-3">
            {asStatedNote}
          </ReadOnlyField>
        ) : null}
      </>
    ) : (
      <fieldset className="grid gap-3 rounded-md border border-stone-200 p-3 md:grid-cols-3">
        <legend className="px-1 text-xs font-medium text-stone-700">As stated</legend>
        {statedAs === 'resolution' ? (
          <ReadOnlyField label="Stated as">{RECT_MODES[2][1]}</ReadOnlyField>
        ) : (
          choice('Stated as', statedAs, (as) => setDist(statedPatch(as)), STATED_CHOICES, { error: err('distribution.stated') ?? err('distribution.stated.as') })
        )}
        <Field label="Source" error={err('distribution.stated.source')} hint={statedAs ? 'e.g. the certificate number' : 'choose how it was stated first'}>
          {(fp) => (
            <TextInput
              {...fp}
              value={d.stated?.source ?? ''}
              disabled={!statedAs}
              onChange={(e) => setDist({ stated: { ...d.stated, source: e.target.value || undefined } })}
            />
          )}
        </Field>
        {takesUncertaintyUnit ? (
          <Field
            label="Uncertainty given in"
            error={err('distribution.uncertaintyUnit')}
            hint={d.uncertaintyUnit ? `shown as ${uncertaintyUnit}; %, ppm, ppb are relative to the value` : 'empty = the unit of the value; e.g. mK, um, ppm'}
          >
            {(fp) => (
              <TextInput {...fp} className="num" value={d.uncertaintyUnit ?? ''} onChange={(e) => setDist({ uncertaintyUnit: e.target.value || undefined })} />
            )}
          </Field>
        ) : null}
        {asStatedNote ? <p className="num text-xs text-stone-700 md:col-span-3">{asStatedNote}</p> : null}
      </fieldset>
    );

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
        <ReadOnlyList label={`Input ${input.symbol}`} className="md:grid-cols-3">
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
          {statedFields}
        </ReadOnlyList>
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
            onChange({ ...input, distribution: convertKind(input.distribution, kind, input.unit) });
          },
          DISTRIBUTION_KINDS.map((k) => [k, KIND_LABELS[k]] as const),
          { error: err('distribution.kind'), className: 'md:col-span-3' },
        )}
        {kindFields()}
      </div>
      {statedFields}
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
        .filter((pr) => !pr.field.startsWith(`${base}.`) || !/\.(symbol|unit|description|distribution(\.\w+)+)$/.test(pr.field))
        .map((pr, i) => (
          <p key={i} role="alert" className="text-xs font-medium text-caution-700">
            {pr.message}
          </p>
        ))}
    </div>
  );
}
