// Turns uploaded bytes into the stored renditions. The bytes are trusted only once sharp has
// decoded them: the file name and the browser's MIME type are never consulted.
import pLimit from 'p-limit';
import sharp, { type Metadata, type SharpOptions } from 'sharp';
import { DomainError } from '../../errors';
import { MAX_INPUT_PIXELS, MAX_UPLOAD_BYTES, RENDITIONS, RENDITION_SIZES, type RenditionSize } from '../../media/urls';

/** Formats libvips decodes for us. SVG and PDF are refused: they are documents, not photos. */
const ACCEPTED_FORMATS = new Set(['jpeg', 'png', 'webp', 'gif', 'avif', 'heif', 'tiff']);

// libvips threads per image; the queue below runs at most two images at once on the 2-core
// machines we target, and the decoded-image cache is off since every upload is new.
sharp.concurrency(1);
sharp.cache(false);
const queue = pLimit(2);
/** Uploads waiting beyond this are told to try again rather than piling up memory. */
const MAX_WAITING = 8;

export interface Rendition {
	size: RenditionSize;
	data: Buffer;
	width: number;
	height: number;
}

export interface PreparedImage {
	width: number;
	height: number;
	renditions: Rendition[];
}

const sourceOptions = { limitInputPixels: MAX_INPUT_PIXELS, sequentialRead: true } satisfies SharpOptions;

async function prepareNow(bytes: Uint8Array): Promise<PreparedImage> {
	let meta: Metadata;
	try {
		// Only the header is read here; the pixel limit is checked below with a clear message
		// (libvips' own limit would throw the same error as for a file that is no image).
		meta = await sharp(bytes, { limitInputPixels: false }).metadata();
	} catch {
		throw new DomainError(415, 'not-an-image', 'That file is not a picture we can read. Upload a JPEG, PNG, WebP, AVIF, HEIF, GIF or TIFF photo.');
	}
	if (!meta.format || !ACCEPTED_FORMATS.has(meta.format) || !meta.width || !meta.height) {
		throw new DomainError(415, 'not-an-image', 'That file is not a picture we can read. Upload a JPEG, PNG, WebP, AVIF, HEIF, GIF or TIFF photo.');
	}
	// The header is read before any pixel is decoded, so an oversized (or "bomb") picture stops here.
	if (meta.width * meta.height > MAX_INPUT_PIXELS) {
		const mp = ((meta.width * meta.height) / 1e6).toFixed(1);
		throw new DomainError(
			422,
			'too-many-pixels',
			`That picture is ${meta.width} × ${meta.height} pixels (${mp} megapixels); the most we take is ${MAX_INPUT_PIXELS / 1e6} megapixels. Scale it down and try again.`
		);
	}
	try {
		// failOn keeps sharp's default ('warning'): a truncated or corrupt file is refused, not half-read.
		// .rotate() applies the camera's orientation tag; no withMetadata/keepExif, so EXIF (GPS
		// included), XMP, IPTC and ICC data are all left behind.
		const upright = sharp(bytes, sourceOptions).rotate();
		const renditions = await Promise.all(
			RENDITION_SIZES.map(async (size) => {
				const edge = RENDITIONS[size];
				const { data, info } = await upright
					.clone()
					.resize({ width: edge, height: edge, fit: 'inside', withoutEnlargement: true })
					.webp({ quality: size === 'thumb' ? 72 : 80 })
					.toBuffer({ resolveWithObject: true });
				return { size, data, width: info.width, height: info.height };
			})
		);
		const width = meta.autoOrient?.width ?? meta.width;
		const height = meta.autoOrient?.height ?? meta.height;
		return { width, height, renditions };
	} catch (error) {
		if (error instanceof DomainError) throw error;
		throw new DomainError(415, 'unreadable-image', 'That picture could not be read to the end; the file may be damaged. Try exporting it again.');
	}
}

/** Checks and converts one upload, waiting for a free slot in the processing queue. */
export function prepareImage(bytes: Uint8Array): Promise<PreparedImage> {
	if (bytes.byteLength > MAX_UPLOAD_BYTES) {
		return Promise.reject(tooBig(bytes.byteLength));
	}
	if (bytes.byteLength === 0) return Promise.reject(new DomainError(400, 'empty-file', 'That file is empty.'));
	if (queue.pendingCount >= MAX_WAITING) {
		return Promise.reject(new DomainError(503, 'busy', 'Many photos are being processed right now. Try again in a minute.'));
	}
	return queue(() => prepareNow(bytes));
}

export function tooBig(bytes: number): DomainError {
	const mb = (n: number) => (n / 1024 / 1024).toFixed(1);
	return new DomainError(413, 'too-big', `That file is ${mb(bytes)} MB; photos can be at most ${mb(MAX_UPLOAD_BYTES)} MB.`);
}
