import type { CreateSubmission, SubmissionView, UpdateSubmission } from '@shared/schemas/submissions';
import { api } from '../../../lib/api-client';

/** The first save of a new swap or correction creates the draft revision. */
export const createSubmission = (input: CreateSubmission) =>
  api<SubmissionView>('/api/submissions', { method: 'POST', body: input });

/** Autosave: the whole record each time. */
export const updateSubmission = (id: number, input: UpdateSubmission) =>
  api<SubmissionView>(`/api/submissions/${id}`, { method: 'PATCH', body: input });
