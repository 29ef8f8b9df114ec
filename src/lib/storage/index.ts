import { promises as fs } from 'node:fs';
import path from 'node:path';

// Where uploaded files live. Today: a folder on local disk (gitignored var/uploads, or UPLOADS_DIR).
// Callers only see put/get/remove by key, so object storage can replace the disk without touching them.
// Keys are made by the app (never from an uploaded file's name): "cam/12/3f2c…", letters, digits, - and /.

export interface BlobStore {
  put(key: string, bytes: Buffer): Promise<void>;
  get(key: string): Promise<Buffer | null>;
  remove(key: string): Promise<void>;
}

const KEY_PATTERN = /^[a-z0-9][a-z0-9-]*(\/[a-z0-9][a-z0-9-]*)*$/;

export function assertSafeKey(key: string): void {
  if (!KEY_PATTERN.test(key) || key.length > 200) throw new Error(`not a storage key: ${JSON.stringify(key)}`);
}

export function uploadsRoot(): string {
  return path.resolve(/*turbopackIgnore: true*/ process.env.UPLOADS_DIR || path.join(process.cwd(), 'var', 'uploads'));
}

export class DiskBlobStore implements BlobStore {
  constructor(private readonly root: string) {}

  private fileFor(key: string): string {
    assertSafeKey(key);
    const file = path.resolve(this.root, key);
    if (!file.startsWith(this.root + path.sep)) throw new Error('storage key escapes the uploads folder');
    return file;
  }

  async put(key: string, bytes: Buffer): Promise<void> {
    const file = this.fileFor(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    // Write aside, then rename: a reader never sees half a file.
    const temp = `${file}.part-${process.pid}-${Date.now()}`;
    await fs.writeFile(temp, bytes, { mode: 0o640 });
    await fs.rename(temp, file);
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      return await fs.readFile(this.fileFor(key));
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw error;
    }
  }

  async remove(key: string): Promise<void> {
    await fs.rm(this.fileFor(key), { force: true });
  }
}

let store: BlobStore | undefined;

export function blobStore(): BlobStore {
  store ??= new DiskBlobStore(uploadsRoot());
  return store;
}
