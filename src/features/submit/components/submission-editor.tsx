import { useEffect, useMemo, useRef, useState } from 'react';
import { FormProvider, useForm, useWatch, type Resolver } from 'react-hook-form';
import { Link, useNavigate } from 'react-router';
import { useQueryClient } from '@tanstack/react-query';
import { CHANGE_NOTE_MIN, type SubmissionView } from '@shared/schemas/submissions';
import type { ChassisView, SwapSheetView } from '@shared/schemas/views';
import { revisionStatusLabels, type Axle, type Category } from '@shared/schemas/enums';
import { Page } from '../../../components/ui/page';
import { Badge } from '../../../components/ui/badge';
import { Button, ButtonLink } from '../../../components/ui/button';
import { TextArea } from '../../../components/ui/field';
import { Caution } from '../../../components/caution';
import { ApiError } from '../../../lib/api-client';
import { paths } from '../../../config/paths';
import { submissionKeys } from '../api/submission-keys';
import { useSubmitForReview } from '../api/submit-for-review';
import { useDeleteSubmission } from '../api/delete-submission';
import { useChassisOptions } from '../api/get-chassis-options';
import { errorsOf, formPathOf, newChassisReadable, parsePayload, placeOf, type FormValues } from '../lib/form-values';
import { clearBackup, readBackup, useAutosave } from '../lib/use-autosave';
import { handOver, handedOverForm, releaseHandOver } from '../lib/form-handoff';
import { FieldLink, SaveStatus } from './save-status';
import { ChassisSection } from './chassis-section';
import {
  AdapterSection,
  FastenersSection,
  MachiningSection,
  PartsSection,
  ShimsSpacersSection,
  TitleSection,
} from './parts-sections';
import { CalipersSection, RotorsSection } from './brake-parts-sections';
import { BrakesSection, CostsSection, JobSection, WheelSection, WriteUpSection } from './figures-sections';
import { LiveFigures } from './live-figures';
import { PhotoUploader } from './photo-uploader';
import { DraftExpiryNotice } from './draft-expiry-notice';
import { FormSection } from './form-controls';
import { formatDateTime } from '@shared/dates';

export type EditorMode = { kind: 'new' } | { kind: 'correction'; swap: SwapSheetView } | { kind: 'edit'; view: SubmissionView };

const outline = [
  ['chassis', 'Chassis'],
  ['title', 'Title'],
  ['parts', 'Parts'],
  ['adapter', 'Adapter'],
  ['calipers', 'Calipers'],
  ['rotors', 'Rotors'],
  ['shims', 'Shims & spacers'],
  ['machining', 'Machining'],
  ['torque', 'Fasteners & torque'],
  ['wheel', 'Wheel'],
  ['brakes', 'Brakes'],
  ['costs', 'Costs'],
  ['job', 'The job'],
  ['write-up', 'Write-up'],
  ['photos', 'Photos'],
] as const;

function backupKeyOf(mode: EditorMode) {
  if (mode.kind === 'edit') return `swapyard.draft.${mode.view.id}`;
  if (mode.kind === 'correction') return `swapyard.draft.new.${mode.swap.swap.slug}`;
  return 'swapyard.draft.new';
}

/**
 * The submission form for a new swap, a correction of an approved one, or a draft /
 * sent-back revision. The shared zod schema validates it, exactly as the server will.
 */
export function SubmissionEditor({ mode, initial }: { mode: EditorMode; initial: FormValues }) {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const view = mode.kind === 'edit' ? mode.view : null;
  // the form of /submit, when this draft was created there a moment ago
  const [adopted] = useState(() => (view ? handedOverForm(view.id) : null));
  const handedOver = adopted !== null;
  const swapSlug = mode.kind === 'correction' ? mode.swap.swap.slug : view?.isCorrection ? view.swapSlug : null;
  const backupKey = backupKeyOf(mode);
  const sending = useRef(false);
  const [sendError, setSendError] = useState<string | null>(null);
  const [changeNote, setChangeNote] = useState(view?.changeNote ?? '');
  const [changeNoteError, setChangeNoteError] = useState<string | undefined>();
  // the first field that holds back the send, named and linked beside the button
  const [blocking, setBlocking] = useState<{ path: string; message: string; more: number } | null>(null);
  const [backup, setBackup] = useState(() => {
    const b = readBackup(backupKey);
    const savedAt = view ? Date.parse(view.updatedAt) : 0;
    return b && b.at > savedAt && !handedOver ? b : null;
  });

  const resolver: Resolver<FormValues> = useMemo(
    () => async (values) => {
      const parsed = parsePayload(values, swapSlug);
      return parsed.ok ? { values, errors: {} } : { values: {}, errors: errorsOf(parsed.issues) };
    },
    [swapSlug],
  );
  const form = useForm<FormValues>({
    ...(adopted ? { formControl: adopted } : { defaultValues: initial }),
    resolver,
    mode: 'onTouched',
    reValidateMode: 'onChange',
  });
  const viewId = view?.id ?? null;
  useEffect(() => {
    if (adopted && viewId) releaseHandOver(viewId, adopted);
  }, [adopted, viewId]);

  const autosave = useAutosave({
    form,
    submissionId: view?.id ?? null,
    swapSlug,
    basedOnRevisionId: mode.kind === 'correction' ? mode.swap.revision.id : null,
    enabled: true,
    backupKey,
    savedValues: view && !handedOver ? initial : null,
    savedAt: view?.updatedAt ?? null,
    onCreated: (created) => {
      queryClient.setQueryData(submissionKeys.detail(created.id), created);
      void queryClient.invalidateQueries({ queryKey: submissionKeys.mine() });
      clearBackup(backupKey);
      if (sending.current) return false;
      handOver(created.id, form);
      navigate(paths.editSubmission(created.id), { replace: true });
      return true;
    },
    onSaved: (saved) => {
      queryClient.setQueryData<SubmissionView>(submissionKeys.detail(saved.id), (old) =>
        old ? { ...saved, photos: old.photos } : saved,
      );
    },
  });
  // the adopted form may hold keystrokes typed after the first save
  const { retry } = autosave;
  useEffect(() => {
    if (handedOver) void retry();
  }, [handedOver, retry]);

  const submit = useSubmitForReview();
  const discard = useDeleteSubmission();
  const onDiscard = async () => {
    if (!view || !window.confirm('Delete this draft and its photos? This cannot be undone.')) return;
    try {
      await discard.mutateAsync(view.id);
      clearBackup(backupKey);
      await navigate(paths.mySubmissions(), { replace: true });
      discard.forget(view.id);
    } catch (err) {
      setSendError(err instanceof ApiError ? err.message : 'The draft was not deleted. Try again.');
    }
  };

  /** scroll to a field and put the cursor in it (a row's own problem lands on its first field) */
  const goTo = (path: string) => {
    const section = document.getElementById(placeOf(path).section);
    const field =
      document.querySelector<HTMLElement>(`[name="${CSS.escape(path)}"]`) ??
      document.querySelector<HTMLElement>(`[name^="${CSS.escape(path)}."]`);
    (field ?? section)?.scrollIntoView({ block: 'center' });
    field?.focus({ preventScroll: true });
  };

  const onSend = form.handleSubmit(
    async () => {
      setSendError(null);
      setBlocking(null);
      setChangeNoteError(undefined);
      if (swapSlug && changeNote.trim().length < CHANGE_NOTE_MIN) {
        setChangeNoteError(`Say what changed and why (at least ${CHANGE_NOTE_MIN} characters)`);
        setSendError('It cannot be sent yet: a correction says what it changes and why.');
        return;
      }
      sending.current = true;
      try {
        const saved = await autosave.flush();
        if (!saved.ok || !saved.id) {
          setSendError('The draft could not be saved, so it was not sent. Fix what is marked and try again.');
          return;
        }
        await submit.mutateAsync({ id: saved.id, ...(swapSlug ? { changeNote } : {}) });
        clearBackup(backupKey);
        navigate(paths.editSubmission(saved.id), { replace: true });
        window.scrollTo({ top: 0 });
      } catch (err) {
        if (err instanceof ApiError) {
          // a newer revision was approved meanwhile: the refreshed view offers the merge
          if (err.code === 'behind_current' && view)
            await queryClient.invalidateQueries({ queryKey: submissionKeys.detail(view.id) });
          setChangeNoteError(err.fields.changeNote);
          for (const [path, message] of Object.entries(err.fields))
            if (path !== 'changeNote') form.setError(formPathOf(path) as never, { type: 'server', message });
          setSendError(err.message);
        } else setSendError('It could not be sent. Check the connection and try again.');
      } finally {
        sending.current = false;
      }
    },
    () => {
      const parsed = parsePayload(form.getValues(), swapSlug);
      const issues = parsed.ok ? [] : parsed.issues;
      setSendError(issues.length ? 'It cannot be sent yet: a moderator reads only finished records.' : null);
      setBlocking(issues[0] ? { ...issues[0], more: issues.length - 1 } : null);
      if (issues[0]) goTo(issues[0].path);
    },
  );

  // chassis facts for the live figures
  const chassisList = useChassisOptions();
  const [chassisMode, chassisId, axleValue, categoryValue, newChassis] = useWatch({
    control: form.control,
    name: ['chassisMode', 'chassisId', 'axle', 'category', 'newChassis'],
  });
  const fixedChassis: ChassisView | null =
    mode.kind === 'correction' ? mode.swap.chassis : view?.isCorrection ? view.chassis : null;
  const pickedChassis =
    fixedChassis ??
    (chassisMode === 'existing'
      ? (chassisList.data?.find((c) => String(c.id) === chassisId) ??
        (view && String(view.chassis.id) === chassisId ? view.chassis : null))
      : null);
  const axle: Axle | null = mode.kind === 'correction' ? mode.swap.swap.axle : view?.isCorrection ? view.axle : axleValue || null;
  const category: Category | null =
    mode.kind === 'correction' ? mode.swap.swap.category : view?.isCorrection ? view.category : categoryValue || null;
  const thread =
    pickedChassis?.wheelBoltThread ?? (chassisMode === 'new' ? (newChassisReadable(newChassis)?.wheelBoltThread ?? null) : null);

  const title =
    mode.kind === 'correction'
      ? `Correct “${mode.swap.revision.data.title}”`
      : view
        ? view.status === 'sent_back'
          ? 'Rework and resend'
          : view.isCorrection
            ? 'Correction draft'
            : 'Draft swap'
        : 'Record a swap';
  const photos = view?.photos ?? [];

  return (
    <Page
      title={title}
      heading={title}
      lead={
        mode.kind === 'correction'
          ? `Your correction becomes revision ${(mode.swap.currentNumber ?? mode.swap.revision.number) + 1} once a moderator approves it; until then revision ${mode.swap.revision.number} stays public. It is credited to you.`
          : view?.status === 'sent_back'
            ? 'Change what the moderator asked for below. It saves as you type; send it again when it is ready.'
            : view
              ? 'It saves as you type. Send it for review when it is complete; a moderator checks it before it reaches search.'
              : 'Record a combination you have fitted. It saves as you type; a moderator checks it before it reaches search.'
      }
      actions={
        <div className="flex flex-col items-start gap-1 sm:items-end">
          {view && <Badge tone={view.status === 'sent_back' ? 'oxide' : 'plain'}>{revisionStatusLabels[view.status]}</Badge>}
          <SaveStatus state={autosave.state} onRetry={() => void autosave.retry()} onGo={goTo} />
        </div>
      }
    >
      {view?.behind && (
        <div role="alert" className="mb-6 rounded-xl border-l-4 border-oxide bg-oxide-soft/40 p-4" data-testid="behind-current">
          <h2 className="font-extrabold text-ink">Revision {view.behind.current.number} was approved since you started</h2>
          <p className="mt-2 text-graphite">
            Your correction started from revision {view.basedOn?.number ?? 'an older revision'}. Bring it up to date before you
            send it: what only one of you changed is kept, and where you both changed the same thing you pick which stays.
          </p>
          <ButtonLink to={paths.updateSubmission(view.id)} className="mt-3">
            Bring it up to date
          </ButtonLink>
        </div>
      )}
      {view?.status === 'sent_back' && (
        <div role="alert" className="mb-6 rounded-xl border-l-4 border-brass bg-brass-soft/40 p-4">
          <h2 className="font-extrabold text-ink">A moderator sent this back for rework, with these reasons</h2>
          <p className="mt-2 whitespace-pre-wrap text-graphite">{view.reviewNote || 'No reason was given.'}</p>
          <p className="mt-2 text-sm text-graphite-soft">Change what they asked for, then send it for review again.</p>
        </div>
      )}
      {view?.expiresAt && <DraftExpiryNotice view={{ ...view, expiresAt: view.expiresAt }} />}
      {mode.kind === 'correction' && (
        <p className="mb-6 text-sm">
          <Link to={paths.swap(mode.swap.swap.slug)} className="font-bold text-ink underline">
            Open the current swap sheet
          </Link>{' '}
          to compare while you edit.
        </p>
      )}
      {backup && (
        <div
          role="status"
          className="mb-6 flex flex-wrap items-center justify-between gap-3 rounded-lg border border-brass bg-paper-card p-3 text-sm"
        >
          <span>This device kept input from {formatDateTime(backup.at)} that was never saved.</span>
          <span className="flex gap-2">
            <Button
              variant="secondary"
              onClick={() => {
                form.reset(backup.values, { keepDefaultValues: true });
                setBackup(null);
                void autosave.retry();
              }}
            >
              Restore it
            </Button>
            <Button
              variant="quiet"
              onClick={() => {
                clearBackup(backupKey);
                setBackup(null);
              }}
            >
              Discard
            </Button>
          </span>
        </div>
      )}

      <FormProvider {...form}>
        <form onSubmit={onSend} noValidate className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem] lg:gap-x-8">
          <div className="min-w-0 space-y-6 lg:col-start-1 lg:row-start-1">
            <ChassisSection
              fixed={
                fixedChassis
                  ? {
                      chassis: fixedChassis,
                      axle: axle ?? '',
                      category: mode.kind === 'correction' ? mode.swap.swap.category : (view?.category ?? ''),
                    }
                  : null
              }
            />
            <TitleSection />
            <PartsSection />
            <AdapterSection />
            <CalipersSection />
            <RotorsSection />
            <ShimsSpacersSection />
            <MachiningSection />
            <FastenersSection />
            <WheelSection />
            <BrakesSection chassis={pickedChassis} />
            <CostsSection />
            <JobSection />
            <WriteUpSection />
            <FormSection
              id="photos"
              title="Photos"
              lead="The fitted parts, the clearance at its tightest point, any machining. Captions say what each shows."
            >
              <PhotoUploader submissionId={view?.id ?? null} photos={photos} />
            </FormSection>
          </div>

          <aside className="lg:col-start-2 lg:row-span-2 lg:row-start-1" aria-label="Form outline and figures">
            <div className="space-y-6 lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:overflow-y-auto lg:pr-1">
              <nav aria-label="Form sections" className="hidden lg:block">
                <ul className="flex flex-wrap gap-1 text-sm">
                  {outline.map(([id, label]) => (
                    <li key={id}>
                      <a href={`#${id}`} className="block rounded px-2 py-1 text-ink hover:bg-ink-faint">
                        {label}
                      </a>
                    </li>
                  ))}
                </ul>
              </nav>
              <LiveFigures
                axle={axle}
                category={category}
                wheelBoltThread={thread}
                chassis={pickedChassis}
                photoCount={photos.length}
              />
              <Caution />
            </div>
          </aside>
          <div className="rounded-xl border border-ink/20 bg-paper-card p-4 sm:p-6 lg:col-start-1 lg:row-start-2">
            <h2 className="text-lg font-extrabold text-ink">Send for review</h2>
            <p className="mt-1 text-sm text-graphite-soft">
              A moderator checks the record, the figures and the photos. While it is at the desk you cannot change it; you will
              get an e-mail with the outcome.
            </p>
            {swapSlug && (
              <TextArea
                className="mt-3"
                label="What changed and why"
                hint="Readers see this in the sheet’s history, and the moderator reads it first: which figures or steps you changed, and where the new ones come from."
                rows={3}
                maxLength={2000}
                value={changeNote}
                onChange={(e) => setChangeNote(e.target.value)}
                error={changeNoteError}
              />
            )}
            {sendError && (
              <p role="alert" className="mt-3 font-semibold text-oxide" data-testid="send-error">
                {sendError}
                {blocking && (
                  <>
                    {' '}
                    First: <FieldLink path={blocking.path} onGo={goTo} /> — {blocking.message.toLowerCase()}
                    {blocking.more > 0 && ` (+${blocking.more} more, marked in red)`}.
                  </>
                )}
              </p>
            )}
            <div className="mt-4 flex flex-wrap items-center gap-3">
              <Button type="submit" disabled={form.formState.isSubmitting}>
                {form.formState.isSubmitting
                  ? 'Sending…'
                  : view?.status === 'sent_back'
                    ? 'Send for review again'
                    : 'Send for review'}
              </Button>
              <Link to={paths.mySubmissions()} className="text-sm font-bold text-ink underline">
                My submissions
              </Link>
              {view?.status === 'draft' && (
                <Button
                  variant="quiet"
                  className="ml-auto text-oxide"
                  onClick={() => void onDiscard()}
                  disabled={discard.isPending}
                >
                  Delete draft
                </Button>
              )}
            </div>
          </div>
        </form>
      </FormProvider>
    </Page>
  );
}
