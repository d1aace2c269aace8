import sharp from 'sharp';
const [src, out, top, height] = process.argv.slice(2);
const meta = await sharp(src).metadata();
const h = Math.min(Number(height), meta.height - Number(top));
await sharp(src).extract({ left: 0, top: Number(top), width: meta.width, height: h }).toFile(out);
console.log(meta.width, meta.height);
