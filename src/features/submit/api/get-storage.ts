import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StorageUse } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';
import { submissionKeys } from './submission-keys';

/** How much of the member's photo quota their unpublished photos use. */
export const storageQueryOptions = () =>
  queryOptions({ queryKey: submissionKeys.storage(), queryFn: () => api<StorageUse>('/api/me/storage'), staleTime: 30_000 });

export const useStorageUse = () => useQuery(storageQueryOptions());
