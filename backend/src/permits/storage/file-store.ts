import type { Readable } from 'node:stream';

/** Where uploaded files live, addressed by their SHA-256. Small on purpose so object storage can replace the disk. */
export interface FileStore {
  /** Stores the bytes (a no-op when the same content is already there); returns its key and digest. */
  put(data: Buffer): Promise<{ key: string; sha256: string; created: boolean }>;
  /** A stream of the stored bytes; throws when the key is unknown. */
  open(key: string): Promise<{ stream: Readable; size: number }>;
  exists(key: string): Promise<boolean>;
  remove(key: string): Promise<void>;
}

export const FILE_STORE = Symbol('FILE_STORE');
