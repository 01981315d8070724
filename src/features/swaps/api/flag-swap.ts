import { useMutation, useQueryClient } from '@tanstack/react-query';
import { swapKeys } from './swap-keys';
import { api } from '../../../lib/api-client';
import type { FlagItem } from '@shared/schemas/submissions';
import type { FlagKind } from '@shared/schemas/flags';

export const flagSwap = ({ slug, kind, reason }: { slug: string; kind: FlagKind; reason: string }) =>
  api<FlagItem>(`/api/swaps/${slug}/flags`, { method: 'POST', body: { kind, reason } });

/** A flag about a safety figure shows on the sheet at once: its query is read again. */
export const useFlagSwap = (slug: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { kind: FlagKind; reason: string }) => flagSwap({ slug, ...input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: swapKeys.detail(slug) }),
  });
};
