import { createHash, randomBytes } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { link, mkdir, rm, stat, unlink, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import type { FileStore } from './file-store';

const KEY = /^[0-9a-f]{64}$/;

/**
 * Files on the local disk under `root/<first two hex>/<sha256>`. Writes go to a temporary name first and are
 * linked into place, so a reader never sees half a file and two writers of the same content do not clash.
 */
export class FsFileStore implements FileStore {
  readonly root: string;
  constructor(root: string) {
    this.root = resolve(root);
  }

  private pathOf(key: string): string {
    if (!KEY.test(key)) throw new Error(`bad file key ${key}`);
    return join(this.root, key.slice(0, 2), key);
  }

  async put(data: Buffer): Promise<{ key: string; sha256: string; created: boolean }> {
    const sha256 = createHash('sha256').update(data).digest('hex');
    const target = this.pathOf(sha256);
    if (await this.exists(sha256)) return { key: sha256, sha256, created: false };
    await mkdir(join(this.root, sha256.slice(0, 2)), { recursive: true });
    const tmp = `${target}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`;
    await writeFile(tmp, data, { flag: 'wx' });
    try {
      await link(tmp, target);
      return { key: sha256, sha256, created: true };
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'EEXIST') return { key: sha256, sha256, created: false };
      throw e;
    } finally {
      await unlink(tmp).catch(() => undefined);
    }
  }

  async open(key: string): Promise<{ stream: ReturnType<typeof createReadStream>; size: number }> {
    const path = this.pathOf(key);
    const s = await stat(path);
    return { stream: createReadStream(path), size: s.size };
  }

  async exists(key: string): Promise<boolean> {
    try {
      await stat(this.pathOf(key));
      return true;
    } catch {
      return false;
    }
  }

  async remove(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }
}
