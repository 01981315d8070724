import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReviewDetail } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { reviewKeys } from './review-keys';

export const reviewDetailQueryOptions = (revisionId: number) =>
  queryOptions({ queryKey: reviewKeys.detail(revisionId), queryFn: () => api<ReviewDetail>(`/api/review/${revisionId}`) });

export const useReviewDetail = (revisionId: number) =>
  useQuery({ ...reviewDetailQueryOptions(revisionId), enabled: Number.isInteger(revisionId) && revisionId > 0 });
