// Pictures for demo data, drawn in code: an aquarium seen from the front (a water column that
// darkens with depth, a sloped substrate, rocks, stem plants, grass tufts and a few fish), varied
// by a seed number. No photo is downloaded. storeDemoPhoto() sends the picture through the real
// media pipeline, so demo photos get the same renditions and checks as uploaded ones.
import sharp from 'sharp';
import * as media from '../../../src/lib/server/media';
import type { DbOrTx } from '../../../src/lib/server/db';

/** A small deterministic random number generator (mulberry32), so a seed always draws the same picture. */
export function randomFrom(seed: number): () => number {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

const GREENS = ['#2f7a58', '#4f9470', '#7fb38f', '#1e5b47', '#5d9c3a', '#8bbf4a', '#3f8f6a'];
const REDS = ['#b4533a', '#c7684a', '#a33f4f'];
const ROCKS = ['#8a8d88', '#6f7471', '#9c9a8f', '#7d7a70'];

export interface DrawOptions {
	width?: number;
	height?: number;
	format?: 'jpeg' | 'png';
}

/** The SVG source of a demo aquarium picture. */
export function aquariumSvg(seed: number, width = 1600, height = 1000): string {
	const rnd = randomFrom(seed);
	const pick = <T>(list: readonly T[]) => list[Math.floor(rnd() * list.length)]!;
	const between = (a: number, b: number) => a + rnd() * (b - a);
	const top = `hsl(${Math.round(between(180, 200))}, 55%, ${Math.round(between(72, 82))}%)`;
	const deep = `hsl(${Math.round(between(170, 195))}, 50%, ${Math.round(between(28, 38))}%)`;
	const bedFront = height * between(0.82, 0.88);
	const bedBack = height * between(0.66, 0.74);
	const parts: string[] = [];

	// Background stem plants, tallest at the back.
	const stems = Math.round(between(10, 18));
	for (let i = 0; i < stems; i++) {
		const x = between(0, width);
		const base = bedBack + between(0, 30);
		const tall = between(height * 0.35, height * 0.62);
		const colour = rnd() < 0.2 ? pick(REDS) : pick(GREENS);
		const sway = between(-40, 40);
		parts.push(
			`<path d="M${x.toFixed(1)} ${base.toFixed(1)} Q${(x + sway).toFixed(1)} ${(base - tall / 2).toFixed(1)} ${(x + sway / 2).toFixed(1)} ${(base - tall).toFixed(1)}" stroke="${colour}" stroke-width="4" fill="none"/>`
		);
		for (let y = base - 20; y > base - tall; y -= between(18, 30)) {
			const t = (base - y) / tall;
			const cx = x + sway * t * (1 - t) * 2 + (sway / 2) * t * t;
			const leaf = between(14, 26);
			parts.push(
				`<ellipse cx="${(cx - leaf / 2).toFixed(1)}" cy="${y.toFixed(1)}" rx="${leaf.toFixed(1)}" ry="5" fill="${colour}" transform="rotate(-25 ${(cx - leaf / 2).toFixed(1)} ${y.toFixed(1)})"/>`
			);
			parts.push(
				`<ellipse cx="${(cx + leaf / 2).toFixed(1)}" cy="${y.toFixed(1)}" rx="${leaf.toFixed(1)}" ry="5" fill="${colour}" transform="rotate(25 ${(cx + leaf / 2).toFixed(1)} ${y.toFixed(1)})"/>`
			);
		}
	}

	// The substrate: a slope from back to front.
	parts.push(
		`<path d="M0 ${bedBack.toFixed(1)} C${(width * 0.3).toFixed(1)} ${(bedBack + 20).toFixed(1)}, ${(width * 0.7).toFixed(1)} ${(bedFront - 40).toFixed(1)}, ${width} ${bedFront.toFixed(1)} L${width} ${height} L0 ${height} Z" fill="url(#bed)"/>`
	);

	// Rocks.
	const rocks = Math.round(between(2, 5));
	for (let i = 0; i < rocks; i++) {
		const cx = between(width * 0.1, width * 0.9);
		const cy = between(bedBack + 10, bedFront);
		const w = between(80, 220);
		const h = between(60, 170);
		const points = Array.from({ length: 7 }, (_, k) => {
			const angle = Math.PI + (k / 6) * Math.PI;
			const r = between(0.75, 1);
			return `${(cx + Math.cos(angle) * w * r).toFixed(1)},${(cy + Math.sin(angle) * h * r).toFixed(1)}`;
		});
		parts.push(
			`<polygon points="${points.join(' ')} ${(cx + w).toFixed(1)},${(cy + 10).toFixed(1)} ${(cx - w).toFixed(1)},${(cy + 10).toFixed(1)}" fill="${pick(ROCKS)}" stroke="#55524a" stroke-width="2"/>`
		);
	}

	// Foreground grass tufts.
	for (let x = between(0, 30); x < width; x += between(12, 30)) {
		const base = bedFront + between(-10, 40);
		const colour = pick(GREENS);
		for (let k = 0; k < 3; k++) {
			const h = between(20, 60);
			parts.push(
				`<line x1="${x.toFixed(1)}" y1="${base.toFixed(1)}" x2="${(x + between(-10, 10)).toFixed(1)}" y2="${(base - h).toFixed(1)}" stroke="${colour}" stroke-width="3"/>`
			);
		}
	}

	// A small shoal.
	const fish = Math.round(between(4, 10));
	const shoalX = between(width * 0.2, width * 0.8);
	const shoalY = between(height * 0.2, height * 0.45);
	const fishColour = pick(['#d9e6f0', '#e0633f', '#f2c14e', '#4ab0d9']);
	for (let i = 0; i < fish; i++) {
		const x = shoalX + between(-180, 180);
		const y = shoalY + between(-70, 70);
		const dir = rnd() < 0.8 ? 1 : -1;
		parts.push(
			`<g transform="translate(${x.toFixed(1)} ${y.toFixed(1)}) scale(${dir} 1)"><ellipse rx="18" ry="7" fill="${fishColour}"/><polygon points="-16,0 -28,-8 -28,8" fill="${fishColour}"/><rect x="-10" y="-2" width="22" height="3" fill="#2a6f8f" opacity="0.7"/></g>`
		);
	}

	return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">
<defs>
<linearGradient id="water" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="${top}"/><stop offset="1" stop-color="${deep}"/></linearGradient>
<linearGradient id="bed" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#6b5a45"/><stop offset="1" stop-color="#3b3026"/></linearGradient>
<linearGradient id="shine" x1="0" y1="0" x2="1" y2="0"><stop offset="0" stop-color="#ffffff" stop-opacity="0"/><stop offset="0.5" stop-color="#ffffff" stop-opacity="0.12"/><stop offset="1" stop-color="#ffffff" stop-opacity="0"/></linearGradient>
</defs>
<rect width="${width}" height="${height}" fill="url(#water)"/>
${parts.join('\n')}
<rect width="${width}" height="${(height * 0.6).toFixed(1)}" fill="url(#shine)"/>
<rect x="0" y="0" width="${width}" height="12" fill="#dfe9e6" opacity="0.6"/>
</svg>`;
}

/** A demo aquarium picture as JPEG (default) or PNG bytes. */
export async function drawAquarium(seed: number, options: DrawOptions = {}): Promise<Buffer> {
	const svg = Buffer.from(aquariumSvg(seed, options.width, options.height));
	const image = sharp(svg);
	return options.format === 'png' ? image.png().toBuffer() : image.jpeg({ quality: 85 }).toBuffer();
}

/**
 * Draws a picture and stores it through the media pipeline as a pending photo of `ownerId`; attach
 * it in the seed step with media.attach / media.setPhotos. Its objects are written at once, so a
 * seed step that rolls back afterwards leaves them in the bucket.
 */
export async function storeDemoPhoto(ownerId: string, seed: number, tx?: DbOrTx, options: DrawOptions = {}): Promise<media.UploadResult> {
	return media.upload(ownerId, await drawAquarium(seed, options), { db: tx });
}
