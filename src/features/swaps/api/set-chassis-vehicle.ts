import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChassisView } from '@shared/schemas/views';
import type { ChassisVehicleInput } from '@shared/schemas/vehicle';
import { api } from '../../../lib/api-client';
import { swapKeys } from './swap-keys';

/** A reviewer sets or removes a chassis' stock brake-balance figures. */
export const useSetChassisVehicle = (slug: string) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ChassisVehicleInput) =>
      api<{ chassis: ChassisView }>(`/api/chassis/${slug}/vehicle`, { method: 'PATCH', body: input }).then((r) => r.chassis),
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: swapKeys.chassis(slug) }),
        qc.invalidateQueries({ queryKey: swapKeys.chassisList() }),
      ]),
  });
};
