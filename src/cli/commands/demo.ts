import { performance } from 'node:perf_hooks';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { CampaignIndex } from '../batch-campaign.js';
import { renderCampaignList } from '../batch-index.js';
import { insideFolder } from '../batch-inputs.js';
import type { CommandContext, CommandOutcome } from '../context.js';
import { commitTogether } from '../fit-pipeline.js';
import { runBatch } from './batch.js';

/**
 * `similis demo` (what `npm run demo` runs): both invented demo campaigns of data-demo/ (see
 * data-demo/README.md and the truth.json beside each), run exactly as a user would run them with
 * `similis batch`, into reports/demo/ under the working folder, with a page linking the two.
 */

const CAMPAIGNS = [
  { folder: 'pressure-drop', title: 'Pressure-drop loop: friction factor of drawn tubes' },
  { folder: 'settling', title: 'Settling column: drag of spheres' },
] as const;

export async function runDemo(ctx: CommandContext, opts: { jobs?: string; quiet?: boolean } = {}): Promise<CommandOutcome> {
  const started = performance.now();
  const root = fileURLToPath(new URL('../../../', import.meta.url));
  const outRoot = join(ctx.io.cwd, 'reports', 'demo');
  const indexes: { folder: string; title: string; index: CampaignIndex; text: string }[] = [];
  for (const c of CAMPAIGNS) {
    const data = join(root, 'data-demo', c.folder);
    const out = join(outRoot, c.folder);
    const outcome = await runBatch(ctx, [label(ctx, data)], {
      study: label(ctx, join(data, 'study.yaml')),
      out: label(ctx, out),
      ...(opts.jobs === undefined ? {} : { jobs: opts.jobs }),
      ...(opts.quiet === undefined ? {} : { quiet: opts.quiet }),
    });
    indexes.push({ folder: c.folder, title: c.title, index: outcome.json as unknown as CampaignIndex, text: outcome.text });
  }
  const seconds = (performance.now() - started) / 1000;
  const page = insideFolder(outRoot, 'index.html');
  await commitTogether([
    {
      path: page,
      label: label(ctx, page),
      text: renderCampaignList(
        'similis demo: two invented campaigns',
        'Invented rig data (nothing here was measured; data-demo/README.md states the truth each file was generated from). Each campaign: every file fitted on its own and all pooled.',
        indexes.map((x) => ({ title: x.title, link: `${x.folder}/index.html`, summary: summaryOf(x.index) })),
      ),
    },
  ]);
  const text = [
    ...indexes.flatMap((x) => [`${x.title}`, ...x.text.trimEnd().split('\n').map((l) => `  ${l}`), '']),
    `Both campaigns in ${seconds.toFixed(1)} s. Open ${label(ctx, page)} in a browser (README.md walks through it).`,
    `Then try: similis predict ${label(ctx, join(outRoot, 'pressure-drop', 'pooled.json'))} --at Re=3e4,LD=100 --at Re=3e5,LD=100`,
    '',
  ].join('\n');
  return { text, json: { seconds, page: label(ctx, page), campaigns: indexes.map((x) => ({ folder: x.folder, index: x.index })) } };
}

/** A path as the user sees it: relative to the working folder when inside it. */
function label(ctx: CommandContext, path: string): string {
  const rel = relative(ctx.io.cwd, path);
  return rel === '' ? '.' : rel.startsWith('..') ? path : rel;
}

function summaryOf(index: CampaignIndex): string {
  const c = index.counts;
  const disagree = index.files.filter((f) => f.agreement?.disagrees === true).map((f) => f.label.split('/').pop());
  return `${c.files} files, ${c.fitted} fitted, ${c.failed} failed; pooled ${index.pooled.fitted}; ${disagree.length === 0 ? 'every file agrees with the pooled fit' : `disagree: ${disagree.join(', ')}`}`;
}
