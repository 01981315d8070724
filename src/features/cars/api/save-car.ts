import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CarInput, CarView } from '@shared/schemas/cars';
import { api } from '../../../lib/api-client';
import { carKeys } from './car-keys';

export const useCreateCar = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CarInput) => api<{ car: CarView }>('/api/cars', { method: 'POST', body: input }).then((r) => r.car),
    onSuccess: () => qc.invalidateQueries({ queryKey: carKeys.mine() }),
  });
};

export const useUpdateCar = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: Partial<CarInput> }) =>
      api<{ car: CarView }>(`/api/cars/${id}`, { method: 'PATCH', body: input }).then((r) => r.car),
    onSuccess: () => qc.invalidateQueries({ queryKey: carKeys.mine() }),
  });
};

export const useDeleteCar = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api<void>(`/api/cars/${id}`, { method: 'DELETE' }),
    onSuccess: () => qc.invalidateQueries({ queryKey: carKeys.mine() }),
  });
};
