import { useRef, useSyncExternalStore } from 'react';
import { Link, useParams } from 'react-router';
import type { SwapSheetView } from '@shared/schemas/views';
import type { BalanceStart } from '@shared/schemas/cars';
import { categoryLabels, machiningLevelLabels } from '@shared/schemas/enums';
import { machiningLevel } from '@shared/schemas/swap-data';
import { useSwap } from '../api/get-swap';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/caution';
import { Markdown } from '../../../components/markdown';
import { PhotoGrid } from '../../../components/photo-grid';
import { chassisLabel } from '../../../components/swap-card';
import { paths } from '../../../config/paths';
import { useUnits } from '../../../lib/units';
import { SheetSection } from './sheet-section';
import {
  PartsSection,
  AdapterSection,
  CalipersSection,
  ShimsSpacersSection,
  RotorsSection,
  MachiningSection,
  TorqueSection,
  TestedWheelsList,
} from './sheet-parts';
import { jobTouches } from '@shared/fitment/swap-checks';
import { cautionTopicsOf } from '../../../components/caution';
import { CostRoutesSection } from './cost-routes';
import { BrakeBalanceSection } from './brake-balance';
import { WheelCheckPanel, type WheelPreset } from './wheel-check-panel';
import { CaliperFitSection } from './caliper-fit-section';
import { PrintedSection, SectionCheck, type ProfiledWheel } from './section-check';
import { RevisionHistory } from './revision-history';
import { SheetSectionMenu } from './sheet-section-menu';
import { OpenFlagNotice } from './open-flag-notice';
import { dateOrDash } from '@shared/dates';

const date = dateOrDash;

const noSubscription = () => () => {};

/** The site's address as the browser sees it; empty while hydrating a page the server drew. */
const useOrigin = () =>
  useSyncExternalStore(
    noSubscription,
    () => window.location.origin,
    () => '',
  );

export default function SwapSheetPage() {
  const { slug = '', n } = useParams();
  const number = n === undefined ? undefined : Number(n);
  const query = useSwap(slug, Number.isInteger(number) ? number : undefined);
  if (query.isPending)
    return (
      <Page>
        <Loading label="Loading the swap sheet…" />
      </Page>
    );
  if (query.isError)
    return (
      <Page title="Swap not found">
        <ErrorNotice error={query.error} />
      </Page>
    );
  return <SwapSheet view={query.data} />;
}

type SwapSheetProps = {
  view: SwapSheetView;
  banner?: React.ReactNode;
  /** "Fill from" buttons of the wheel check (a member's saved cars) */
  presets?: WheelPreset[];
  /** the reader's cars the brake balance may start from (from my cars) */
  carStarts?: BalanceStart[];
  /** sections the app adds from other features (fitted reports, shop link panel), shown before the revision history */
  extraSections?: React.ReactNode;
  /** buttons the app adds beside "Print build sheet" (keep offline) */
  actions?: React.ReactNode;
};

export function SwapSheet({ view, banner, presets, carStarts, extraSections, actions }: SwapSheetProps) {
  const { swap, chassis, revision, history, currentNumber } = view;
  const { data } = revision;
  const { length } = useUnits();
  const origin = useOrigin();
  const isOld = currentNumber !== null && revision.number !== currentNumber;
  const level = machiningLevel(data.machining);
  const touches = jobTouches(data, swap.category);
  const body = useRef<HTMLDivElement>(null);

  return (
    <Page title={data.title}>
      {banner}
      {isOld && (
        <div role="status" className="no-print mb-4 rounded-lg border border-brass bg-brass-soft/50 p-3 text-sm">
          You are reading revision {revision.number}. A newer approved revision ({currentNumber}) exists —{' '}
          <Link to={paths.swap(swap.slug)} className="font-bold text-ink underline">
            read the current one
          </Link>{' '}
          or{' '}
          <Link to={paths.swapCompare(swap.slug, revision.number, currentNumber)} className="font-bold text-ink underline">
            see what changed
          </Link>
          .
        </div>
      )}
      <OpenFlagNotice flags={view.openSafetyFlags} />
      <header className="mb-4 print:mb-3">
        <p className="hidden text-xs text-graphite-soft print:block">
          Build sheet printed from Swapyard · revision {revision.number} approved {date(revision.approvedAt)} ·{' '}
          {origin && `${origin}${paths.swapRevision(swap.slug, revision.number)}`}
        </p>
        <div className="flex flex-wrap gap-2">
          <Badge tone="ink">{swap.axle === 'front' ? 'Front axle' : 'Rear axle'}</Badge>
          <Badge>{categoryLabels[swap.category]}</Badge>
          <Badge tone={level === 'major' || level === 'structural' ? 'oxide' : level === 'minor' ? 'brass' : 'plain'}>
            {machiningLevelLabels[level]}
          </Badge>
          {data.parkingBrake && data.parkingBrake.type !== 'none' && (
            <Badge tone={data.parkingBrake.kept ? 'ink' : 'oxide'}>
              {data.parkingBrake.kept ? 'Parking brake kept' : 'Parking brake lost'}
            </Badge>
          )}
        </div>
        <h1 className="mt-3 text-2xl font-extrabold leading-tight tracking-tight text-ink sm:text-4xl print:text-2xl">
          {data.title}
        </h1>
        <p className="mt-2 text-graphite">
          For the{' '}
          <Link to={paths.chassis(chassis.slug)} className="font-bold text-ink underline decoration-brass underline-offset-2">
            {chassisLabel(chassis)}
          </Link>
          , {swap.axle} axle · {chassis.lugCount}×{chassis.pcdMm} PCD · centre bore {length(chassis.centreBoreMm)} · wheel bolts{' '}
          {chassis.wheelBoltThread}
        </p>
        {data.summary && <p className="mt-3 max-w-3xl text-lg text-graphite print:mt-1 print:text-sm">{data.summary}</p>}
        <dl className="tabular mt-4 grid grid-cols-2 gap-3 text-sm sm:grid-cols-5 print:mt-1 print:flex print:flex-wrap print:gap-x-5 print:gap-y-0">
          <Fact label="Revision" value={`${revision.number}${revision.status === 'approved' && !isOld ? ' (current)' : ''}`} />
          <Fact label="Published" value={date(revision.approvedAt)} />
          <Fact label="Fitted by" value={fittedByText(swap.fittedCount)} />
          <Fact label="Install time" value={data.installHours ? `${data.installHours} h` : '—'} />
          <Fact label="Difficulty" value={data.difficulty ? `${data.difficulty} of 5` : '—'} />
        </dl>
        <p className="mt-3 text-sm text-graphite-soft print:mt-1">
          Written by {revision.author.name}
          {revision.author.login !== swap.author.login && ` (correction to ${swap.author.name}’s record)`} · reviewed by a
          moderator before publication.
        </p>
        <div className="no-print mt-4 flex flex-wrap gap-2">
          <Button variant="secondary" onClick={() => window.print()}>
            Print build sheet
          </Button>
          {actions}
          {data.wheel && (
            <a
              href="#check"
              className="inline-flex min-h-10 items-center rounded-md px-4 text-sm font-bold text-ink hover:bg-ink-faint"
            >
              Check my wheel ↓
            </a>
          )}
        </div>
      </header>

      <SheetSectionMenu sheet={body} />
      <div ref={body} className="print-flow grid grid-cols-1 gap-10">
        <Caution topics={cautionTopicsOf(touches)} />
        <PartsSection parts={data.parts} />
        {data.adapter && <AdapterSection adapter={data.adapter} />}
        {data.calipers.length > 0 && <CalipersSection calipers={data.calipers} />}
        {data.rotors.length > 0 && <RotorsSection rotors={data.rotors} />}
        {data.calipers.length > 0 && (
          // on screen only: the printed build sheet keeps to two pages
          <div className="print:hidden">
            <CaliperFitSection data={data} axle={swap.axle} />
          </div>
        )}
        {(data.shims.length > 0 || data.spacers.length > 0) && <ShimsSpacersSection data={data} />}
        <MachiningSection steps={data.machining} />
        <TorqueSection data={data} />
        {data.wheel && (
          <SheetSection id="wheel" title="Wheel requirement">
            <PrintedSection data={data} axle={swap.axle} mine={profiledPresets(presets)} />
            <dl className="tabular grid grid-cols-2 gap-3 text-sm sm:grid-cols-4">
              <Fact label="Minimum wheel" value={`${data.wheel.minDiameterIn}″`} />
              {data.wheel.barrelInnerDiameterMm && (
                <Fact label="Barrel inner Ø needed" value={length(data.wheel.barrelInnerDiameterMm)} />
              )}
              <Fact label="Caliper beyond rotor edge" value={length(data.wheel.caliperRadialProjectionMm)} />
              <Fact label="Caliper face outboard of hub" value={length(data.wheel.caliperOutboardMm)} />
            </dl>
            {data.wheel.testedWheels.length > 0 && (
              <div className="mt-3 print:hidden">
                <TestedWheelsList wheels={data.wheel.testedWheels} />
              </div>
            )}
            {data.wheel.notes && <p className="mt-2 text-sm text-graphite">{data.wheel.notes}</p>}
          </SheetSection>
        )}
        {data.wheel && <SectionCheck data={data} axle={swap.axle} mine={profiledPresets(presets)} />}
        {data.wheel && (
          <div className="print:hidden">
            <WheelCheckPanel data={data} axle={swap.axle} chassis={chassis} presets={presets} />
          </div>
        )}
        <BrakeBalanceSection data={data} chassis={chassis} carStarts={carStarts} />
        <CostRoutesSection data={data} />
        {data.tools.length > 0 && (
          <SheetSection id="tools" title="Tools needed">
            <ul className="flex flex-wrap gap-2 text-sm print:gap-x-3 print:gap-y-0">
              {data.tools.map((t) => (
                <li key={t} className="rounded-full border border-graphite/20 bg-paper-card px-3 py-1 print:border-0 print:p-0">
                  {t}
                </li>
              ))}
            </ul>
          </SheetSection>
        )}
        {(revision.body || revision.bodyTakenDown) && (
          <div className={revision.bodyTakenDown ? 'print:hidden' : 'print-steps'}>
            <SheetSection id="write-up" title="Write-up" printTitle="Fitting steps and checklist from the write-up">
              {revision.bodyTakenDown ? (
                <p role="note" className="rounded-lg border border-graphite/20 bg-paper-card p-3 text-sm text-graphite">
                  A moderator took the write-up of this revision down. The structured record above stays as it was approved.
                </p>
              ) : (
                <Markdown>{revision.body}</Markdown>
              )}
            </SheetSection>
          </div>
        )}
        {revision.photos.length > 0 && (
          <div className="print:hidden">
            <SheetSection id="photos" title="Photos">
              <PhotoGrid photos={revision.photos} />
            </SheetSection>
          </div>
        )}
        {extraSections && <div className="grid grid-cols-1 gap-10 print:hidden">{extraSections}</div>}
        <div className="print:hidden">
          <RevisionHistory slug={swap.slug} history={history} shown={revision.number} />
        </div>
      </div>
    </Page>
  );
}

/** Who else has reported fitting the swap, in words: nobody is "no one yet", not "0 other members". */
export function fittedByText(count: number): string {
  if (count === 0) return 'No one else yet';
  return `${count} other ${count === 1 ? 'member' : 'members'}`;
}

/** The reader's cars whose wheel inside is recorded, for the section check. */
function profiledPresets(presets: WheelPreset[] = []): ProfiledWheel[] {
  return presets.flatMap((p, i) =>
    p.insideProfile && p.insideProfile.length >= 2
      ? [{ key: `mine-${i}`, label: p.label, profile: p.insideProfile, spacerMm: p.wheel.spacerMm, mine: true }]
      : [],
  );
}

function Fact({ label, value }: { label: string; value: React.ReactNode }) {
  return (
    <div className="rounded-lg bg-paper-card px-3 py-2 shadow-sm print:flex print:items-baseline print:gap-1 print:p-0 print:shadow-none">
      <dt className="text-xs text-graphite-soft">{label}</dt>
      <dd className="font-extrabold text-graphite">{value}</dd>
    </div>
  );
}
