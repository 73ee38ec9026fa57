import { Fragment, useId, useRef, type ReactNode } from 'react';
import { superscript } from '../../../../shared/format/superscript';
import { Sym } from '../../../app/ui/quantity';
import type { Problem } from '../live';
import { plainMessage } from '../live';

const FUNCTIONS = new Set(['sqrt', 'exp', 'log', 'log10', 'sin', 'cos', 'tan', 'asin', 'acos', 'atan', 'atan2', 'abs', 'min', 'max']);

/** An expression as it is printed: symbols with subscripts, · for ×, √ for sqrt, raised exponents, true minus signs. */
function typesetExpression(text: string): ReactNode[] {
  const out: ReactNode[] = [];
  const re = /([A-Za-z][A-Za-z0-9_]*)|(\^\s*\(?-?[0-9.]+\)?)|(\d+(?:\.\d+)?(?:[eE][-+]?\d+)?)|(\*)|(-)|(\s+)|(.)/g;
  let m: RegExpExecArray | null;
  let i = 0;
  while ((m = re.exec(text))) {
    const [tok, ident, power, number, times, minus, space] = m;
    if (ident) out.push(ident === 'sqrt' ? '√' : FUNCTIONS.has(ident) || ident === 'pi' ? ident === 'pi' ? 'π' : ident : <Sym key={i} s={ident} />);
    else if (power) out.push(superscript(power.replace(/[\^\s()]/g, '')));
    else if (number) out.push(number);
    else if (times) out.push(' · ');
    else if (minus) out.push(' − ');
    else if (space) out.push(' ');
    else out.push(tok);
    i++;
  }
  return out;
}

/**
 * The model typeset line by line beside its text, each line followed by the value of the quantity it
 * defines at the input estimates, with its unit; the same rows as the text so they read across.
 */
function TypesetModel({ lines, values }: { lines: string[]; values: Record<string, string> }) {
  return (
    <div
      aria-label="The model typeset, with the value of each quantity"
      role="group"
      className="hidden min-w-0 border-l border-stone-200 bg-stone-50 px-3 py-2 text-sm leading-6 text-stone-800 md:block md:w-[44%]"
    >
      {lines.map((line, i) => {
        const code = line.replace(/#.*$/, '').trim();
        const eq = /^([A-Za-z][A-Za-z0-9_]*)\s*=\s*(.+)$/.exec(code);
        if (!eq)
          return (
            <div key={i} className="truncate text-stone-400">
              {line.trim().startsWith('#') ? line.trim() : '\u00a0'}
            </div>
          );
        const value = values[eq[1]];
        return (
          <div key={i} className="flex items-baseline gap-2 whitespace-nowrap">
            <span className="min-w-0 truncate">
              <Sym s={eq[1]} /> ={' '}
              {typesetExpression(eq[2]).map((n, j) => (
                <Fragment key={j}>{n}</Fragment>
              ))}
            </span>
            {value ? <span className="num ml-auto shrink-0 rounded bg-white px-1 text-stone-900">= {value}</span> : null}
          </div>
        );
      })}
    </div>
  );
}

/**
 * The model in the monospace face, with line numbers; a problem marks its line
 * and underlines the offending token, and its message sits right under that line.
 */
export function ModelEditor({
  value,
  onChange,
  problem,
  values,
}: {
  value: string;
  onChange(v: string): void;
  problem: Problem | null;
  /** The value of each defined quantity at the estimates, with its unit, from the result model. */
  values?: Record<string, string>;
}) {
  const id = useId();
  const gutter = useRef<HTMLDivElement>(null);
  const layer = useRef<HTMLPreElement>(null);
  const lines = value.split('\n');
  const errLine = problem?.location?.line;
  const token = problem?.location?.token;
  const column = problem?.location?.column;
  const rows = Math.max(3, lines.length + 1);

  const markLine = (text: string, i: number) => {
    if (i + 1 !== errLine) return text || ' ';
    let at = -1;
    let len = 0;
    if (column) {
      at = column - 1;
      len = Math.max(1, token?.length ?? 1);
    } else if (token) {
      const m = new RegExp(`(^|[^A-Za-z0-9_])(${token.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')})(?![A-Za-z0-9_])`).exec(text);
      if (m) {
        at = m.index + m[1].length;
        len = token.length;
      }
    }
    if (at < 0 || at >= text.length) return text || ' ';
    return (
      <>
        {text.slice(0, at)}
        <mark className="bg-transparent text-transparent underline decoration-caution-500 decoration-wavy decoration-2 underline-offset-4">{text.slice(at, at + len)}</mark>
        {text.slice(at + len)}
      </>
    );
  };

  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-xs font-medium text-stone-700">
        Model equation(s) <span className="font-normal text-stone-600">— one “name = expression” per line; the last line gives the measurand; # starts a comment</span>
      </label>
      <div className={`relative flex overflow-hidden rounded-md border bg-white focus-within:outline-2 focus-within:outline-accent-600 ${problem ? 'border-caution-500' : 'border-stone-300'}`}>
        <div ref={gutter} aria-hidden className="num select-none overflow-hidden border-r border-stone-200 bg-stone-50 px-2 py-2 text-right text-sm leading-6 text-stone-500">
          {Array.from({ length: rows }, (_, i) => (
            <div key={i} className={i + 1 === errLine ? 'font-semibold text-caution-700' : ''}>
              {i + 1 === errLine ? '⚠' : i + 1}
            </div>
          ))}
        </div>
        <div className="relative flex-1">
          <pre ref={layer} aria-hidden className="num pointer-events-none absolute inset-0 m-0 overflow-hidden whitespace-pre px-3 py-2 text-sm leading-6 text-transparent">
            {lines.map((l, i) => (
              <div key={i} className={i + 1 === errLine ? 'bg-caution-100' : ''}>
                {markLine(l, i)}
              </div>
            ))}
          </pre>
          <textarea
            id={id}
            value={value}
            onChange={(e) => onChange(e.target.value)}
            onScroll={(e) => {
              if (gutter.current) gutter.current.scrollTop = e.currentTarget.scrollTop;
              if (layer.current) {
                layer.current.scrollTop = e.currentTarget.scrollTop;
                layer.current.scrollLeft = e.currentTarget.scrollLeft;
              }
            }}
            rows={rows}
            spellCheck={false}
            autoCapitalize="off"
            autoCorrect="off"
            wrap="off"
            aria-invalid={!!problem}
            aria-describedby={problem ? `${id}-err` : undefined}
            className="num relative block w-full resize-y whitespace-pre bg-transparent px-3 py-2 text-sm leading-6 text-stone-900 outline-none"
          />
        </div>
        {values ? <TypesetModel lines={Array.from({ length: rows }, (_, i) => lines[i] ?? '')} values={values} /> : null}
      </div>
      {problem ? (
        <p id={`${id}-err`} role="alert" className="rounded-md bg-caution-50 px-2 py-1 text-sm text-caution-700">
          <span className="font-semibold">
            {errLine ? `Line ${errLine}${column ? `, column ${column}` : ''}` : 'Model'}
            {token ? (
              <>
                {' '}
                at “<span className="num">{token}</span>”
              </>
            ) : null}
            :
          </span>{' '}
          {plainMessage(problem)}
        </p>
      ) : (
        <p className="text-xs text-stone-600">Allowed: + − * / ^, parentheses, numbers, pi, e, and sqrt exp log log10 sin cos tan asin acos atan atan2 abs min max.</p>
      )}
    </div>
  );
}
