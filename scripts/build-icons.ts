// Renders the app icon (assets/icons/icon.svg) to the PNG that electron-builder turns into each
// platform's icon (.icns, .ico, Linux sizes): 1024 px square, as macOS asks for its largest size.
import fs from 'node:fs';
import { Resvg } from '@resvg/resvg-js';

const source = new URL('../assets/icons/icon.svg', import.meta.url);
const target = new URL('../assets/icons/icon.png', import.meta.url);
const png = new Resvg(fs.readFileSync(source, 'utf8'), { fitTo: { mode: 'width', value: 1024 }, font: { loadSystemFonts: false } }).render().asPng();
fs.writeFileSync(target, png);
console.log(`Wrote ${target.pathname} (${png.length} bytes).`);
