// Renders the app icon (public/icons/benchlore-icon.svg, our own drawing) to the PNG sizes the web app
// manifest names. Run after changing the drawing: `node --import tsx scripts/pwa-icons.ts`.
import sharp from 'sharp';
import { fileURLToPath } from 'node:url';

const folder = fileURLToPath(new URL('../public/icons/', import.meta.url));
const sizes = [192, 512] as const;

for (const size of sizes) {
  await sharp(`${folder}benchlore-icon.svg`, { density: 300 }).resize(size, size).png().toFile(`${folder}benchlore-${size}.png`);
}
await sharp(`${folder}benchlore-icon.svg`, { density: 300 }).resize(180, 180).png().toFile(`${folder}apple-touch-icon.png`);
console.log(`icons written to ${folder}`);
