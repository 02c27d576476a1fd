import { chmodSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/common/errors.js';
import { EXIT } from '../../src/cli/io.js';
import { fileChunks, readInputText } from '../../src/cli/reduce-inputs.js';
import { tmpFolder } from './tmp-folder.js';

/**
 * Output safety of `similis reduce -o`. The bad-input cases themselves (every entry point, with
 * kind, place and an actionable message) are the corpus in test/bad-input/cases.
 */

const GOOD = '# D = 0.5 in\n# L = 1.2 m\nQ [L/min],dp [kPa]\n0.3,0.009432\n0.5,0.01548\n';
const STUDY = 'constants:\n  rho: 998.21 kg/m^3\n  mu: 1.0016 mPa*s\nderived:\n  U: 4*Q/(pi*D^2)\ngroups:\n  Re: rho*U*D/mu\n  f: dp*D/(L*0.5*rho*U^2)\n';

describe('similis reduce -o: bad input', () => {
  it('-o naming an input file is refused and the input is left as it was', async () => {
    const folder = tmpFolder({ 'rig.csv': GOOD, 'study.yaml': STUDY });
    const r = await folder.run('reduce', 'rig.csv', '--study', 'study.yaml', '-o', 'rig.csv');
    expect(r.code).toBe(EXIT.badInput);
    expect(r.err).toContain('[output-is-input]');
    expect(readFileSync(folder.path('rig.csv'), 'utf8')).toBe(GOOD);
    folder.remove();
  });
  it('a failed run leaves an existing output file untouched', async () => {
    const folder = tmpFolder({ 'rig.csv': GOOD + '0.8,bad\n', 'study.yaml': STUDY, 'reduced.csv': 'the good old file\n' });
    const r = await folder.run('reduce', 'rig.csv', '--study', 'study.yaml', '-o', 'reduced.csv');
    expect(r.code).toBe(EXIT.badInput);
    expect(readFileSync(folder.path('reduced.csv'), 'utf8')).toBe('the good old file\n');
    expect(folder.list()).toEqual(['reduced.csv', 'rig.csv', 'study.yaml']);
    folder.remove();
  });
  it('a file the system refuses to read is bad input (file-unreadable), not an internal fault', async () => {
    const folder = tmpFolder({ 'runs/x.csv': GOOD });
    try {
      // A folder read as a file fails with EISDIR, as an unreadable file fails with EACCES.
      const chunks = async () => {
        for await (const _ of fileChunks(folder.path('runs'), undefined, 'runs')) void _;
      };
      await expect(chunks()).rejects.toSatisfy((e) => e instanceof InputError && e.kind === 'file-unreadable' && e.where.file === 'runs');
      await expect(readInputText(folder.path('runs'), 'runs')).rejects.toSatisfy((e) => e instanceof InputError && e.kind === 'file-unreadable');
      if (process.getuid?.() !== 0) {
        // (root reads any file: this part runs for other users only)
        chmodSync(folder.path('runs/x.csv'), 0);
        const r = await folder.run('reduce', 'runs/x.csv', '--derive', 'U=4*Q/(pi*D^2)', '--json');
        expect(r.code, r.err).toBe(EXIT.badInput);
        expect(r.err).toContain('[file-unreadable]');
      }
    } finally {
      folder.remove();
    }
  });
});
