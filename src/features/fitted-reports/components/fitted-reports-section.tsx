import { useState } from 'react';
import { useLocation } from 'react-router';
import type { FittedReportView, FittedReportsView, FittedWheelView } from '@shared/schemas/fitted-reports';
import { createFittedReportSchema, evidenceKinds, evidenceLabels } from '@shared/schemas/fitted-reports';
import { fieldErrors } from '@shared/schemas/errors';
import { inToMm, mmToIn } from '@shared/fitment/units';
import { Button } from '../../../components/ui/button';
import { Select, TextArea, TextInput } from '../../../components/ui/field';
import { Loading } from '../../../components/ui/query-state';
import { ApiError } from '../../../lib/api-client';
import { useUnits } from '../../../lib/units';
import { useTypedInUnits } from '../../../lib/use-typed-in-units';
import { paths } from '../../../config/paths';
import {
  useDeleteFittedReport,
  useFittedReports,
  useHideFittedReport,
  useReleaseFittedReport,
  useSaveFittedReport,
  type ReportFields,
} from '../api/fitted-reports';
import { numberKeyboard } from '../../../lib/number-text';
import { formatDate } from '@shared/dates';

type Props = {
  slug: string;
  /** revisions a member may say they followed, newest first */
  revisions: { number: number }[];
  shownNumber: number;
  onChanged?: () => void;
};

const date = (iso: string) => formatDate(iso);

export function useWheelText() {
  const units = useUnits();
  return (w: FittedWheelView) =>
    `${w.diameterIn}×${w.widthIn} ET${w.offsetMm}${w.spacerMm > 0 ? ` + ${units.length(w.spacerMm)} spacer` : ''}`;
}

/** "Fitted by members": the count, the wheels people run, how far the record is verified, and the member's own report. */
export function FittedReportsSection({ slug, revisions, shownNumber, onChanged }: Props) {
  const query = useFittedReports(slug);
  return (
    <section id="fitted" aria-labelledby="fitted-h" className="no-print scroll-mt-20">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2 border-b border-ink/15 pb-1">
        <h2 id="fitted-h" className="text-lg font-extrabold text-ink">
          Fitted by members
        </h2>
        {query.data && (
          <span className="tabular text-sm font-bold text-graphite-soft">
            {query.data.count} {query.data.count === 1 ? 'report' : 'reports'}
          </span>
        )}
      </div>
      {query.isPending ? (
        <Loading label="Loading fitted reports…" />
      ) : query.isError ? (
        <p role="alert" className="text-sm text-oxide">
          Fitted reports could not be loaded: {query.error.message}
        </p>
      ) : (
        <FittedReportsBody view={query.data} slug={slug} revisions={revisions} shownNumber={shownNumber} onChanged={onChanged} />
      )}
    </section>
  );
}

function FittedReportsBody({ view, slug, revisions, shownNumber, onChanged }: Props & { view: FittedReportsView }) {
  const wheelText = useWheelText();
  const { verification: v } = view;
  return (
    <div className="grid gap-6">
      <div className="grid gap-4 md:grid-cols-2">
        <div className="rounded-lg border border-ink/15 bg-paper-card p-4">
          <h3 className="text-sm font-bold uppercase tracking-wide text-graphite-soft">How far this record is verified</h3>
          <ul className="mt-2 space-y-1.5 text-sm" aria-label="Verification">
            <li>
              <span aria-hidden className="font-bold text-ink">
                ✓{' '}
              </span>
              <strong>Reviewed by a moderator</strong> before it was published.
            </li>
            <li>
              <span aria-hidden className={`font-bold ${v.fittedBy > 0 ? 'text-ink' : 'text-graphite-soft'}`}>
                {v.fittedBy > 0 ? '✓ ' : '○ '}
              </span>
              {v.fittedBy > 0 ? (
                <>
                  <strong>
                    Fitted by {v.fittedBy} other {v.fittedBy === 1 ? 'member' : 'members'}
                  </strong>
                  {v.strongest && <>; the strongest evidence: {evidenceLabels[v.strongest].toLowerCase()}</>}.
                </>
              ) : (
                'No other member has reported fitting it yet.'
              )}
            </li>
          </ul>
          {v.fittedBy > 0 && (
            <dl
              className="tabular mt-3 grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-sm"
              aria-label="Evidence behind the reports"
            >
              {evidenceKinds.map((k) => (
                <div key={k} className="contents">
                  <dt className={v.byEvidence[k] ? 'text-graphite' : 'text-graphite-soft'}>{evidenceLabels[k]}</dt>
                  <dd className="text-right font-bold">{v.byEvidence[k]}</dd>
                </div>
              ))}
            </dl>
          )}
        </div>
        <div className="rounded-lg border border-ink/15 bg-paper-card p-4">
          <h3 className="text-sm font-bold uppercase tracking-wide text-graphite-soft">Wheels people run with it</h3>
          {view.wheels.length === 0 ? (
            <p className="mt-2 text-sm text-graphite-soft">None reported yet.</p>
          ) : (
            <ul className="tabular mt-2 space-y-1 text-sm">
              {view.wheels.map((w) => (
                <li key={wheelText(w.wheel)} className="flex justify-between gap-3">
                  <span className="font-bold">{wheelText(w.wheel)}</span>
                  <span className="text-graphite-soft">
                    {w.members} {w.members === 1 ? 'member' : 'members'}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </div>
      </div>

      {view.reports.length > 0 && (
        <ul className="grid gap-3 sm:grid-cols-2" aria-label="Fitted reports">
          {view.reports.map((r) => (
            <li key={r.id}>
              <ReportCard report={r} slug={slug} canModerate={view.canModerate} onChanged={onChanged} />
            </li>
          ))}
        </ul>
      )}

      <div className="no-print">
        <MyReport view={view} slug={slug} revisions={revisions} shownNumber={shownNumber} onChanged={onChanged} />
      </div>
    </div>
  );
}

function ReportCard({
  report,
  slug,
  canModerate,
  onChanged,
}: {
  report: FittedReportView;
  slug: string;
  canModerate: boolean;
  onChanged?: () => void;
}) {
  const wheelText = useWheelText();
  return (
    <article
      className={`flex h-full gap-3 rounded-lg border p-3 ${report.hidden ? 'border-oxide/40 bg-oxide-soft/40' : 'border-ink/10 bg-paper-card'}`}
    >
      {report.photo && (
        <a href={report.photo.url} target="_blank" rel="noopener" className="shrink-0">
          <img
            src={report.photo.thumbUrl}
            alt={`Photo from ${report.member.name}`}
            loading="lazy"
            width={80}
            height={80}
            className="h-20 w-20 rounded-md bg-paper-deep object-cover"
          />
        </a>
      )}
      <div className="min-w-0 flex-1 text-sm">
        <p>
          <strong className="text-ink">{report.member.name}</strong>{' '}
          <span className="text-graphite-soft">
            · revision {report.revisionNumber} · {date(report.createdAt)}
          </span>
        </p>
        <p className="tabular font-bold">{wheelText(report.wheel)}</p>
        <ReportEvidence report={report} />
        {report.note && <p className="mt-1 whitespace-pre-line text-graphite">{report.note}</p>}
        {report.state === 'held' && <p className="mt-1 text-xs font-bold text-brass-deep">Waiting for a moderator</p>}
        {report.hidden && <p className="mt-1 text-xs font-bold text-oxide">Hidden by a moderator</p>}
        {canModerate && <ModerateReport report={report} slug={slug} onChanged={onChanged} />}
      </div>
    </article>
  );
}

/** The measured clearance and what kind of evidence stands behind a report. */
export function ReportEvidence({ report }: { report: FittedReportView }) {
  const units = useUnits();
  return (
    <p className="tabular text-graphite">
      {report.clearanceMm !== null && <>Measured clearance {units.length(report.clearanceMm)} · </>}
      <span className={report.evidence === 'word' ? 'text-graphite-soft' : 'font-semibold text-ink'}>
        {evidenceLabels[report.evidence]}
      </span>
    </p>
  );
}

/** A moderator's buttons on a report: let a held one go live, hide or show it. */
export function ModerateReport({ report, slug, onChanged }: { report: FittedReportView; slug: string; onChanged?: () => void }) {
  const hide = useHideFittedReport(slug, onChanged);
  const release = useReleaseFittedReport(slug, onChanged);
  const error = hide.error ?? release.error;
  return (
    <div className="mt-1 flex flex-wrap items-center gap-1">
      {report.state === 'held' && (
        <Button
          variant="secondary"
          className="!min-h-8 !px-2 text-xs"
          disabled={release.isPending}
          onClick={() => release.mutate(report.id)}
        >
          Let it go live
        </Button>
      )}
      <Button
        variant="quiet"
        className="!min-h-8 !px-2 text-xs"
        disabled={hide.isPending}
        onClick={() => hide.mutate({ id: report.id, hidden: !report.hidden })}
      >
        {report.hidden ? 'Show again' : 'Hide report'}
      </Button>
      {error && (
        <span role="alert" className="text-xs text-oxide">
          {error.message}
        </span>
      )}
    </div>
  );
}

function MyReport({ view, slug, revisions, shownNumber, onChanged }: Props & { view: FittedReportsView }) {
  const location = useLocation();
  const [editing, setEditing] = useState(false);
  const remove = useDeleteFittedReport(slug, onChanged);
  const wheelText = useWheelText();

  if (view.mine && !editing) {
    return (
      <div className="rounded-lg border border-ink/20 bg-ink-faint/40 p-4 text-sm">
        <p className="font-bold text-ink">
          Your report: {wheelText(view.mine.wheel)}, following revision {view.mine.revisionNumber}.
          {view.mine.hidden && <span className="text-oxide"> A moderator has hidden it; only you and moderators see it.</span>}
        </p>
        {view.mine.state === 'held' && !view.mine.hidden && (
          <p role="status" className="mt-1 text-graphite">
            It waits for a moderator: reports from members who are new here are checked before they show and count. Until then
            only you and the moderators see it.
          </p>
        )}
        <div className="mt-2 flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => setEditing(true)}>
            Edit my report
          </Button>
          <Button variant="quiet" disabled={remove.isPending} onClick={() => remove.mutate()}>
            {remove.isPending ? 'Removing…' : 'Remove my report'}
          </Button>
        </div>
        {remove.error && (
          <p role="alert" className="mt-1 text-oxide">
            {remove.error.message}
          </p>
        )}
      </div>
    );
  }
  if (view.cannotReport === 'signed_out') {
    return (
      <p className="text-sm text-graphite">
        Fitted this swap yourself?{' '}
        <a href={paths.signIn(location.pathname + location.search + '#fitted')} className="font-bold text-ink underline">
          Sign in
        </a>{' '}
        to say so, with the wheel you run.
      </p>
    );
  }
  if (view.cannotReport === 'author')
    return <p className="text-sm text-graphite-soft">You wrote this swap; fitted reports come from other members.</p>;
  if (view.cannotReport) return null;
  return (
    <ReportForm
      view={view}
      slug={slug}
      revisions={revisions}
      shownNumber={shownNumber}
      onChanged={onChanged}
      onDone={() => setEditing(false)}
    />
  );
}

function ReportForm({
  view,
  slug,
  revisions,
  shownNumber,
  onChanged,
  onDone,
}: Props & { view: FittedReportsView; onDone: () => void }) {
  const units = useUnits();
  const imperial = units.system === 'imperial';
  const mine = view.mine;
  const save = useSaveFittedReport(slug, Boolean(mine), onChanged);
  const [form, setForm] = useTypedInUnits(
    {
      revisionNumber: String(mine?.revisionNumber ?? shownNumber),
      diameterIn: mine ? String(mine.wheel.diameterIn) : '',
      widthIn: mine ? String(mine.wheel.widthIn) : '',
      offsetMm: mine ? String(mine.wheel.offsetMm) : '',
      spacer: mine ? String(imperial ? Math.round(mmToIn(mine.wheel.spacerMm) * 100) / 100 : mine.wheel.spacerMm) : '0',
      clearance:
        mine?.clearanceMm != null ? String(imperial ? Math.round(mmToIn(mine.clearanceMm) * 100) / 100 : mine.clearanceMm) : '',
      note: mine?.note ?? '',
    },
    { spacer: 'length', clearance: 'length' },
  );
  const [photo, setPhoto] = useState<File | null>(null);
  const [removePhoto, setRemovePhoto] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const set = (k: keyof typeof form) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement>) =>
    setForm((f) => ({ ...f, [k]: e.target.value }));

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    const raw = form.spacer.trim().replace(',', '.');
    const spacerMm = raw === '' ? 0 : imperial ? Math.round(inToMm(Number(raw)) * 10) / 10 : Number(raw);
    const rawGap = form.clearance.trim().replace(',', '.');
    const clearanceMm = rawGap === '' ? null : imperial ? Math.round(inToMm(Number(rawGap)) * 10) / 10 : Number(rawGap);
    const fields: ReportFields = {
      revisionNumber: Number(form.revisionNumber),
      diameterIn: form.diameterIn,
      widthIn: form.widthIn,
      offsetMm: form.offsetMm,
      spacerMm,
      clearanceMm,
      note: form.note,
      ...(removePhoto ? { removePhoto } : {}),
    };
    const parsed = createFittedReportSchema.safeParse(fields);
    if (!parsed.success) return setErrors(fieldErrors(parsed.error.issues));
    setErrors({});
    try {
      await save.mutateAsync({ fields, photo });
      onDone();
    } catch (err) {
      if (err instanceof ApiError) setErrors({ ...err.fields, _: err.message });
      else setErrors({ _: 'Saving failed; your entries are still here. Try again.' });
    }
  };

  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label={mine ? 'Edit my fitted report' : 'I fitted this too'}
      className="rounded-xl border border-ink/15 bg-paper-card p-4"
    >
      <h3 className="text-base font-extrabold text-ink">{mine ? 'Edit my fitted report' : 'I fitted this too'}</h3>
      <p className="mt-1 text-sm text-graphite-soft">
        Say which revision you followed and the wheel you run with it. A measured clearance and a photo of the parts on the car
        make your report count as stronger evidence. One report per member; you can change or remove it later.
      </p>
      <div className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-5">
        <Select
          label="Revision followed"
          value={form.revisionNumber}
          onChange={set('revisionNumber')}
          error={errors.revisionNumber}
          className="col-span-2 sm:col-span-1"
        >
          {revisions.map((r) => (
            <option key={r.number} value={r.number}>
              Revision {r.number}
            </option>
          ))}
        </Select>
        <TextInput
          label="Diameter (in)"
          inputMode="decimal"
          value={form.diameterIn}
          onChange={set('diameterIn')}
          error={errors.diameterIn}
          placeholder="16"
        />
        <TextInput
          label="Width (in)"
          inputMode="decimal"
          value={form.widthIn}
          onChange={set('widthIn')}
          error={errors.widthIn}
          placeholder="7"
        />
        <TextInput
          label="Offset ET (mm)"
          {...numberKeyboard(true)}
          value={form.offsetMm}
          onChange={set('offsetMm')}
          error={errors.offsetMm}
          placeholder="38"
        />
        <TextInput
          label={`Spacer (${units.lengthUnit})`}
          inputMode="decimal"
          value={form.spacer}
          onChange={set('spacer')}
          error={errors.spacerMm}
        />
        <TextInput
          label={`Clearance measured (${units.lengthUnit})`}
          inputMode="decimal"
          value={form.clearance}
          onChange={set('clearance')}
          error={errors.clearanceMm}
          hint="Smallest gap, caliper to wheel"
          className="col-span-2 sm:col-span-1"
        />
        <TextArea
          label="Note"
          rows={2}
          value={form.note}
          onChange={set('note')}
          error={errors.note}
          maxLength={1000}
          hint="What you would tell the next person (optional)"
          className="col-span-2 sm:col-span-2"
        />
        <div className="col-span-2 flex flex-col gap-1">
          <label htmlFor="fitted-photo" className="text-sm font-bold text-graphite">
            Photo (optional)
          </label>
          <input
            id="fitted-photo"
            type="file"
            accept="image/jpeg,image/png,image/webp"
            onChange={(e) => setPhoto(e.target.files?.[0] ?? null)}
            aria-invalid={Boolean(errors.photo)}
            className="text-sm file:mr-3 file:rounded-md file:border file:border-ink/30 file:bg-paper file:px-3 file:py-1.5 file:font-bold file:text-ink"
          />
          <p className="text-xs text-graphite-soft">JPEG, PNG or WebP up to 8 MB; location data is removed.</p>
          {errors.photo && (
            <p role="alert" className="text-sm font-semibold text-oxide">
              {errors.photo}
            </p>
          )}
          {mine?.photo && !photo && (
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={removePhoto} onChange={(e) => setRemovePhoto(e.target.checked)} /> Remove my current
              photo
            </label>
          )}
        </div>
      </div>
      <div className="mt-3 flex flex-wrap items-center gap-2">
        <Button type="submit" disabled={save.isPending}>
          {save.isPending ? 'Saving…' : mine ? 'Save my report' : 'Add my report'}
        </Button>
        {mine && (
          <Button variant="quiet" onClick={onDone}>
            Cancel
          </Button>
        )}
        {errors._ && (
          <p role="alert" className="text-sm font-semibold text-oxide">
            {errors._}
          </p>
        )}
      </div>
    </form>
  );
}
