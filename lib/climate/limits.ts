/** Largest weather file accepted (stated in the upload form, enforced by the upload route). An hourly EPW year is ~1.4–1.7 MB. */
export const MAX_CLIMATE_UPLOAD_BYTES = 10 * 1024 * 1024;
