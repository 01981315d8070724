import { useId, useMemo, useRef, useState } from 'react';
import { listboxKeyDown } from './listbox-keys';
import type { ChassisView } from '@shared/schemas/views';
import { inputClass } from './ui/field';
import { chassisName, codeRepeatsModel } from '@shared/chassis-label';

export type ChassisOption = Pick<ChassisView, 'slug' | 'make' | 'model' | 'code' | 'yearFrom' | 'yearTo'>;

const years = (c: ChassisOption) => `${c.yearFrom}–${c.yearTo ?? 'on'}`;
export const chassisOptionLabel = (c: ChassisOption) => `${chassisName(c)} · ${years(c)}`;

/** A typed year: 1995, 95 or ’95 (two digits read as the nearest past century's year), or a range 1995–1998 / 1995-98. */
function typedYears(word: string, thisYear: number): [number, number] | null {
  const full = (y: string, century = thisYear + 1) => {
    if (y.length === 4) return Number(y);
    const n = Number(y);
    const pivot = century % 100;
    return n <= pivot ? century - pivot + n : century - pivot - 100 + n;
  };
  const one = /^['’]?(\d{2}|\d{4})$/.exec(word);
  if (one) return [full(one[1]), full(one[1])];
  const range = /^['’]?(\d{2}|\d{4})[-–]['’]?(\d{2}|\d{4})$/.exec(word);
  if (!range) return null;
  const from = full(range[1]);
  // "1995-98": the second year in the first one's century
  const to = range[2].length === 2 ? full(range[2], from + 99) : full(range[2]);
  return from <= to ? [from, to] : null;
}

/**
 * Every typed word must appear in make, model or code, or name a year (or range) the car was built in,
 * its first and last years included. A short number matches either way: "31" finds the H31, "95" the cars of 1995.
 */
export function matchesChassis(c: ChassisOption, text: string, thisYear = new Date().getFullYear()) {
  const hay = `${c.make} ${c.model} ${c.code}`.toLowerCase();
  return text
    .toLowerCase()
    .split(/\s+/)
    .filter(Boolean)
    .every((w) => {
      const span = typedYears(w, thisYear);
      const built = span !== null && span[0] <= (c.yearTo ?? 9999) && span[1] >= c.yearFrom;
      if (built) return true;
      if (/^\d{4}$/.test(w) || (span && /[-–]/.test(w))) return false;
      return hay.includes(w) || years(c).includes(w);
    });
}

type Props = {
  options: ChassisOption[];
  value: string | null;
  onChange: (slug: string | null) => void;
  label?: string;
  hint?: string;
  placeholder?: string;
  id?: string;
};

/** One text box over make, model, chassis code and years (ARIA combobox with a list box). */
export function ChassisCombobox({
  options,
  value,
  onChange,
  label = 'Chassis',
  hint,
  placeholder = 'Make, model, code or year',
  id,
}: Props) {
  const autoId = useId();
  const inputId = id ?? `${autoId}-input`;
  const listId = `${autoId}-list`;
  const hintId = hint ? `${autoId}-hint` : undefined;
  const selected = options.find((o) => o.slug === value) ?? null;
  const [text, setText] = useState<string | null>(null);
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const inputRef = useRef<HTMLInputElement>(null);

  const shown = text ?? (selected ? chassisOptionLabel(selected) : '');
  const matches = useMemo(() => (text ? options.filter((o) => matchesChassis(o, text)) : options).slice(0, 50), [options, text]);

  const choose = (o: ChassisOption | null) => {
    onChange(o?.slug ?? null);
    setText(null);
    setOpen(false);
  };

  const onKeyDown = listboxKeyDown({
    items: matches,
    open,
    active,
    setOpen,
    setActive,
    onPick: choose,
    onClose: () => {
      setOpen(false);
      setText(null);
    },
    // Escape on a closed box clears the chosen chassis
    onEscapeClosed: () => {
      if (!value) return false;
      choose(null);
      return true;
    },
  });

  const activeId = open && matches[active] ? `${listId}-${matches[active].slug}` : undefined;

  return (
    <div className="relative flex flex-col gap-1">
      <label htmlFor={inputId} className="text-sm font-bold text-graphite">
        {label}
      </label>
      <div className="relative">
        <input
          ref={inputRef}
          id={inputId}
          type="text"
          role="combobox"
          aria-expanded={open}
          aria-controls={listId}
          aria-autocomplete="list"
          aria-activedescendant={activeId}
          aria-describedby={hintId}
          autoComplete="off"
          spellCheck={false}
          placeholder={placeholder}
          className={`${inputClass} pr-9`}
          value={shown}
          onChange={(e) => {
            setText(e.target.value);
            setActive(0);
            setOpen(true);
          }}
          onFocus={(e) => e.target.select()}
          onClick={() => setOpen(true)}
          onBlur={() => {
            setOpen(false);
            setText(null);
          }}
          onKeyDown={onKeyDown}
        />
        {value && (
          <button
            type="button"
            aria-label={`Clear ${label.toLowerCase()}`}
            className="absolute inset-y-0 right-0 flex w-9 items-center justify-center text-lg text-graphite-soft hover:text-oxide"
            onClick={() => {
              choose(null);
              inputRef.current?.focus();
            }}
          >
            ×
          </button>
        )}
      </div>
      {hint && (
        <p id={hintId} className="text-xs text-graphite-soft">
          {hint}
        </p>
      )}
      <ul
        id={listId}
        role="listbox"
        aria-label={label}
        hidden={!open}
        className="absolute top-full z-20 mt-1 max-h-72 w-full overflow-auto rounded-md border border-ink/15 bg-paper-card py-1 shadow-lg"
      >
        {matches.length === 0 ? (
          <li className="px-3 py-2 text-sm text-graphite-soft" role="presentation">
            No chassis matches “{text}”.
          </li>
        ) : (
          matches.map((o, i) => (
            <li
              key={o.slug}
              id={`${listId}-${o.slug}`}
              role="option"
              aria-selected={o.slug === value}
              className={`cursor-pointer px-3 py-2 text-sm ${i === active ? 'bg-ink-faint text-ink' : 'text-graphite'}`}
              onMouseDown={(e) => e.preventDefault()}
              onMouseEnter={() => setActive(i)}
              onClick={() => choose(o)}
            >
              <span className="font-bold">
                {o.make} {o.model}
              </span>{' '}
              <span className="tabular text-graphite-soft">
                {codeRepeatsModel(o) ? '' : `${o.code} · `}
                {years(o)}
              </span>
            </li>
          ))
        )}
      </ul>
    </div>
  );
}
