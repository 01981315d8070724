import { useId, useState, type ReactNode } from 'react';
import { listboxKeyDown } from './listbox-keys';
import { inputClass } from './ui/field';

type Props<T> = {
  label: string;
  /** what the member has typed; the parent searches with it */
  query: string;
  onQueryChange: (text: string) => void;
  items: T[];
  itemKey: (item: T) => string | number;
  renderItem: (item: T) => ReactNode;
  onPick: (item: T) => void;
  hint?: string;
  placeholder?: string;
  loading?: boolean;
  emptyText?: string;
};

/**
 * A text box whose list is searched elsewhere (a server search as you type): an ARIA combobox with a list
 * box, arrow keys, Enter to pick and Escape to close, like the chassis box.
 */
export function SearchCombobox<T>({
  label,
  query,
  onQueryChange,
  items,
  itemKey,
  renderItem,
  onPick,
  hint,
  placeholder,
  loading = false,
  emptyText = 'Nothing matches.',
}: Props<T>) {
  const id = useId();
  const inputId = `${id}-input`;
  const listId = `${id}-list`;
  const hintId = hint ? `${id}-hint` : undefined;
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const shown = open && query.trim() !== '';

  const pick = (item: T) => {
    onPick(item);
    setOpen(false);
  };

  // the list shows only while something is typed, so keys act on what is shown
  const onKeyDown = listboxKeyDown({ items, open: shown, active, setOpen, setActive, onPick: pick });

  const optionId = (item: T) => `${listId}-${itemKey(item)}`;
  const activeId = shown && items[active] ? optionId(items[active]) : undefined;

  return (
    <div className="relative flex flex-col gap-1">
      <label htmlFor={inputId} className="text-sm font-bold text-graphite">
        {label}
      </label>
      <input
        id={inputId}
        type="text"
        role="combobox"
        aria-expanded={shown}
        aria-controls={listId}
        aria-autocomplete="list"
        aria-activedescendant={activeId}
        aria-describedby={hintId}
        autoComplete="off"
        spellCheck={false}
        placeholder={placeholder}
        className={inputClass}
        value={query}
        onChange={(e) => {
          onQueryChange(e.target.value);
          setActive(0);
          setOpen(true);
        }}
        onClick={() => setOpen(true)}
        onBlur={() => setOpen(false)}
        onKeyDown={onKeyDown}
      />
      {hint && (
        <p id={hintId} className="text-xs text-graphite-soft">
          {hint}
        </p>
      )}
      <ul
        id={listId}
        role="listbox"
        aria-label={label}
        hidden={!shown}
        className="absolute top-full z-20 mt-1 max-h-72 w-full overflow-auto rounded-md border border-ink/15 bg-paper-card py-1 shadow-lg"
      >
        {items.length === 0 ? (
          <li className="px-3 py-2 text-sm text-graphite-soft" role="presentation">
            {loading ? 'Searching…' : emptyText}
          </li>
        ) : (
          items.map((item, i) => (
            <li
              key={itemKey(item)}
              id={optionId(item)}
              role="option"
              aria-selected={i === active}
              className={`cursor-pointer px-3 py-2 text-sm ${i === active ? 'bg-ink-faint text-ink' : 'text-graphite'}`}
              onMouseDown={(e) => e.preventDefault()}
              onMouseEnter={() => setActive(i)}
              onClick={() => pick(item)}
            >
              {renderItem(item)}
            </li>
          ))
        )}
      </ul>
    </div>
  );
}
