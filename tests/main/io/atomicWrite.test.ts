// Atomic replacement rests on rename() replacing the target in one step within a file system
// (POSIX.1-2017, rename(): "...the link named new shall remain visible to other threads throughout the renaming").
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { TallyError } from '../../../shared-core/errors';
import { writeFileAtomic, writeFileAtomicSync } from '../../../main/io/atomicWrite';

let dir: string;
beforeEach(() => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyglyph-atomic-'));
});
afterEach(() => {
  fs.rmSync(dir, { recursive: true, force: true });
});

const ORIGINAL = Buffer.from('<svg>the old, complete file</svg>\n');
const MEGABYTE = new Uint8Array(1 << 20).fill(0x41);

function existing(name = 'chart.svg'): string {
  const target = path.join(dir, name);
  fs.writeFileSync(target, ORIGINAL);
  return target;
}

class ProducerFailed extends Error {}

describe.each([
  ['writeFileAtomic', (target: string, data: Parameters<typeof writeFileAtomicSync>[1]) => writeFileAtomic(target, data)],
  ['writeFileAtomicSync', async (target: string, data: Parameters<typeof writeFileAtomicSync>[1]) => writeFileAtomicSync(target, data)],
])('%s', (_name, write) => {
  it('writes strings, bytes and chunk sequences exactly', async () => {
    const target = path.join(dir, 'out.bin');
    await write(target, 'héllo');
    expect(fs.readFileSync(target, 'utf8')).toBe('héllo');
    await write(target, new Uint8Array([0, 255, 7]));
    expect([...fs.readFileSync(target)]).toEqual([0, 255, 7]);
    await write(target, ['<a>', new Uint8Array([0x62]), '</a>']);
    expect(fs.readFileSync(target, 'utf8')).toBe('<a>b</a>');
    expect(fs.readdirSync(dir)).toEqual(['out.bin']);
  });

  it('replaces an existing file and keeps its permissions', async () => {
    const target = existing();
    fs.chmodSync(target, 0o640);
    await write(target, 'new');
    expect(fs.readFileSync(target, 'utf8')).toBe('new');
    expect(fs.statSync(target).mode & 0o777).toBe(0o640);
  });

  it('leaves an existing file byte-identical when the producer throws part-way, and no temp file behind', async () => {
    const target = existing();
    let sawOldFileMidWrite = false;
    function* producer() {
      yield MEGABYTE;
      // Half the new content is on disk by now, in a temp file beside the target, not in the target.
      sawOldFileMidWrite = fs.readFileSync(target).equals(ORIGINAL) && fs.readdirSync(dir).length === 2;
      yield MEGABYTE;
      throw new ProducerFailed('layout failed');
    }
    await expect(write(target, producer())).rejects.toBeInstanceOf(ProducerFailed);
    expect(sawOldFileMidWrite).toBe(true);
    expect(fs.readFileSync(target).equals(ORIGINAL)).toBe(true);
    expect(fs.readdirSync(dir)).toEqual(['chart.svg']);
  });

  it('creates nothing when the folder is missing, with a plain io-error', async () => {
    const target = path.join(dir, 'missing', 'chart.svg');
    const error = await write(target, 'x').then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(TallyError);
    expect((error as TallyError).code).toBe('io-error');
    expect((error as TallyError).message).toMatch(/folder does not exist/);
    expect(fs.existsSync(path.join(dir, 'missing'))).toBe(false);
    expect(fs.readdirSync(dir)).toEqual([]);
  });

  it('refuses to replace a folder and leaves it as it was', async () => {
    const target = path.join(dir, 'chart.svg');
    fs.mkdirSync(target);
    fs.writeFileSync(path.join(target, 'inside.txt'), 'keep');
    await expect(write(target, 'x')).rejects.toMatchObject({ code: 'io-error' });
    expect(fs.readFileSync(path.join(target, 'inside.txt'), 'utf8')).toBe('keep');
    expect(fs.readdirSync(dir)).toEqual(['chart.svg']);
  });

  it('writes through a symlink to its target and keeps the link', async () => {
    const real = existing('real.svg');
    const link = path.join(dir, 'link.svg');
    fs.symlinkSync(real, link);
    await write(link, 'via link');
    expect(fs.lstatSync(link).isSymbolicLink()).toBe(true);
    expect(fs.readFileSync(real, 'utf8')).toBe('via link');
  });
});

it('writeFileAtomic also takes an async producer', async () => {
  const target = existing();
  async function* producer() {
    yield 'a';
    await new Promise((resolve) => setTimeout(resolve, 5));
    yield 'b';
  }
  await writeFileAtomic(target, producer());
  expect(fs.readFileSync(target, 'utf8')).toBe('ab');
});
