// Limits on photo uploads, in one place for the endpoint, the multipart reader and the island's messages.
export const MAX_PHOTO_BYTES = 12 * 1024 * 1024;
/** Room for the multipart boundaries and the alt text and caption fields around the file. */
export const MAX_UPLOAD_REQUEST_BYTES = MAX_PHOTO_BYTES + 64 * 1024;
export const acceptedPhotoTypes = ['image/jpeg', 'image/png', 'image/webp', 'image/avif'] as const;
export type AcceptedPhotoType = (typeof acceptedPhotoTypes)[number];
