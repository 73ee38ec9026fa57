import type { Correlation, InputQuantity } from '../../../../shared/budget/schema';
import { Button, Field, FormError, NumberInput, Select } from '../../../app/ui/controls';
import { Sym } from '../../../app/ui/quantity';
import { givenNumber } from '../../../app/ui/read-only';
import { useToast } from '../../../app/ui/toasts';
import { plainMessage, problemsUnder, type Problem } from '../live';
import { restoreAt, useLatest } from '../undo-removal';

export function CorrelationsEditor({
  correlations,
  inputs,
  onChange,
  problems,
  readOnly,
}: {
  correlations: Correlation[];
  inputs: InputQuantity[];
  onChange(next: Correlation[]): void;
  problems: Problem[];
  readOnly?: boolean;
}) {
  const symbols = inputs.map((q) => q.symbol).filter(Boolean);
  const matrixProblem = problems.find((p) => p.field === 'correlations');
  const set = (i: number, c: Correlation) => onChange(correlations.map((x, j) => (j === i ? c : x)));
  const toast = useToast();
  const latest = useLatest(correlations);
  const remove = (i: number) => {
    const c = correlations[i];
    onChange(correlations.filter((_, j) => j !== i));
    toast(`Removed the correlation of ${c.between.join(' and ')} (r = ${c.r}).`, 'info', { label: 'Undo', run: () => onChange(restoreAt(latest.current, c, i)) });
  };
  if (readOnly) {
    return correlations.length === 0 ? (
      <p className="text-sm text-stone-600">All inputs are taken as uncorrelated.</p>
    ) : (
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Correlation coefficients between inputs</caption>
        <thead className="text-xs text-stone-600">
          <tr>
            <th scope="col" className="py-1 pr-3 font-medium">
              Input
            </th>
            <th scope="col" className="py-1 pr-3 font-medium">
              with
            </th>
            <th scope="col" className="py-1 text-right font-medium">
              r
            </th>
          </tr>
        </thead>
        <tbody>
          {correlations.map((c, i) => (
            <tr key={i} className="border-t border-stone-200">
              <td className="py-1 pr-3">
                <Sym s={c.between[0]} />
              </td>
              <td className="py-1 pr-3">
                <Sym s={c.between[1]} />
              </td>
              <td className="num py-1 text-right">{givenNumber(c.r)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    );
  }
  return (
    <div className="flex flex-col gap-2">
      {correlations.length === 0 ? (
        <p className="text-sm text-stone-600">All inputs are taken as uncorrelated. Add a pair where two inputs share a cause (same reference, same thermometer).</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {correlations.map((c, i) => {
            const mine = problemsUnder(problems, `correlations[${i}]`);
            const betweenError = mine.find((p) => p.field.endsWith('.between'));
            const rError = mine.find((p) => p.field.endsWith('.r'));
            const other = mine.filter((p) => p !== betweenError && p !== rError);
            return (
              <li key={i} className={`grid grid-cols-[1fr_1fr_8rem_auto] items-start gap-2 rounded-md border p-2 ${mine.length ? 'border-caution-500' : 'border-stone-200'}`}>
                {[0, 1].map((side) => (
                  <Field key={side} label={side === 0 ? 'Input' : 'with'} error={side === 0 && betweenError ? plainMessage(betweenError) : null}>
                    {(p) => (
                      <Select
                        {...p}
                        className="num"
                        value={c.between[side]}
                        onChange={(e) => {
                          const between: [string, string] = [...c.between];
                          between[side] = e.target.value;
                          set(i, { ...c, between });
                        }}
                      >
                        {!symbols.includes(c.between[side]) ? <option value={c.between[side]}>{c.between[side] || '—'}</option> : null}
                        {symbols.map((s) => (
                          <option key={s} value={s}>
                            {s}
                          </option>
                        ))}
                      </Select>
                    )}
                  </Field>
                ))}
                <Field label="r" error={rError ? plainMessage(rError) : null}>
                  {(p) => <NumberInput {...p} value={c.r} onValue={(v) => set(i, { ...c, r: v as number })} />}
                </Field>
                <Button size="sm" variant="ghost" className="mt-5" onClick={() => remove(i)} aria-label={`Remove correlation ${c.between.join(' and ')}`}>
                  Remove
                </Button>
                {other.map((p, k) => (
                  <p key={k} role="alert" className="col-span-4 text-xs font-medium text-caution-700">
                    {plainMessage(p)}
                  </p>
                ))}
              </li>
            );
          })}
        </ul>
      )}
      {matrixProblem ? (
        <FormError>
          <span className="font-semibold">Correlations: </span>
          {plainMessage(matrixProblem)}. Lower one of these coefficients, or check that they describe the same shared effect.
        </FormError>
      ) : null}
      <div>
        <Button
          disabled={symbols.length < 2}
          onClick={() => {
            const normals = inputs.filter((q) => q.distribution.kind === 'normal').map((q) => q.symbol);
            const pool = normals.length >= 2 ? normals : symbols;
            onChange([...correlations, { between: [pool[0], pool[1]], r: 0.5 }]);
          }}
        >
          + Add correlated pair
        </Button>
        <span className="ml-2 text-xs text-stone-600">Only inputs with a normal distribution can be correlated.</span>
      </div>
    </div>
  );
}
