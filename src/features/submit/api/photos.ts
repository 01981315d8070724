import type { PhotoView } from '@shared/schemas/views';
import { api, uploadWithProgress } from '../../../lib/api-client';

export const photoLimits = {
  maxBytes: 8 * 1024 * 1024,
  maxCount: 12,
  types: ['image/jpeg', 'image/png', 'image/webp'] as const,
};

type PhotosAnswer = { photos: PhotoView[] } | { items: PhotoView[] } | PhotoView[];

/** The routes answer with the revision's photo list; accept the list wrapped or bare. */
export function photosOf(answer: unknown): PhotoView[] | null {
  if (Array.isArray(answer)) return answer as PhotoView[];
  if (answer && typeof answer === 'object') {
    const a = answer as Record<string, unknown>;
    if (Array.isArray(a.photos)) return a.photos as PhotoView[];
    if (Array.isArray(a.items)) return a.items as PhotoView[];
  }
  return null;
}

export function uploadPhoto(submissionId: number, file: File, caption: string, onProgress: (f: number) => void) {
  const form = new FormData();
  form.append('photos', file);
  form.append('captions', JSON.stringify([caption]));
  return uploadWithProgress<PhotosAnswer>(`/api/submissions/${submissionId}/photos`, form, onProgress);
}

export const savePhotoOrder = (submissionId: number, photos: { id: string; caption: string }[]) =>
  api<PhotosAnswer>(`/api/submissions/${submissionId}/photos`, { method: 'PATCH', body: { photos } });

export const deletePhoto = (submissionId: number, photoId: string) =>
  api<PhotosAnswer | undefined>(`/api/submissions/${submissionId}/photos/${encodeURIComponent(photoId)}`, { method: 'DELETE' });
