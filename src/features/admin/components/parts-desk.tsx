import { useState } from 'react';
import { Link } from 'react-router';
import { partKindLabels, partKinds, type PartKind } from '@shared/schemas/enums';
import type { AdminPart, PartPatch } from '@shared/schemas/catalogue-admin';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Select, TextArea, TextInput } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/query-state';
import { SearchCombobox } from '../../../components/search-combobox';
import { paths } from '../../../config/paths';
import { useDebounced } from '../../../lib/use-debounced';
import { useAdminParts, useEditPart, useMergePart } from '../api/catalogue';
import { changedOnly, EditorForm, errorsOf, MergeConfirm, type Errors } from './catalogue-forms';

const listOf = (text: string, by: RegExp) =>
  text
    .split(by)
    .map((s) => s.trim())
    .filter(Boolean);

/** a list's error may sit on one of its rows (`partNumbers.2`) */
const fieldError = (errors: Errors, list: string) =>
  errors ? Object.entries(errors.fields).find(([k]) => k === list || k.startsWith(`${list}.`))?.[1] : undefined;

const partText = (p: AdminPart) => `${p.name}${p.maker ? ` · ${p.maker}` : ''} · ${p.partNumbers.join(', ')}`;

function PartEditor({ part, onDone }: { part: AdminPart; onDone: () => void }) {
  const [draft, setDraft] = useState({
    kind: part.kind,
    name: part.name,
    maker: part.maker,
    partNumbers: part.partNumbers.join(', '),
    cameOn: part.cameOn.join('\n'),
    notes: part.notes,
  });
  const [errors, setErrors] = useState<Errors>(null);
  const edit = useEditPart();
  const save = () => {
    const patch = changedOnly(part as unknown as Record<string, unknown>, {
      kind: draft.kind,
      name: draft.name,
      maker: draft.maker,
      partNumbers: listOf(draft.partNumbers, /,/),
      cameOn: listOf(draft.cameOn, /\n/),
      notes: draft.notes,
    }) as PartPatch;
    if (Object.keys(patch).length === 0) return onDone();
    edit.mutate({ id: part.id, patch }, { onSuccess: onDone, onError: (e) => setErrors(errorsOf(e)) });
  };
  const set = (key: keyof typeof draft) => (e: { target: { value: string } }) => setDraft({ ...draft, [key]: e.target.value });
  return (
    <EditorForm label={`Edit ${part.name}`} errors={errors} pending={edit.isPending} onSubmit={save} onCancel={onDone}>
      <Select
        label="Kind"
        value={draft.kind}
        error={errors?.fields.kind}
        onChange={(e) => setDraft({ ...draft, kind: e.target.value as PartKind })}
      >
        {partKinds.map((k) => (
          <option key={k} value={k}>
            {partKindLabels[k]}
          </option>
        ))}
      </Select>
      <TextInput label="Maker" value={draft.maker} error={errors?.fields.maker} onChange={set('maker')} />
      <TextInput label="Name" className="sm:col-span-2" value={draft.name} error={errors?.fields.name} onChange={set('name')} />
      <TextInput
        label="Part numbers"
        hint="Separate with commas"
        className="sm:col-span-2"
        value={draft.partNumbers}
        error={fieldError(errors, 'partNumbers')}
        onChange={set('partNumbers')}
      />
      <TextArea
        label="Came on"
        hint="One vehicle per line"
        rows={2}
        value={draft.cameOn}
        error={fieldError(errors, 'cameOn')}
        onChange={set('cameOn')}
      />
      <TextArea label="Notes" rows={2} value={draft.notes} error={errors?.fields.notes} onChange={set('notes')} />
    </EditorForm>
  );
}

function PartMerge({ part }: { part: AdminPart }) {
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 250);
  const found = useAdminParts(q);
  const [into, setInto] = useState<AdminPart | null>(null);
  const [errors, setErrors] = useState<Errors>(null);
  const merge = useMergePart();
  const candidates = q ? (found.data ?? []).filter((p) => p.id !== part.id && p.kind === part.kind) : [];
  return (
    <div className="mt-3 rounded-lg border border-ink/15 bg-paper p-3">
      <SearchCombobox
        label="Keep this part instead"
        placeholder="Name, maker or part number"
        hint={`Only ${partKindLabels[part.kind].toLowerCase()} parts. Its ${part.revisionCount} revision${part.revisionCount === 1 ? '' : 's'} will point there; its numbers join the kept part.`}
        query={text}
        onQueryChange={setText}
        items={candidates}
        itemKey={(p) => p.id}
        renderItem={(p) => partText(p)}
        onPick={(p) => {
          setInto(p);
          setText(partText(p));
        }}
        loading={found.isFetching}
        emptyText="No other part of this kind matches."
      />
      <MergeConfirm
        what={partText(part)}
        into={into && partText(into)}
        pending={merge.isPending}
        errors={errors}
        onConfirm={() => into && merge.mutate({ id: part.id, intoId: into.id }, { onError: (e) => setErrors(errorsOf(e)) })}
      />
    </div>
  );
}

function PartCard({ part }: { part: AdminPart }) {
  const [open, setOpen] = useState<'edit' | 'merge' | null>(null);
  return (
    <li className="rounded-lg border border-graphite/15 bg-paper-card p-3 sm:p-4">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div className="min-w-0">
          <p className="font-bold text-ink">
            <Link to={paths.part(part.id)} className="underline decoration-brass underline-offset-2">
              {part.name}
            </Link>{' '}
            <Badge tone="ink">{partKindLabels[part.kind]}</Badge>
          </p>
          <p className="text-sm text-graphite-soft">
            {part.maker || 'Maker not given'} · <span className="tabular">{part.partNumbers.join(', ')}</span> · in{' '}
            {part.revisionCount} revision{part.revisionCount === 1 ? '' : 's'}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Button variant="secondary" aria-expanded={open === 'edit'} onClick={() => setOpen(open === 'edit' ? null : 'edit')}>
            Edit
          </Button>
          <Button variant="secondary" aria-expanded={open === 'merge'} onClick={() => setOpen(open === 'merge' ? null : 'merge')}>
            Merge into…
          </Button>
        </div>
      </div>
      {open === 'edit' && <PartEditor part={part} onDone={() => setOpen(null)} />}
      {open === 'merge' && <PartMerge part={part} />}
    </li>
  );
}

/** Catalogue parts, by kind and name; each can be corrected or folded into its duplicate. */
export function PartsDesk() {
  const [search, setSearch] = useState('');
  const q = useDebounced(search.trim(), 250);
  const list = useAdminParts(q);
  return (
    <section aria-labelledby="parts-desk" className="space-y-3">
      <h2 id="parts-desk" className="text-xl font-extrabold text-ink">
        Parts
      </h2>
      <TextInput
        label="Find a part"
        placeholder="Name, maker, kind or part number"
        value={search}
        onChange={(e) => setSearch(e.target.value)}
      />
      {list.isPending ? (
        <Loading />
      ) : (
        <ul className="space-y-3">
          {(list.data ?? []).map((p) => (
            <PartCard key={p.id} part={p} />
          ))}
          {list.data?.length === 0 && <li className="text-graphite-soft">No part matches “{search}”.</li>}
        </ul>
      )}
    </section>
  );
}
