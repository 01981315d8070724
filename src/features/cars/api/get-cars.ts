import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CarList, CarView } from '@shared/schemas/cars';
import type { ChassisPageView, ChassisView } from '@shared/schemas/views';
import { api, isOffline } from '../../../lib/api-client';
import { keepForReader, readForReader } from '../../../lib/device-copy';
import { carKeys } from './car-keys';

export const myCarsQueryOptions = () =>
  queryOptions({
    queryKey: carKeys.mine(),
    queryFn: () =>
      api<CarList>('/api/cars').then(
        (r) => {
          keepForReader('cars', r.items);
          return r.items;
        },
        (err: unknown) => {
          // the member's cars read in the garage too: the copy this device kept for them
          const kept = isOffline(err) ? readForReader<CarView[]>('cars') : undefined;
          if (kept) return kept;
          throw err;
        },
      ),
  });

/** The member's cars; pass `enabled: false` for a signed-out reader (the API would answer 401). */
export const useMyCars = (enabled = true) => useQuery({ ...myCarsQueryOptions(), enabled });

export const chassisOptionsQueryOptions = () =>
  queryOptions({
    queryKey: carKeys.chassisOptions(),
    queryFn: () => api<{ items: ChassisView[] }>('/api/chassis').then((r) => r.items),
    staleTime: 10 * 60_000,
  });

export const useChassisOptions = () => useQuery(chassisOptionsQueryOptions());

/** Cars on one chassis, for "fill from my car" buttons and chassis-page marks. */
export function carsOnChassis(cars: CarView[] | undefined, chassisSlug: string) {
  return (cars ?? []).filter((c) => c.chassis.slug === chassisSlug);
}

/** The approved swaps of one chassis, offered as "fitted to this car". */
export const useChassisSwaps = (slug: string | null) =>
  useQuery({
    queryKey: carKeys.chassisSwaps(slug ?? ''),
    queryFn: () => api<ChassisPageView>(`/api/chassis/${slug}`).then((r) => r.swaps),
    enabled: Boolean(slug),
    staleTime: 5 * 60_000,
  });
