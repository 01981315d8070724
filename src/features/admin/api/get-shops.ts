import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { AdminShopsResponse } from '@shared/schemas/admin';
import { adminKeys } from './admin-keys';

export const getShops = () => api<AdminShopsResponse>('/api/admin/shops');

export const shopsQueryOptions = () => queryOptions({ queryKey: adminKeys.shops(), queryFn: getShops, staleTime: 5 * 60_000 });

export const useShops = () => useQuery(shopsQueryOptions());
