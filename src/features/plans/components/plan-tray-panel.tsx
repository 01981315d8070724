import { axleWord } from '@shared/schemas/swap-data-labels';
import { useNavigate } from 'react-router';
import type { Axle } from '@shared/schemas/enums';
import { paths } from '../../../config/paths';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { addToTray, clearTray, removeFromTray, usePlanTray } from '../api/device-plans';
import { useMakePlan } from '../api/plans';

/**
 * On a swap sheet: gather swaps for one car (front and rear, wheels), then make a plan that computes them
 * together. The tray is kept on this device until the plan is made.
 */
export function PlanTrayPanel({
  swap,
  chassis,
}: {
  swap: { slug: string; title: string; axle: Axle };
  chassis: { id: number; name: string };
}) {
  const tray = usePlanTray();
  const make = useMakePlan();
  const navigate = useNavigate();
  const forThisChassis = tray?.chassisId === chassis.id ? tray : null;
  const inTray = forThisChassis?.swaps.some((s) => s.slug === swap.slug) ?? false;
  const fields = make.error instanceof ApiError ? Object.values(make.error.fields) : [];

  const makePlan = () => {
    if (!forThisChassis) return;
    make.mutate(
      { chassisId: chassis.id, swapSlugs: forThisChassis.swaps.map((s) => s.slug) },
      {
        onSuccess: (made) => {
          clearTray();
          void navigate(paths.plan(made.id));
        },
      },
    );
  };

  return (
    <section
      aria-labelledby="plan-tray-h"
      className="rounded-lg border border-ink/20 bg-paper-card p-4 print:hidden"
      data-plan-tray
    >
      <h2 id="plan-tray-h" className="text-base font-extrabold text-ink">
        Plan the whole car
      </h2>
      <p className="mt-1 text-sm text-graphite-soft">
        A swap changes one axle. Put this one together with the others you mean to fit — a rear to go with a front, the wheels —
        and the plan works out the brake balance, wheels, parts, torque and cost of the car as a whole.
      </p>
      {tray && !forThisChassis && (
        <p className="mt-2 text-sm text-graphite">
          Your plan so far is for a {tray.chassisName}; adding this swap starts a new plan for the {chassis.name}.
        </p>
      )}
      {forThisChassis && (
        <ul className="mt-3 grid gap-1 text-sm" aria-label="Swaps in your plan">
          {forThisChassis.swaps.map((s) => (
            <li key={s.slug} className="flex items-baseline justify-between gap-2 border-b border-graphite/10 py-1">
              <span>
                <span className="font-bold">{axleWord(s.axle)}:</span> {s.title}
              </span>
              <button
                type="button"
                className="whitespace-nowrap text-xs font-bold text-ink underline"
                onClick={() => removeFromTray(s.slug)}
              >
                Take out
              </button>
            </li>
          ))}
        </ul>
      )}
      <div className="mt-3 flex flex-wrap gap-2">
        {!inTray && (
          <Button variant="secondary" onClick={() => addToTray(chassis, swap)}>
            Add this swap to the plan
          </Button>
        )}
        {forThisChassis && (
          <Button onClick={makePlan} disabled={make.isPending}>
            {make.isPending ? 'Making the plan…' : `Make the plan (${forThisChassis.swaps.length})`}
          </Button>
        )}
      </div>
      {make.error && (
        <div role="alert" className="mt-2 text-sm font-bold text-oxide">
          <p>{make.error.message}</p>
          {fields.map((f) => (
            <p key={f}>{f}</p>
          ))}
        </div>
      )}
    </section>
  );
}
