import { useMutation } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { FlagItem } from '@shared/schemas/submissions';

export const flagSwap = ({ slug, reason }: { slug: string; reason: string }) =>
  api<FlagItem>(`/api/swaps/${slug}/flags`, { method: 'POST', body: { reason } });

export const useFlagSwap = () => useMutation({ mutationFn: flagSwap });
