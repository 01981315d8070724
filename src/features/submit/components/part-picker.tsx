import { useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { partKindLabels } from '@shared/schemas/enums';
import type { CataloguePartOption } from '@shared/schemas/catalogue';
import { SearchCombobox } from '../../../components/search-combobox';
import { Button } from '../../../components/ui/button';
import { useDebounced } from '../../../lib/use-debounced';
import { usePartMatch, usePartSearch } from '../api/catalogue-parts';
import type { FormValues } from '../lib/form-values';

const numbersOf = (p: CataloguePartOption) => p.partNumbers.join(', ');

function PartOptionText({ part }: { part: CataloguePartOption }) {
  return (
    <>
      <span className="font-bold">{part.name}</span>{' '}
      <span className="text-graphite-soft">
        · {partKindLabels[part.kind]}
        {part.maker ? ` · ${part.maker}` : ''} · <span className="tabular">{numbersOf(part)}</span>
      </span>
    </>
  );
}

/**
 * A part line starts from the catalogue: find the part by name, maker or number, or type a new one; a new
 * part whose maker and number the catalogue already holds is offered as that part.
 */
export function PartPicker({ index }: { index: number }) {
  const { setValue } = useFormContext<FormValues>();
  const prefix = `data.parts.${index}` as const;
  const [partId, maker, numbers, name] = useWatch<
    FormValues,
    [`${typeof prefix}.partId`, `${typeof prefix}.maker`, `${typeof prefix}.partNumbers`, `${typeof prefix}.name`]
  >({
    name: [`${prefix}.partId`, `${prefix}.maker`, `${prefix}.partNumbers`, `${prefix}.name`],
  });
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 200);
  const search = usePartSearch(q);
  const typedMaker = useDebounced(maker ?? '', 300);
  const typedNumbers = useDebounced(numbers ?? '', 300);
  const match = usePartMatch(partId ? '' : typedMaker, partId ? '' : typedNumbers);

  const use = (part: CataloguePartOption) => {
    const opts = { shouldDirty: true, shouldValidate: false };
    setValue(`${prefix}.partId`, String(part.id), opts);
    setValue(`${prefix}.kind`, part.kind, opts);
    setValue(`${prefix}.name`, part.name, opts);
    setValue(`${prefix}.maker`, part.maker, opts);
    setValue(`${prefix}.partNumbers`, numbersOf(part), opts);
    setValue(`${prefix}.cameOn`, part.cameOn.join('\n'), opts);
    setText('');
  };

  if (partId) {
    return (
      <div className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-ink/20 bg-ink-faint px-3 py-2 text-sm sm:col-span-2">
        <p>
          <span className="font-bold text-ink">From the catalogue:</span> {name}
        </p>
        <Button variant="quiet" onClick={() => setValue(`${prefix}.partId`, '', { shouldDirty: true })}>
          Not this part
        </Button>
      </div>
    );
  }

  const found = match.data;
  return (
    <div className="flex flex-col gap-2 sm:col-span-2">
      <SearchCombobox
        label="Find it in the catalogue"
        placeholder="Name, maker or part number"
        hint="Pick the part if it is listed; otherwise fill in the fields below to propose it."
        query={text}
        onQueryChange={setText}
        items={search.data ?? []}
        itemKey={(p) => p.id}
        renderItem={(p) => <PartOptionText part={p} />}
        onPick={use}
        loading={search.isFetching}
        emptyText="Not in the catalogue yet: fill in the fields below."
      />
      {found && (
        <div
          role="status"
          className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-brass/50 bg-paper px-3 py-2 text-sm"
        >
          <p>
            <span className="font-bold text-ink">Already in the catalogue:</span> {found.number} by {found.part.maker} is{' '}
            <PartOptionText part={found.part} />
          </p>
          <Button variant="secondary" onClick={() => use(found.part)}>
            Use the existing part
          </Button>
        </div>
      )}
    </div>
  );
}
