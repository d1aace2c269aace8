// The photo pipeline on one large upload, in its own process so its peak memory can be read:
// a small picture first (libvips starts up), then the given photo three times through
// prepareImage (every rendition). Prints one line of JSON: the median time and the peak RSS.
//   node --import tsx bench/photo.ts <photo.jpg>
import { readFileSync } from 'node:fs';
import sharp from 'sharp';
import { prepareImage } from '../src/lib/server/media/process';

const file = process.argv[2];
if (!file) {
	console.error('usage: bench/photo.ts <photo.jpg>');
	process.exit(2);
}
const small = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#3a7' } })
	.jpeg()
	.toBuffer();
await prepareImage(small);
const before = process.resourceUsage().maxRSS;
const bytes = readFileSync(file);
const meta = await sharp(bytes).metadata();
const samples: number[] = [];
let renditions = 0;
for (let i = 0; i < 3; i++) {
	const started = performance.now();
	const prepared = await prepareImage(bytes);
	samples.push(performance.now() - started);
	renditions = prepared.renditions.length;
}
samples.sort((a, b) => a - b);
console.log(
	JSON.stringify({
		width: meta.width,
		height: meta.height,
		uploadBytes: bytes.byteLength,
		renditions,
		msMedian: samples[1],
		samples,
		// resourceUsage().maxRSS is in kilobytes.
		peakRssMb: process.resourceUsage().maxRSS / 1024,
		rssBeforeMb: before / 1024
	})
);
