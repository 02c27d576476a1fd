import { randomBytes } from 'node:crypto';
import { unlinkSync } from 'node:fs';
import { mkdir, open, readdir, rename, stat, unlink, type FileHandle } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { BroadcastChannel, isMainThread } from 'node:worker_threads';
import { InputError } from '../common/errors.js';

/**
 * Output files written atomically: everything goes to a temporary file in the same folder
 * (`.reduced.csv.<pid>.<random>.tmp`), which is flushed to disk (fsync), closed and then renamed
 * over the target. A rename within one file system replaces the target in one step (POSIX
 * rename(2); on Windows, MoveFileEx with replace), so a reader sees the old file or the new one,
 * never half of one. On any failure the temporary file is removed and an existing target is left
 * exactly as it was.
 *
 * Signals: every temporary file open in the process (worker threads included: they announce theirs
 * on a BroadcastChannel) is known to `removeOpenTempFiles`, which src/cli/main.ts calls on SIGINT
 * and SIGTERM before exiting with 130 or 143. A process killed outright (SIGKILL, power loss)
 * cannot clean up: its temporary file stays beside the target, which is untouched. Such stale files
 * are recognised by their name (`.TARGET.PID.RANDOM.tmp`) and removed by the next write of the same
 * target once no process with that PID is running.
 */

/** Temporary files this process has open (in the main thread: those of its workers too). */
const openTemps = new Set<string>();
/** Worker threads announce their temporary files to the main thread here. */
const announce = new BroadcastChannel('similis-atomic-temp-files');
announce.unref();
if (isMainThread) {
  announce.onmessage = (event) => {
    const m = (event as { data: { add?: string; remove?: string } }).data;
    if (m.add !== undefined) openTemps.add(m.add);
    if (m.remove !== undefined) openTemps.delete(m.remove);
  };
}

function track(tempPath: string, open: boolean): void {
  if (open) openTemps.add(tempPath);
  else openTemps.delete(tempPath);
  if (!isMainThread) announce.postMessage(open ? { add: tempPath } : { remove: tempPath });
}

/**
 * Removes every temporary file still open in the process, synchronously (for a signal handler:
 * the targets are untouched). Returns how many were removed.
 * @example process.on('SIGTERM', () => { removeOpenTempFiles(); process.exit(143); })
 */
export function removeOpenTempFiles(): number {
  let removed = 0;
  for (const p of openTemps) {
    try {
      unlinkSync(p);
      removed++;
    } catch {
      // already renamed or removed
    }
  }
  openTemps.clear();
  return removed;
}

/** Whether a process with this id is running (EPERM: it runs, under another user). */
function processRuns(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/**
 * Removes temporary files of `target` left by a process that was killed outright (its PID no
 * longer runs); files of running processes are left alone.
 */
async function removeStaleTemps(target: string): Promise<void> {
  const prefix = `.${basename(target)}.`;
  const names = await readdir(dirname(target)).catch(() => [] as string[]);
  for (const name of names) {
    if (!name.startsWith(prefix)) continue;
    const m = /^(\d+)\.[0-9a-f]{12}\.tmp$/.exec(name.slice(prefix.length));
    if (m === null) continue;
    const pid = Number(m[1]);
    if (pid !== process.pid && !processRuns(pid)) await unlink(join(dirname(target), name)).catch(() => undefined);
  }
}

/** Characters gathered before one write call. */
const BUFFER_CHARS = 1 << 20;

/**
 * One output file being written: `create`, `write` any number of times, then `commit` (or `abort`).
 * @example const f = await AtomicFile.create(path, 'reduced.csv'); await f.write('a,b\n'); await f.commit();
 */
export class AtomicFile {
  private buffer: (string | Uint8Array)[] = [];
  private buffered = 0;
  private done = false;
  /** The write in progress: the next piece is prepared while it runs. */
  private inflight: Promise<unknown> = Promise.resolve();

  private constructor(
    readonly target: string,
    readonly tempPath: string,
    private readonly handle: FileHandle,
  ) {}

  /**
   * Opens a temporary file beside `target` (never the target itself).
   * @param label the target as the user wrote it, for messages
   * @throws {InputError} 'output-path' when the folder does not exist, is not writable, or the
   *   target is a folder.
   * @example const out = await AtomicFile.create('/data/reduced.csv', 'reduced.csv')
   */
  static async create(target: string, label: string = target): Promise<AtomicFile> {
    const existing = await stat(target).catch(() => undefined);
    if (existing?.isDirectory() === true) {
      throw new InputError('output-path', `cannot write ${label}: it is a folder; give a file name such as ${join(label, 'reduced.csv')}`, { file: label });
    }
    await removeStaleTemps(target);
    const tempPath = join(dirname(target), `.${basename(target)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
    let handle: FileHandle;
    try {
      handle = await open(tempPath, 'wx', existing === undefined ? 0o666 : existing.mode & 0o777);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      const why = code === 'ENOENT' ? `the folder ${dirname(label)} does not exist` : code === 'EACCES' || code === 'EPERM' ? `no permission to write in ${dirname(label)}` : String((e as Error).message);
      throw new InputError('output-path', `cannot write ${label}: ${why}`, { file: label }, { cause: e });
    }
    track(tempPath, true);
    // The umask applied at open; an existing file's permissions are kept exactly.
    if (existing !== undefined) await handle.chmod(existing.mode & 0o777).catch(() => undefined);
    return new AtomicFile(target, tempPath, handle);
  }

  /** Adds text or UTF-8 bytes (buffered; written in pieces of about 1 MB). */
  async write(data: string | Uint8Array): Promise<void> {
    this.buffer.push(data);
    this.buffered += data.length;
    if (this.buffered >= BUFFER_CHARS) await this.flush();
  }

  private async flush(): Promise<void> {
    if (this.buffered === 0) return;
    const parts = this.buffer;
    this.buffer = [];
    this.buffered = 0;
    const bytes = parts.length === 1 && typeof parts[0] !== 'string' ? parts[0]! : Buffer.concat(parts.map((p) => (typeof p === 'string' ? Buffer.from(p, 'utf8') : p)));
    await this.inflight;
    const writing = this.handle.write(bytes as Uint8Array);
    // Seen by the next flush or by commit; marked handled here so that a failure is not reported twice.
    writing.catch(() => undefined);
    this.inflight = writing;
  }

  /** Writes what is buffered, syncs to disk, closes, and renames over the target. */
  async commit(): Promise<void> {
    if (this.done) throw new Error('AtomicFile.commit: already finished');
    try {
      await this.flush();
      await this.inflight;
      await this.handle.sync();
      await this.handle.close();
      await rename(this.tempPath, this.target);
      this.done = true;
      track(this.tempPath, false);
    } catch (e) {
      await this.abort();
      throw e;
    }
    await syncFolder(dirname(this.target));
  }

  /** Removes the temporary file; the target is not touched. Safe to call more than once. */
  async abort(): Promise<void> {
    if (this.done) return;
    this.done = true;
    await this.inflight.catch(() => undefined);
    await this.handle.close().catch(() => undefined);
    await unlink(this.tempPath).catch(() => undefined);
    track(this.tempPath, false);
  }
}

/**
 * Writes a file atomically from a producer: commit when it returns, abort (temporary file
 * removed, target untouched) when it throws.
 * @throws whatever `produce` throws, after cleaning up; InputError 'output-path' as AtomicFile.create.
 * @example await writeFileAtomic('out.csv', async (write) => { await write('a,b\n'); })
 */
export async function writeFileAtomic(target: string, produce: (write: (data: string | Uint8Array) => Promise<void>) => Promise<void>, label?: string): Promise<void> {
  const file = await AtomicFile.create(target, label);
  try {
    await produce((text) => file.write(text));
  } catch (e) {
    await file.abort();
    throw e;
  }
  await file.commit();
}

/**
 * Makes an output folder and its parents (nothing when it exists).
 * @param label the folder as the user wrote it, for messages
 * @throws {InputError} 'output-path' when a part of the path is a file or the folder cannot be made.
 * @example await makeOutputFolder('/data/reports', 'reports')
 */
export async function makeOutputFolder(folder: string, label: string = folder): Promise<void> {
  try {
    await mkdir(folder, { recursive: true });
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    const why =
      code === 'ENOTDIR' || code === 'EEXIST'
        ? 'a part of that path is a file, not a folder'
        : code === 'EACCES' || code === 'EPERM' || code === 'EROFS'
          ? 'no permission to make it'
          : String((e as Error).message);
    throw new InputError('output-path', `cannot make the folder ${label}: ${why}; give an output path inside a folder you can write`, { file: label }, { cause: e });
  }
}

/** Makes the rename durable (POSIX: fsync the folder); skipped where folders cannot be opened. */
async function syncFolder(folder: string): Promise<void> {
  if (process.platform === 'win32') return;
  const handle = await open(folder, 'r').catch(() => undefined);
  if (handle === undefined) return;
  await handle.sync().catch(() => undefined);
  await handle.close().catch(() => undefined);
}
