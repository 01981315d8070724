import { useState, type ReactNode } from 'react';
import { useLocation } from 'react-router';
import { Field, inputClass, Select } from '../../../components/ui/field';
import { Button } from '../../../components/ui/button';
import { useUnits } from '../../../lib/units';
import { panelLink, toCanonical, toDisplay, unitLabel, type CalcParams, type Quantity } from './calc-params';
import { numberKeyboard } from '../../../lib/number-text';

type PanelProps = {
  id: string;
  title: string;
  lead: ReactNode;
  /** query keys this panel owns, for its copy-link */
  keys: string[];
  /** spans both grid columns; 'results' gives the results the larger share */
  wide?: boolean | 'results';
  form: ReactNode;
  results: ReactNode;
  caution?: ReactNode;
};

export function Panel({ id, title, lead, keys, wide, form, results, caution }: PanelProps) {
  return (
    <section
      id={id}
      aria-labelledby={`${id}-heading`}
      className={`scroll-mt-4 flex min-w-0 flex-col gap-5 rounded-xl border border-graphite/15 bg-paper-card p-4 shadow-sm sm:p-6 ${wide ? 'lg:col-span-2' : ''}`}
    >
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div className="min-w-0 flex-1">
          <h2 id={`${id}-heading`} className="text-xl font-extrabold text-ink">
            {title}
          </h2>
          <p className="mt-1 text-sm text-graphite-soft">{lead}</p>
        </div>
        <CopyLink anchor={id} keys={keys} title={title} />
      </header>
      <div className={`grid gap-5 ${wide === 'results' ? 'lg:grid-cols-[2fr_3fr]' : wide ? 'lg:grid-cols-[3fr_2fr]' : ''}`}>
        <div className="min-w-0">{form}</div>
        <div
          className={`min-w-0 ${wide ? 'lg:sticky lg:top-4 lg:self-start' : ''}`}
          aria-live="polite"
          aria-label={`${title} results`}
          role="region"
        >
          <h3 className="sr-only">Results</h3>
          {results}
        </div>
      </div>
      {caution}
    </section>
  );
}

function CopyLink({ anchor, keys, title }: { anchor: string; keys: string[]; title: string }) {
  const { search } = useLocation();
  const [state, setState] = useState<'idle' | 'copied' | 'manual'>('idle');
  const link = panelLink(search, keys, anchor);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(link);
      setState('copied');
    } catch {
      setState('manual');
    }
  };
  return (
    <div className="flex flex-col items-end gap-1">
      <Button variant="secondary" className="min-h-9 px-3 py-1.5" onClick={copy} aria-label={`Copy link to ${title}`}>
        <svg viewBox="0 0 24 24" className="h-4 w-4" aria-hidden>
          <path
            d="M10 14a4 4 0 0 0 5.7 0l3-3a4 4 0 0 0-5.7-5.7l-1 1M14 10a4 4 0 0 0-5.7 0l-3 3a4 4 0 0 0 5.7 5.7l1-1"
            fill="none"
            stroke="currentColor"
            strokeWidth="2"
            strokeLinecap="round"
          />
        </svg>
        Copy link
      </Button>
      <p role="status" className="text-xs text-graphite-soft">
        {state === 'copied' && 'Link copied'}
      </p>
      {state === 'manual' && (
        <input
          readOnly
          aria-label={`Link to ${title}`}
          value={link}
          onFocus={(e) => e.currentTarget.select()}
          className={`${inputClass} w-64 max-w-full text-xs`}
        />
      )}
    </div>
  );
}

type QuantityFieldProps = {
  params: CalcParams;
  name: string;
  label: string;
  quantity?: Quantity;
  /** fixed unit for inputs that are always given in one unit (wheel inches, ET in mm) */
  unit?: string;
  list?: boolean;
  hint?: ReactNode;
  error?: string;
  placeholder?: string;
  /** may be negative: the field asks a phone for a keyboard with a minus key */
  signed?: boolean;
  /** written with letters (a tyre size, a thread), not a plain number */
  text?: boolean;
  className?: string;
};

/** A number typed in the chosen unit system, kept in the URL in mm / bar. */
export function QuantityField({
  params,
  name,
  label,
  quantity = 'plain',
  unit,
  list = false,
  hint,
  error,
  placeholder,
  signed = false,
  text = false,
  className,
}: QuantityFieldProps) {
  const { system } = useUnits();
  const canonical = params.get(name);
  // What the person typed is kept while it still means the value in the URL; otherwise the URL wins.
  const [draft, setDraft] = useState<{ text: string; canonical: string; system: string } | null>(null);
  const shown =
    draft && draft.canonical === canonical && draft.system === system ? draft.text : toDisplay(canonical, quantity, system, list);
  const shownUnit = unit ?? unitLabel(quantity, system);
  return (
    <Field
      label={
        <>
          {label}
          {shownUnit && <span className="font-semibold text-graphite-soft"> ({shownUnit})</span>}
        </>
      }
      hint={hint}
      error={error}
      className={className}
    >
      {(a11y) => (
        <input
          {...a11y}
          name={name}
          className={`${inputClass} tabular`}
          // a list is typed with separators and a size or thread with letters: they get the full keyboard too
          {...numberKeyboard(signed || list || text)}
          autoComplete="off"
          placeholder={placeholder}
          value={shown}
          onChange={(e) => {
            const text = e.target.value;
            const next = toCanonical(text, quantity, system, list);
            setDraft({ text, canonical: next, system });
            params.set(name, next);
          }}
        />
      )}
    </Field>
  );
}

export function FieldGrid({ children, cols = 2 }: { children: ReactNode; cols?: 2 | 3 }) {
  return <div className={`grid gap-4 ${cols === 3 ? 'sm:grid-cols-3' : 'sm:grid-cols-2'}`}>{children}</div>;
}

export function Fieldset({ legend, children }: { legend: string; children: ReactNode }) {
  return (
    <fieldset className="min-w-0 rounded-lg border border-graphite/15 p-3 sm:p-4">
      <legend className="px-1 text-sm font-extrabold text-ink">{legend}</legend>
      {children}
    </fieldset>
  );
}

/** What the results area says until the inputs are complete and valid. */
export function Waiting({ missing, invalid, general }: { missing: string[]; invalid: boolean; general?: string | null }) {
  return (
    <div className="rounded-lg border border-dashed border-graphite/25 bg-paper p-4 text-sm text-graphite-soft" data-waiting>
      {general ? (
        <p className="font-semibold text-oxide">{general}</p>
      ) : invalid ? (
        <p>Fix the marked field{missing.length ? ' and fill in the rest' : ''} to see the results.</p>
      ) : (
        <p>
          To see the results, enter: <span className="font-semibold text-graphite">{missing.join(', ')}</span>.
        </p>
      )}
    </div>
  );
}

export function ResultGrid({ children }: { children: ReactNode }) {
  return <div className="grid grid-cols-2 gap-3">{children}</div>;
}

export function SubHeading({ children }: { children: ReactNode }) {
  return <h3 className="mb-2 mt-4 text-sm font-extrabold uppercase tracking-wide text-graphite-soft first:mt-0">{children}</h3>;
}

/** A signed figure: "+30 mm", "−2.5 mm", "0 mm" when it rounds to nothing. */
export { withSign } from '../../../components/fit-check-card';

type ChoiceFieldProps = {
  params: CalcParams;
  name: string;
  label: ReactNode;
  options: ReadonlyArray<readonly [value: string, label: string]>;
  /** the first option's value is kept out of the URL, so links stay short */
  hint?: ReactNode;
  error?: string;
  className?: string;
};

/** A choice kept in the URL; the first option is the default and is not written. */
export function ChoiceField({ params, name, label, options, hint, error, className }: ChoiceFieldProps) {
  const fallback = options[0][0];
  const stored = params.get(name);
  const value = options.some(([v]) => v === stored) ? stored : fallback;
  return (
    <Select
      label={label}
      name={name}
      hint={hint}
      error={error}
      className={className}
      value={value}
      onChange={(e) => params.set(name, e.target.value === fallback ? '' : e.target.value)}
    >
      {options.map(([v, text]) => (
        <option key={v} value={v}>
          {text}
        </option>
      ))}
    </Select>
  );
}

/** The value of a choice as the panel reads it (the first option when the URL has none or an unknown one). */
export function choiceOf<T extends string>(params: CalcParams, name: string, options: ReadonlyArray<readonly [T, string]>): T {
  const stored = params.get(name);
  return (options.find(([v]) => v === stored)?.[0] ?? options[0][0]) as T;
}
