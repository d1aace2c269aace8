// How long the media pipeline takes to check and convert one photo, and how much it stores,
// for a phone-sized and a limit-sized picture. Prints figures from one run on this machine;
// compare the ratios, not the absolute times.
//   npx tsx bench/media.ts
import sharp from 'sharp';
import { prepareImage } from '../src/lib/server/media/process';
import { drawAquarium } from '../scripts/seed/lib/images';

async function photo(width: number, height: number) {
	// A drawn picture with noise on top, so the encoder has detail to work on as with a real photo.
	const base = await drawAquarium(7, { width, height, format: 'png' });
	const noise = await sharp({ create: { width, height, channels: 3, background: '#000', noise: { type: 'gaussian', mean: 0, sigma: 18 } } })
		.png()
		.toBuffer();
	return sharp(base)
		.composite([{ input: noise, blend: 'add' }])
		.jpeg({ quality: 90 })
		.toBuffer();
}

const cases = [
	['12 MP (4000 × 3000)', 4000, 3000],
	['39 MP (7200 × 5400)', 7200, 5400]
] as const;

const results: { label: string; ms: number; inBytes: number; outBytes: number }[] = [];
for (const [label, w, h] of cases) {
	const input = await photo(w, h);
	await prepareImage(input); // warm-up
	const runs = 3;
	const started = performance.now();
	let outBytes = 0;
	for (let i = 0; i < runs; i++) {
		const prepared = await prepareImage(input);
		outBytes = prepared.renditions.reduce((s, r) => s + r.data.byteLength, 0);
	}
	results.push({ label, ms: (performance.now() - started) / runs, inBytes: input.byteLength, outBytes });
}
const first = results[0]!;
for (const r of results) {
	console.log(
		`${r.label.padEnd(22)} ${r.ms.toFixed(0).padStart(6)} ms per photo (${(r.ms / first.ms).toFixed(2)}× the first)  ` +
			`upload ${(r.inBytes / 1048576).toFixed(1)} MB → stored ${(r.outBytes / 1024).toFixed(0)} kB (${((r.outBytes / r.inBytes) * 100).toFixed(1)} %)`
	);
}
