// `npm start`: open the app with the embedded demo. Uses the Electron shell where its runtime is
// installed; elsewhere (no runtime download possible) builds the same UI and serves it locally.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const repo = fileURLToPath(new URL('..', import.meta.url));
const electronReady = existsSync(new URL('../node_modules/electron/path.txt', import.meta.url));
const npx = process.platform === 'win32' ? 'npx.cmd' : 'npx';
const step = (args) => {
  const r = spawnSync(npx, args, { cwd: repo, stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
};

if (electronReady) {
  console.log('tallyglyph: building and opening the desktop app…');
  step(['electron-vite', 'build']);
  spawn(npx, ['electron', '.'], { cwd: repo, stdio: 'inherit' }).on('exit', (code) => process.exit(code ?? 0));
} else {
  console.log('tallyglyph: the Electron runtime is not installed here, so the app opens in your browser instead.');
  step(['vite', 'build', '--config', 'renderer/vite.config.ts', '--logLevel', 'warn']);
  console.log('tallyglyph: open http://127.0.0.1:5317/ (the demo chart loads first). Ctrl+C stops the server.');
  console.log('tallyglyph: for files instead of a window, run: npx tallyglyph demo -o demo-out');
  spawn(npx, ['vite', 'preview', '--config', 'renderer/vite.config.ts'], { cwd: repo, stdio: 'inherit' }).on('exit', (code) => process.exit(code ?? 0));
}
