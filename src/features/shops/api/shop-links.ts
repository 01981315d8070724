import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type {
  CreateShopLinkInput,
  PinnedSheetView,
  ShopLinkItem,
  ShopLinkList,
  UpdateShopLinkInput,
} from '@shared/schemas/shops';
import { api } from '../../../lib/api-client';
import { shopKeys } from './shop-keys';

export const shopLinksQueryOptions = () =>
  queryOptions({ queryKey: shopKeys.links(), queryFn: () => api<ShopLinkList>('/api/shop-links') });

export const useShopLinks = () => useQuery(shopLinksQueryOptions());

export const pinnedSheetQueryOptions = (code: string) =>
  queryOptions({
    queryKey: shopKeys.pinned(code),
    queryFn: () => api<PinnedSheetView>(`/api/l/${encodeURIComponent(code)}`),
    retry: false,
  });

export const usePinnedSheet = (code: string | null) =>
  useQuery({ ...pinnedSheetQueryOptions(code ?? ''), enabled: Boolean(code) });

export const qrUrl = (code: string, type: 'png' | 'svg', download = false) =>
  `/api/shop-links/${code}/qr.${type}${download ? '?download=1' : ''}`;

export const useCreateShopLink = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateShopLinkInput) =>
      api<{ link: ShopLinkItem }>('/api/shop-links', { method: 'POST', body: input }).then((r) => r.link),
    onSuccess: () => qc.invalidateQueries({ queryKey: shopKeys.all }),
  });
};

export const useUpdateShopLink = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ code, ...changes }: { code: string } & UpdateShopLinkInput) =>
      api<{ link: ShopLinkItem }>(`/api/shop-links/${code}`, { method: 'PATCH', body: changes }).then((r) => r.link),
    onSuccess: () => qc.invalidateQueries({ queryKey: shopKeys.all }),
  });
};

export const useRetireShopLink = () => {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (code: string) =>
      api<{ link: ShopLinkItem }>(`/api/shop-links/${code}/retire`, { method: 'POST' }).then((r) => r.link),
    onSuccess: () => qc.invalidateQueries({ queryKey: shopKeys.all }),
  });
};
