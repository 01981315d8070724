import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ShopPageView, ShopView, UpdateShop } from '@shared/schemas/shops';
import { api } from '../../../lib/api-client';
import { shopKeys } from './shop-keys';

export const shopPageQueryOptions = (slug: string) =>
  queryOptions({ queryKey: shopKeys.page(slug), queryFn: () => api<ShopPageView>(`/api/shops/${slug}`) });

export const useShopPage = (slug: string) => useQuery(shopPageQueryOptions(slug));

export const useUpdateShop = (slug: string) => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateShop) =>
      api<{ shop: ShopView }>(`/api/shops/${slug}`, { method: 'PATCH', body: input }).then((r) => r.shop),
    onSuccess: () => qc.invalidateQueries({ queryKey: shopKeys.page(slug) }),
  });
};
