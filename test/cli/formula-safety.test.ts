import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { EXIT } from '../../src/cli/io.js';
import { tmpFolder } from './tmp-folder.js';

/**
 * Formulas never run code, through every entry point that takes one: the study's derived
 * quantities, groups, fit model, fit where and fit weights; --derive, --group, --where and
 * --model; handbook eval arguments; predict --at values. Each payload is refused as bad input
 * (exit 2, never 3): no process.exit, no file read, no global touched, no stack overflow.
 * (test/expr/safety.test.ts checks the formula engine itself; this checks that no entry point
 * takes another road.)
 */

const demo = (name: string) => readFileSync(fileURLToPath(new URL(`../../data-demo/mini-loop/${name}`, import.meta.url)), 'utf8');
const STUDY = demo('study.yaml');

const NEST = 10_000;
const PAYLOADS: readonly { name: string; text: string; says?: RegExp }[] = [
  { name: 'constructor', text: 'constructor' },
  { name: 'constructor.constructor', text: 'constructor.constructor("return process")()' },
  { name: '__proto__', text: '__proto__' },
  { name: 'prototype', text: 'Re.prototype' },
  { name: 'process.exit()', text: 'process.exit()' },
  { name: 'this', text: 'this' },
  { name: 'template string', text: '`${process.exit(7)}`' },
  { name: 'backticks', text: '`Re`' },
  { name: "require('fs')", text: "require('fs').readFileSync('secrets.txt')" },
  { name: 'globalThis assignment', text: 'globalThis.__pwned = 1' },
  { name: 'arrow function', text: '(() => process.exit(3))()' },
  { name: '1 MB of formula', text: 'Re+'.repeat(349_525) + 'Re', says: /limit|longer than|at most|10000|bytes long/ },
  { name: `${NEST} nested parentheses`, text: '('.repeat(NEST) + 'Re' + ')'.repeat(NEST), says: /nests deeper than 100 levels|limit/ },
  { name: `${NEST} nested calls`, text: 'sqrt('.repeat(NEST) + 'Re' + ')'.repeat(NEST), says: /nests deeper than 100 levels|limit/ },
];

const yamlText = (s: string) => JSON.stringify(s);
/** Every entry point: a function from the payload to the command line and the files it needs. */
/** `value`: the entry takes a number or a constant expression, not a formula of the data. */
const ENTRIES: readonly { name: string; argv: (p: string) => string[]; study?: (p: string) => string; value?: true }[] = [
  { name: 'study derived', argv: () => ['fit', '--study', 's.yaml'], study: (p) => STUDY.replace('U: 4*Q/(pi*D^2)', `U: ${yamlText(p)}`) },
  { name: 'study groups', argv: () => ['fit', '--study', 's.yaml'], study: (p) => STUDY.replace('Re: rho*U*D/mu', `Re: ${yamlText(p)}`) },
  { name: 'study fit model', argv: () => ['fit', '--study', 's.yaml'], study: (p) => STUDY.replace('model: C*Re^a', `model: ${yamlText(p)}`) },
  { name: 'study fit where', argv: () => ['fit', '--study', 's.yaml'], study: (p) => STUDY.replace('where: Re > 3000', `where: ${yamlText(p)}`) },
  { name: 'study fit weights', argv: () => ['fit', '--study', 's.yaml'], study: (p) => STUDY.replace('where: Re > 3000', `where: Re > 3000\n  weights: ${yamlText(p)}`) },
  { name: '--derive', argv: (p) => ['reduce', '--study', 'study.yaml', '--derive', `V=${p}`] },
  { name: '--group', argv: (p) => ['reduce', '--study', 'study.yaml', '--group', `G=${p}`] },
  { name: '--where', argv: (p) => ['reduce', '--study', 'study.yaml', '--where', p] },
  { name: '--model', argv: (p) => ['fit', '--study', 'study.yaml', '--model', p] },
  { name: 'handbook eval', argv: (p) => ['handbook', 'eval', 'blasius', `Re=${p}`], value: true },
  { name: 'predict --at', argv: (p) => ['predict', 'rep/loop.json', '--at', `Re=${p}`], value: true },
];

const folder = tmpFolder({ 'loop-a.csv': demo('loop-a.csv'), 'study.yaml': STUDY });
afterAll(() => folder.remove());

describe('formulas never run code, through every entry point', () => {
  const exit = vi.spyOn(process, 'exit').mockImplementation(((code?: number) => {
    throw new Error(`process.exit(${code}) was called`);
  }) as never);
  afterAll(() => exit.mockRestore());
  beforeAll(async () => {
    const r = await folder.run('fit', '--study', 'study.yaml', '--out', 'rep/loop');
    expect(r.code, r.err).toBe(EXIT.ok);
  });

  for (const entry of ENTRIES) {
    it(`${entry.name}: every payload is bad input (exit 2) and runs nothing`, async () => {
      for (const p of PAYLOADS) {
        if (entry.study !== undefined) {
          const { writeFileSync } = await import('node:fs');
          writeFileSync(folder.path('s.yaml'), entry.study(p.text));
        }
        const r = await folder.run(...entry.argv(p.text), '--json');
        expect(r.code, `${entry.name} / ${p.name}: ${r.err.slice(0, 300)}`).toBe(EXIT.badInput);
        const error = (JSON.parse(r.out) as { error: { kind: string; message: string } }).error;
        if (p.says !== undefined && entry.value !== true) expect(error.message, `${entry.name} / ${p.name}`).toMatch(p.says);
        // A message never repeats a megabyte of input.
        expect(error.message.length, `${entry.name} / ${p.name}`).toBeLessThan(2100);
        expect(r.err.length, `${entry.name} / ${p.name}`).toBeLessThan(5000);
        expect(r.err).not.toContain('internal fault');
        expect(exit).not.toHaveBeenCalled();
        expect((globalThis as { __pwned?: unknown }).__pwned).toBeUndefined();
      }
    });
  }
});
