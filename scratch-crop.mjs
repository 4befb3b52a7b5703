import sharp from 'sharp';
const [src, top, height, out] = process.argv.slice(2);
const m = await sharp(src).metadata();
const h = Math.min(Number(height), m.height - Number(top));
await sharp(src).extract({ left: 0, top: Number(top), width: m.width, height: h }).toFile(out);
console.log(m.width, m.height);
