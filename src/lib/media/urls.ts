// Photo renditions and their URLs, shared by the server and the browser.

/** Longest edge of each rendition, in pixels; smaller originals are never enlarged. */
export const RENDITIONS = { thumb: 320, medium: 960, large: 1920 } as const;
export type RenditionSize = keyof typeof RENDITIONS;
export const RENDITION_SIZES = Object.keys(RENDITIONS) as RenditionSize[];

export const isRenditionSize = (value: string): value is RenditionSize => Object.hasOwn(RENDITIONS, value);

export const mediaUrl = (id: number, size: RenditionSize) => `/media/${id}/${size}`;

export function mediaUrls(id: number): Record<RenditionSize, string> {
	return { thumb: mediaUrl(id, 'thumb'), medium: mediaUrl(id, 'medium'), large: mediaUrl(id, 'large') };
}

/** The path of one of our own renditions, e.g. "/media/12/medium"; anything else is not ours. */
export const OWN_MEDIA_PATH = /^\/media\/[1-9]\d{0,15}\/(thumb|medium|large)$/;

/** Upload limits, checked in the browser for a quick answer and again on the server. */
export const MAX_UPLOAD_BYTES = 15 * 1024 * 1024;
export const MAX_INPUT_PIXELS = 40_000_000;
export const ACCEPTED_TYPES = 'image/jpeg,image/png,image/webp,image/avif,image/heic,image/heif,image/gif,image/tiff';
