import { axleWord } from '@shared/schemas/swap-data-labels';
import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import type { PlanView } from '@shared/schemas/plans';
import type { CarView } from '@shared/schemas/cars';
import { paths } from '../../../config/paths';
import { Page } from '../../../components/ui/page';
import { Button } from '../../../components/ui/button';
import { ErrorNotice, Loading } from '../../../components/ui/query-state';
import { Caution, cautionTopicsOf } from '../../../components/caution';
import { UnitsToggle } from '../../../components/units-toggle';
import { useDeletePlan, usePlan, useRefreshPlan, useUpdatePlan } from '../api/plans';
import {
  PlanBrakes,
  PlanCosts,
  PlanMachining,
  PlanParts,
  PlanSection,
  PlanTimeAndTools,
  PlanTorque,
  PlanWheels,
} from './plan-sections';

/**
 * A build plan: several swaps on one car, computed together from the car as it is. `cars` are the
 * signed-in member's cars on this chassis, offered when the plan is theirs to change.
 */
export function PlanPage({ cars = [] }: { cars?: CarView[] }) {
  const { id = '' } = useParams();
  const plan = usePlan(id);
  if (plan.isPending)
    return (
      <Page title="Plan">
        <Loading label="Working out the plan…" />
      </Page>
    );
  if (plan.isError)
    return (
      <Page title="Plan not found">
        <ErrorNotice error={plan.error} />
      </Page>
    );
  return <PlanSheet plan={plan.data} cars={cars.filter((c) => c.chassis.id === plan.data.chassis.id)} />;
}

function PlanSheet({ plan, cars }: { plan: PlanView; cars: CarView[] }) {
  const topics = cautionTopicsOf(plan.touches);
  const chassisName = `${plan.chassis.make} ${plan.chassis.model}`;
  return (
    <Page
      title={plan.title}
      heading={plan.title}
      lead={
        <>
          {plan.swaps.length} swaps for a{' '}
          <Link className="font-bold text-ink underline" to={paths.chassis(plan.chassis.slug)}>
            {chassisName}
          </Link>
          {plan.pinned && <> · made by {plan.pinned.shop.name}, its swaps kept at the revisions quoted</>}
          {plan.owner && !plan.pinned && <> · by {plan.owner.name}</>}
        </>
      }
      actions={
        <div className="flex flex-wrap gap-2 print:hidden">
          <UnitsToggle />
          <Button variant="secondary" onClick={() => window.print()}>
            Print the build sheet
          </Button>
        </div>
      }
    >
      <div className="grid grid-cols-[minmax(0,1fr)] gap-8 print:gap-4">
        <Caution topics={topics} />
        <StartingPoint plan={plan} cars={cars} />
        <PlanSection id="plan-swaps" title="Swaps in the plan">
          <SwapList plan={plan} />
        </PlanSection>
        <PlanSection id="plan-brakes" title="Brake balance and lock order">
          <PlanBrakes plan={plan} />
        </PlanSection>
        <PlanSection id="plan-wheels" title="Wheels, spacers and wheel bolts">
          <PlanWheels plan={plan} />
        </PlanSection>
        <PlanSection id="plan-parts" title="Parts for the whole car">
          <PlanParts plan={plan} />
        </PlanSection>
        <PlanSection id="plan-machining" title="Machining, in the order of work">
          <PlanMachining plan={plan} />
        </PlanSection>
        <PlanSection id="plan-torque" title="Torque table">
          <PlanTorque plan={plan} />
        </PlanSection>
        <PlanSection id="plan-costs" title="Cost per route">
          <PlanCosts plan={plan} />
        </PlanSection>
        <PlanSection id="plan-time" title="Time and tools">
          <PlanTimeAndTools plan={plan} />
        </PlanSection>
        {plan.canEdit && <DeletePlan id={plan.id} />}
      </div>
      {/* repeated at the foot of every printed page */}
      <p className="hidden text-[7pt] text-graphite print:fixed print:inset-x-0 print:bottom-0 print:block print:border-t print:border-graphite/30 print:bg-white print:pt-1">
        Safety: torque every fastener to spec, bleed and bed in the brakes, check the brake balance, and have the work inspected
        by a qualified technician; local rules come first. Swapyard plan {plan.id}.
      </p>
    </Page>
  );
}

function StartingPoint({ plan, cars }: { plan: PlanView; cars: CarView[] }) {
  const update = useUpdatePlan();
  const car = plan.car;
  return (
    <div className="rounded-lg border border-ink/20 bg-paper-card p-4 text-sm" data-plan-start>
      <p className="font-bold text-graphite">
        {car ? `Starts from ${car.nickname} as it is` : `Starts from a stock ${plan.chassis.make} ${plan.chassis.model}`}
      </p>
      {car && (
        <p className="mt-1 text-graphite">
          {car.fitted.length ? <>Already fitted: {car.fitted.map((f) => f.title).join('; ')}.</> : 'No swaps fitted yet.'} Wheel{' '}
          {car.wheel.diameterIn}×{car.wheel.widthIn}″ ET{car.wheel.offsetMm}
          {car.wheel.spacerMm ? ` with a ${car.wheel.spacerMm} mm spacer` : ''}.
          {car.otherChanges && ` Other changes: ${car.otherChanges}`}
        </p>
      )}
      {plan.canEdit && cars.length > 0 && (
        <label className="mt-2 flex flex-wrap items-center gap-2 print:hidden">
          <span className="font-bold">For which car</span>
          <select
            className="min-h-10 rounded-md border border-ink/30 bg-paper px-2"
            value={car?.id ?? ''}
            disabled={update.isPending}
            onChange={(e) => update.mutate({ id: plan.id, input: { carId: e.target.value ? Number(e.target.value) : null } })}
          >
            <option value="">A stock car</option>
            {cars.map((c) => (
              <option key={c.id} value={c.id}>
                {c.nickname}
              </option>
            ))}
          </select>
        </label>
      )}
      {update.error && (
        <p role="alert" className="mt-1 font-bold text-oxide">
          {update.error.message}
        </p>
      )}
    </div>
  );
}

function SwapList({ plan }: { plan: PlanView }) {
  const refresh = useRefreshPlan();
  const stale = plan.swaps.filter((s) => s.newerRevision);
  return (
    <div className="grid gap-3">
      <ul className="grid gap-2 text-sm">
        {plan.swaps.map((s) => (
          <li key={s.slug} className="rounded-md border border-graphite/15 px-3 py-2">
            <span className="font-bold">{axleWord(s.axle)}:</span>{' '}
            <Link className="font-bold text-ink underline" to={paths.swapRevision(s.slug, s.revisionNumber)}>
              {s.title}
            </Link>{' '}
            <span className="text-graphite-soft">(revision {s.revisionNumber})</span>
            {s.newerRevision && (
              <p className="mt-1 text-graphite" data-newer-revision>
                <span className="font-bold text-brass-deep">Revision {s.newerRevision.number} is approved since: </span>
                {s.newerRevision.summary}{' '}
                <Link
                  className="font-bold text-ink underline print:hidden"
                  to={paths.swapCompare(s.slug, s.revisionNumber, s.newerRevision.number)}
                >
                  What changed
                </Link>
              </p>
            )}
          </li>
        ))}
      </ul>
      {stale.length > 0 && plan.canEdit && !plan.pinned && (
        <div className="print:hidden">
          <Button variant="secondary" disabled={refresh.isPending} onClick={() => refresh.mutate({ id: plan.id, input: null })}>
            Use the newest revisions
          </Button>
        </div>
      )}
    </div>
  );
}

function DeletePlan({ id }: { id: string }) {
  const del = useDeletePlan();
  const navigate = useNavigate();
  const [asking, setAsking] = useState(false);
  return (
    <div className="flex flex-wrap items-center gap-2 print:hidden">
      {asking ? (
        <>
          <span className="text-sm font-bold">Delete this plan? Its address stops working.</span>
          <Button
            variant="danger"
            disabled={del.isPending}
            onClick={() => del.mutate(id, { onSuccess: () => void navigate(paths.home()) })}
          >
            Delete
          </Button>
          <Button variant="quiet" onClick={() => setAsking(false)}>
            Keep it
          </Button>
        </>
      ) : (
        <Button variant="quiet" onClick={() => setAsking(true)}>
          Delete the plan
        </Button>
      )}
    </div>
  );
}
