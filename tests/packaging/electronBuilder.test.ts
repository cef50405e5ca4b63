// The packaging configuration, checked without packaging (which needs an Electron download): against
// electron-builder's own configuration schema, and for what a release must contain.
import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readPngSize } from '../../main/raster';

const REPO = fileURLToPath(new URL('../../', import.meta.url));
const config = JSON.parse(fs.readFileSync(path.join(REPO, 'electron-builder.json'), 'utf8'));
const pkg = JSON.parse(fs.readFileSync(path.join(REPO, 'package.json'), 'utf8'));

describe('electron-builder.json', () => {
  it('passes electron-builder\'s own configuration check (its scheme.json)', async () => {
    const require = createRequire(import.meta.url);
    const { validateConfiguration } = require('app-builder-lib/out/util/config/config') as { validateConfiguration: (c: unknown, logger: { isEnabled: boolean; add(): void }) => Promise<void> };
    await expect(validateConfiguration(config, { isEnabled: false, add: () => undefined })).resolves.toBeUndefined();
    // And it refuses a misspelt option, so the check above can fail.
    await expect(validateConfiguration({ ...config, linux: { ...config.linux, targett: ['deb'] } }, { isEnabled: false, add: () => undefined })).rejects.toThrow(/does not match the API schema[\s\S]*configuration\.linux/);
  });

  it('names the app with a reverse-DNS id and builds AppImage and deb, nsis, and dmg', () => {
    // Apple's CFBundleIdentifier and electron-builder's appId: reverse-DNS, letters, digits, hyphens and dots.
    expect(config.appId).toMatch(/^[a-z][a-z0-9-]*(\.[a-z0-9-]+){2,}$/);
    expect(config.productName).toBe('Tallyglyph');
    expect(config.linux.target).toEqual(['AppImage', 'deb']);
    expect(config.win.target).toEqual(['nsis']);
    expect(config.mac.target).toEqual(['dmg']);
    // The PDF check runs poppler's pdftoppm: the deb package brings it along.
    expect(config.deb.depends).toContain('poppler-utils');
  });

  it('uses an icon that exists and is at least 512 px square (electron-builder derives .icns and .ico from it)', () => {
    for (const where of [config.linux.icon, config.win.icon, config.mac.icon]) {
      const file = path.join(REPO, where);
      const size = readPngSize(fs.readFileSync(file));
      expect(size.widthPx).toBe(size.heightPx);
      expect(size.widthPx).toBeGreaterThanOrEqual(512);
    }
  });

  it('associates chart documents as an alternate editor of .json, with their own MIME type, without taking over every JSON file', () => {
    const [assoc] = config.fileAssociations;
    expect(assoc).toMatchObject({ ext: 'json', role: 'Editor', rank: 'Alternate', mimeType: 'application/vnd.tallyglyph.chart+json' });
    expect(config.linux.mimeTypes).toContain(assoc.mimeType);
    // The open dialog offers the same extension (main/electron/ipcHandlers FILE_FILTERS.chart).
    const handlers = fs.readFileSync(path.join(REPO, 'main/electron/ipcHandlers.ts'), 'utf8');
    expect(handlers).toMatch(/chart: \{ name: 'Tallyglyph chart', extensions: \[[^\]]*'json'/);
  });

  it('packs the built app and the bundled assets, starts from the built main process, and `npm run dist` runs it', () => {
    expect(config.files).toEqual(expect.arrayContaining(['out/**/*', 'assets/glyphs/**/*', 'package.json']));
    expect(config.extraMetadata.main).toBe(pkg.main);
    expect(pkg.scripts.dist).toBe('electron-vite build && electron-builder --config electron-builder.json');
    expect(pkg.devDependencies['electron-builder']).toMatch(/^\d+\.\d+\.\d+$/);
    // Native renderer modules (resvg) must sit outside the asar archive to load.
    expect(config.asarUnpack).toContain('**/*.node');
    expect(fs.readFileSync(path.join(REPO, '.gitignore'), 'utf8')).toMatch(new RegExp(`^${config.directories.output}/$`, 'm'));
  });
});
