import { useState } from 'react';
import { Link } from 'react-router';
import type { CarView } from '@shared/schemas/cars';
import { Page } from '../../../components/ui/page';
import { Loading, ErrorNotice } from '../../../components/ui/query-state';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/caution';
import { paths } from '../../../config/paths';
import { useUnits } from '../../../lib/units';
import { useMyCars } from '../api/get-cars';
import { useCreateCar, useDeleteCar, useUpdateCar } from '../api/save-car';
import { CarForm } from './car-form';
import { VehicleFiguresList } from '../../../components/vehicle-figures';
import { chassisName } from '@shared/chassis-label';

export const wheelLabel = (w: { wheelDiameterIn: number; wheelWidthIn: number; wheelOffsetMm: number }) =>
  `${w.wheelDiameterIn}×${w.wheelWidthIn} ET${w.wheelOffsetMm}`;

/** `carActions`: more for each car's card (e.g. following it) */
export default function MyCarsPage({ carActions }: { carActions?: (car: CarView) => React.ReactNode } = {}) {
  const cars = useMyCars();
  const create = useCreateCar();
  return (
    <Page
      title="My cars"
      heading="My cars"
      lead="Keep each car’s chassis, wheel and tyre here. Swap sheets can then fill ‘Check my wheel’ from a car in one click, work out the brake balance from your car’s own figures, and chassis pages mark which swaps clear your wheel."
    >
      <div className="grid gap-8">
        {cars.isPending ? (
          <Loading label="Loading your cars…" />
        ) : cars.isError ? (
          <ErrorNotice error={cars.error} />
        ) : cars.data.length === 0 ? (
          <p className="rounded-lg border border-dashed border-ink/25 bg-paper-card p-6 text-graphite">
            No cars yet. Add the first one below.
          </p>
        ) : (
          <ul className="grid gap-4 md:grid-cols-2" aria-label="Your cars">
            {cars.data.map((car) => (
              <li key={car.id}>
                <CarCard car={car} actions={carActions?.(car)} />
              </li>
            ))}
          </ul>
        )}
        <section aria-labelledby="add-car-h" className="rounded-xl border border-ink/15 bg-paper-card p-4 sm:p-6">
          <h2 id="add-car-h" className="mb-4 text-lg font-extrabold text-ink">
            Add a car
          </h2>
          <CarForm saving={create.isPending} onSave={(input) => create.mutateAsync(input)} />
        </section>
        <Caution topics={['wheels', 'fasteners']} />
      </div>
    </Page>
  );
}

function CarCard({ car, actions }: { car: CarView; actions?: React.ReactNode }) {
  const units = useUnits();
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const update = useUpdateCar();
  const remove = useDeleteCar();
  if (editing) {
    return (
      <div className="rounded-xl border border-ink/30 bg-paper-card p-4">
        <CarForm
          car={car}
          saving={update.isPending}
          onSave={(input) => update.mutateAsync({ id: car.id, input }).then(() => setEditing(false))}
          onCancel={() => setEditing(false)}
        />
      </div>
    );
  }
  return (
    <article className="flex h-full flex-col rounded-xl border border-ink/10 bg-paper-card p-4 shadow-sm">
      <h3 className="text-lg font-extrabold text-ink">{car.nickname}</h3>
      <p className="text-sm text-graphite-soft">
        <Link to={paths.chassis(car.chassis.slug)} className="font-bold text-ink underline decoration-brass underline-offset-2">
          {chassisName(car.chassis)}
        </Link>{' '}
        ({car.chassis.yearFrom}–{car.chassis.yearTo ?? 'on'})
      </p>
      <dl className="tabular mt-3 grid grid-cols-3 gap-2 text-sm">
        <div className="rounded-md bg-paper px-2 py-1">
          <dt className="text-xs text-graphite-soft">Wheel</dt>
          <dd className="font-extrabold">{wheelLabel(car)}</dd>
        </div>
        <div className="rounded-md bg-paper px-2 py-1">
          <dt className="text-xs text-graphite-soft">Tyre</dt>
          <dd className="font-extrabold">{car.tyre || '—'}</dd>
        </div>
        <div className="rounded-md bg-paper px-2 py-1">
          <dt className="text-xs text-graphite-soft">Spacer</dt>
          <dd className="font-extrabold">{car.spacerMm > 0 ? units.length(car.spacerMm) : 'None'}</dd>
        </div>
      </dl>
      <div className="mt-2 text-sm" data-car-fitted>
        <p className="font-bold text-graphite">{car.fitted.length ? 'Fitted' : 'Stock brakes and wheels'}</p>
        {car.fitted.length > 0 && (
          <ul className="list-disc pl-5 text-graphite">
            {car.fitted.map((f) => (
              <li key={f.slug}>
                <Link to={paths.swapRevision(f.slug, f.revisionNumber)} className="text-ink underline">
                  {f.title}
                </Link>
              </li>
            ))}
          </ul>
        )}
        {car.otherChanges && <p className="text-graphite-soft">Also: {car.otherChanges}</p>}
      </div>
      <p className="mt-2 text-xs text-graphite-soft" data-car-figures>
        {car.vehicle ? 'Brake balance: this car’s own figures.' : 'Brake balance: the chassis’ stock figures.'}
      </p>
      {car.vehicle && (
        <details className="mt-1 text-xs">
          <summary className="cursor-pointer font-bold text-ink">Show the figures</summary>
          <VehicleFiguresList vehicle={car.vehicle} className="mt-1" />
        </details>
      )}
      <p className="mt-1 text-xs text-graphite-soft" data-testid="profile-status">
        {car.wheelInsideProfile
          ? `Wheel inside profile: ${car.wheelInsideProfile.length} points, drawn on each swap’s sheet.`
          : 'No wheel inside profile yet: edit the car to measure it.'}
      </p>
      {actions && <div className="mt-3">{actions}</div>}
      <div className="mt-auto flex flex-wrap items-center gap-2 pt-4">
        <Button variant="secondary" onClick={() => setEditing(true)}>
          Edit
        </Button>
        {confirming ? (
          <>
            <Button variant="danger" disabled={remove.isPending} onClick={() => remove.mutate(car.id)}>
              {remove.isPending ? 'Removing…' : `Remove ${car.nickname}`}
            </Button>
            <Button variant="quiet" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </>
        ) : (
          <Button variant="quiet" onClick={() => setConfirming(true)}>
            Remove
          </Button>
        )}
        <Link
          to={paths.search(`chassis=${car.chassis.slug}&wheel=${car.wheelDiameterIn}`)}
          className="ml-auto text-sm font-bold text-ink underline"
        >
          Swaps for this car
        </Link>
      </div>
      {remove.error && (
        <p role="alert" className="mt-2 text-sm font-semibold text-oxide">
          {remove.error.message}
        </p>
      )}
    </article>
  );
}
