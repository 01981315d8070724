import { newFileId, type Storage } from '../../storage/disk-storage';

/** Every accepted photo is stored re-encoded as WebP under a random id, with a thumbnail beside it. */
export const thumbId = (fileId: string) => `${fileId}_t`;
export const storedType = 'image/webp';

/** Writes a photo and its thumbnail under a new id; if either write fails, neither file stays. */
export async function storePhotoFiles(storage: Storage, photo: { full: Buffer; thumb: Buffer }): Promise<string> {
  const fileId = newFileId();
  try {
    await storage.put(fileId, photo.full);
    await storage.put(thumbId(fileId), photo.thumb);
  } catch (err) {
    await removePhotoFiles(storage, fileId);
    throw err;
  }
  return fileId;
}

/** Removes a photo and its thumbnail; a file already gone is fine. */
export async function removePhotoFiles(storage: Storage, fileId: string | null) {
  if (!fileId) return;
  await storage.remove(fileId).catch(() => undefined);
  await storage.remove(thumbId(fileId)).catch(() => undefined);
}
