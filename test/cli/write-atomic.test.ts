import { existsSync, readFileSync, statSync, writeFileSync, chmodSync } from 'node:fs';
import { afterEach, describe, expect, it } from 'vitest';
import { AtomicFile, writeFileAtomic } from '../../src/cli/write-atomic.js';
import { tmpFolder } from './tmp-folder.js';

/** Atomic replacement by temporary file + fsync + rename (POSIX rename(2): the target is replaced in one step). */
describe('writeFileAtomic', () => {
  let folder = tmpFolder();
  afterEach(() => {
    folder.remove();
    folder = tmpFolder();
  });
  it('writes the whole content and leaves no temporary file', async () => {
    await writeFileAtomic(folder.path('out.csv'), async (write) => {
      for (let i = 0; i < 3000; i++) await write(`${i},${'x'.repeat(500)}\n`);
    });
    const text = readFileSync(folder.path('out.csv'), 'utf8');
    expect(text.split('\n').length).toBe(3001);
    expect(folder.list()).toEqual(['out.csv']);
  });
  it('replaces an existing file only on success, keeping its permissions', async () => {
    writeFileSync(folder.path('out.csv'), 'old\n');
    chmodSync(folder.path('out.csv'), 0o640);
    await writeFileAtomic(folder.path('out.csv'), async (write) => write('new\n'));
    expect(readFileSync(folder.path('out.csv'), 'utf8')).toBe('new\n');
    expect(statSync(folder.path('out.csv')).mode & 0o777).toBe(0o640);
  });
  it('on failure leaves the existing file untouched and removes the temporary file', async () => {
    writeFileSync(folder.path('out.csv'), 'good\n');
    await expect(
      writeFileAtomic(folder.path('out.csv'), async (write) => {
        await write('partial'.repeat(300_000));
        throw new Error('stopped halfway');
      }),
    ).rejects.toThrow('stopped halfway');
    expect(readFileSync(folder.path('out.csv'), 'utf8')).toBe('good\n');
    expect(folder.list()).toEqual(['out.csv']);
  });
  it('a missing folder or a folder as target is bad input (output-path), nothing created', async () => {
    await expect(AtomicFile.create(folder.path('no/such/out.csv'), 'no/such/out.csv')).rejects.toMatchObject({ kind: 'output-path' });
    await expect(AtomicFile.create(folder.root, 'here')).rejects.toMatchObject({ kind: 'output-path' });
    expect(existsSync(folder.path('no'))).toBe(false);
    expect(folder.list()).toEqual([]);
  });
  it('abort removes the temporary file and can be called twice', async () => {
    const f = await AtomicFile.create(folder.path('x.csv'));
    await f.write('abc');
    expect(folder.list().length).toBe(1);
    await f.abort();
    await f.abort();
    expect(folder.list()).toEqual([]);
  });
});
