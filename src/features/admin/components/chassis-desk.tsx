import { useState } from 'react';
import type { AdminChassis, ChassisPatch } from '@shared/schemas/catalogue-admin';
import { chassisLabel } from '@shared/chassis-label';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { TextArea, TextInput } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/query-state';
import { ChassisCombobox } from '../../../components/chassis-combobox';
import { useDebounced } from '../../../lib/use-debounced';
import { useAdminChassis, useApproveChassis, useEditChassis, useMergeChassis } from '../api/catalogue';
import { changedOnly, EditorForm, errorsOf, MergeConfirm, type Errors } from './catalogue-forms';

type Draft = Record<
  | 'make'
  | 'model'
  | 'code'
  | 'yearFrom'
  | 'yearTo'
  | 'body'
  | 'lugCount'
  | 'pcdMm'
  | 'centreBoreMm'
  | 'wheelBoltThread'
  | 'notes',
  string
>;

const draftOf = (c: AdminChassis): Draft => ({
  make: c.make,
  model: c.model,
  code: c.code,
  yearFrom: String(c.yearFrom),
  yearTo: c.yearTo === null ? '' : String(c.yearTo),
  body: c.body,
  lugCount: String(c.lugCount),
  pcdMm: String(c.pcdMm),
  centreBoreMm: String(c.centreBoreMm),
  wheelBoltThread: c.wheelBoltThread,
  notes: c.notes,
});

// an empty or unreadable number goes to the server as written, which names the field
const numberOf = (s: string) => (s.trim() !== '' && Number.isFinite(Number(s)) ? Number(s) : s);

function patchOf(c: AdminChassis, d: Draft): ChassisPatch {
  const all = {
    make: d.make,
    model: d.model,
    code: d.code,
    yearFrom: numberOf(d.yearFrom),
    yearTo: d.yearTo.trim() === '' ? null : numberOf(d.yearTo),
    body: d.body,
    lugCount: numberOf(d.lugCount),
    pcdMm: numberOf(d.pcdMm),
    centreBoreMm: numberOf(d.centreBoreMm),
    wheelBoltThread: d.wheelBoltThread,
    notes: d.notes,
  };
  return changedOnly(c as unknown as Record<string, unknown>, all) as ChassisPatch;
}

const fieldsShown: { key: keyof Draft; label: string; hint?: string; inputMode?: 'numeric' | 'decimal' }[] = [
  { key: 'make', label: 'Make' },
  { key: 'model', label: 'Model' },
  { key: 'code', label: 'Chassis code' },
  { key: 'body', label: 'Body' },
  { key: 'yearFrom', label: 'First year', inputMode: 'numeric' },
  { key: 'yearTo', label: 'Last year', hint: 'Empty if still built', inputMode: 'numeric' },
  { key: 'lugCount', label: 'Wheel bolts per hub', inputMode: 'numeric' },
  { key: 'pcdMm', label: 'Bolt circle (PCD), mm', inputMode: 'decimal' },
  { key: 'centreBoreMm', label: 'Centre bore, mm', inputMode: 'decimal' },
  { key: 'wheelBoltThread', label: 'Wheel-bolt thread' },
];

function ChassisEditor({ chassis, onDone }: { chassis: AdminChassis; onDone: () => void }) {
  const [draft, setDraft] = useState(() => draftOf(chassis));
  const [errors, setErrors] = useState<Errors>(null);
  const edit = useEditChassis();
  const save = () => {
    const patch = patchOf(chassis, draft);
    if (Object.keys(patch).length === 0) return onDone();
    edit.mutate({ id: chassis.id, patch }, { onSuccess: onDone, onError: (e) => setErrors(errorsOf(e)) });
  };
  return (
    <EditorForm
      label={`Edit ${chassisLabel(chassis)}`}
      errors={errors}
      pending={edit.isPending}
      onSubmit={save}
      onCancel={onDone}
    >
      {fieldsShown.map((f) => (
        <TextInput
          key={f.key}
          label={f.label}
          hint={f.hint}
          inputMode={f.inputMode}
          value={draft[f.key]}
          error={errors?.fields[f.key]}
          onChange={(e) => setDraft({ ...draft, [f.key]: e.target.value })}
        />
      ))}
      <TextArea
        label="Notes"
        rows={3}
        className="sm:col-span-2"
        value={draft.notes}
        error={errors?.fields.notes}
        onChange={(e) => setDraft({ ...draft, notes: e.target.value })}
      />
    </EditorForm>
  );
}

function ChassisMerge({ chassis, all }: { chassis: AdminChassis; all: AdminChassis[] }) {
  const [slug, setSlug] = useState<string | null>(null);
  const [errors, setErrors] = useState<Errors>(null);
  const merge = useMergeChassis();
  const options = all.filter((c) => !c.proposed && c.id !== chassis.id);
  const into = options.find((c) => c.slug === slug) ?? null;
  return (
    <div className="mt-3 rounded-lg border border-ink/15 bg-paper p-3">
      <ChassisCombobox
        label="Keep this chassis instead"
        options={options}
        value={slug}
        onChange={setSlug}
        hint={`Its ${chassis.swapCount} swap${chassis.swapCount === 1 ? '' : 's'} and ${chassis.carCount} car${chassis.carCount === 1 ? '' : 's'} move there.`}
      />
      <MergeConfirm
        what={chassisLabel(chassis)}
        into={into && chassisLabel(into)}
        pending={merge.isPending}
        errors={errors}
        onConfirm={() => into && merge.mutate({ id: chassis.id, intoId: into.id }, { onError: (e) => setErrors(errorsOf(e)) })}
      />
    </div>
  );
}

function ChassisCard({ chassis, all }: { chassis: AdminChassis; all: AdminChassis[] }) {
  const [open, setOpen] = useState<'edit' | 'merge' | null>(null);
  const [errors, setErrors] = useState<Errors>(null);
  const approve = useApproveChassis();
  return (
    <li className="rounded-lg border border-graphite/15 bg-paper-card p-3 sm:p-4">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <p className="font-bold text-ink">
            {chassisLabel(chassis)} {chassis.proposed && <Badge tone="brass">Proposed, not public</Badge>}
          </p>
          <p className="tabular text-sm text-graphite-soft">
            {chassis.lugCount}×{chassis.pcdMm} · bore {chassis.centreBoreMm} mm · {chassis.wheelBoltThread} · {chassis.swapCount}{' '}
            swap{chassis.swapCount === 1 ? '' : 's'} · {chassis.carCount} car{chassis.carCount === 1 ? '' : 's'}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {chassis.proposed && (
            <Button
              disabled={approve.isPending}
              onClick={() => approve.mutate(chassis.id, { onError: (e) => setErrors(errorsOf(e)) })}
              aria-label={`Approve ${chassisLabel(chassis)}`}
            >
              Approve
            </Button>
          )}
          <Button variant="secondary" aria-expanded={open === 'edit'} onClick={() => setOpen(open === 'edit' ? null : 'edit')}>
            Edit
          </Button>
          <Button variant="secondary" aria-expanded={open === 'merge'} onClick={() => setOpen(open === 'merge' ? null : 'merge')}>
            Merge into…
          </Button>
        </div>
      </div>
      {errors && (
        <p role="alert" className="mt-2 text-sm font-semibold text-oxide">
          {errors.message}
        </p>
      )}
      {open === 'edit' && <ChassisEditor chassis={chassis} onDone={() => setOpen(null)} />}
      {open === 'merge' && <ChassisMerge chassis={chassis} all={all} />}
    </li>
  );
}

/** Chassis, proposed ones first; each can be corrected, approved or folded into another. */
export function ChassisDesk() {
  const [search, setSearch] = useState('');
  const q = useDebounced(search.trim(), 250);
  const list = useAdminChassis(q);
  const all = useAdminChassis('');
  return (
    <section aria-labelledby="chassis-desk" className="space-y-3">
      <h2 id="chassis-desk" className="text-xl font-extrabold text-ink">
        Chassis
      </h2>
      <TextInput
        label="Find a chassis"
        placeholder="Make, model or code"
        value={search}
        onChange={(e) => setSearch(e.target.value)}
      />
      {list.isPending ? (
        <Loading />
      ) : (
        <ul className="space-y-3">
          {(list.data ?? []).map((c) => (
            <ChassisCard key={c.id} chassis={c} all={all.data ?? []} />
          ))}
          {list.data?.length === 0 && <li className="text-graphite-soft">No chassis matches “{search}”.</li>}
        </ul>
      )}
    </section>
  );
}
