/** Every accepted photo is stored re-encoded as WebP under a random id, with a thumbnail beside it. */
export const thumbId = (fileId: string) => `${fileId}_t`;
export const storedType = 'image/webp';
