import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { mkdir, readFile, readdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { Transform, type Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';

// Files live as `<dir>/<key>` with metadata in `<dir>/<key>.json`. Bytes stream into `<key>.part`
// and are renamed only when complete and of the announced size, so a reader never sees half a file.

export interface StoredFile {
  key: string;
  name: string;
  size: number;
  type: string;
  customId: string | null;
  acl: string;
  contentDisposition: string;
  /** md5 hex of the content, as the hosted service reports it. */
  fileHash: string;
  uploadedAt: number;
}

export type NewFile = Omit<StoredFile, 'size' | 'fileHash' | 'uploadedAt'>;

export class SizeMismatch extends Error {
  constructor(
    readonly received: number,
    readonly expected: number,
  ) {
    super(received > expected ? `file is larger than the presigned size ${expected} bytes` : `file has ${received} bytes, presigned size is ${expected}`);
  }
}

export class FileStore {
  constructor(readonly dir: string) {}

  /** Creates the folder and removes parts left by an interrupted run. */
  async init(): Promise<void> {
    await mkdir(this.dir, { recursive: true });
    for (const name of await readdir(this.dir)) {
      if (name.endsWith('.part') || name.endsWith('.json.tmp')) await rm(path.join(this.dir, name), { force: true });
    }
  }

  dataPath(key: string): string {
    return path.join(this.dir, key);
  }

  /** Streams `source` to disk; refuses (and leaves nothing) when the byte count is not `expectedSize`. */
  async store(file: NewFile, source: Readable, expectedSize: number): Promise<StoredFile> {
    const part = `${this.dataPath(file.key)}.part`;
    const md5 = createHash('md5');
    let received = 0;
    // Past the announced size bytes are counted and dropped rather than failing mid-stream, so
    // the multipart parser keeps reading and the client still gets a clear answer.
    const meter = new Transform({
      transform(chunk: Buffer, _enc, done) {
        received += chunk.length;
        if (received > expectedSize) return done();
        md5.update(chunk);
        done(null, chunk);
      },
    });
    try {
      await pipeline(source, meter, createWriteStream(part));
      if (received !== expectedSize) throw new SizeMismatch(received, expectedSize);
      const stored: StoredFile = { ...file, size: received, fileHash: md5.digest('hex'), uploadedAt: Date.now() };
      await this.writeMeta(stored);
      await rename(part, this.dataPath(file.key));
      return stored;
    } catch (err) {
      await rm(part, { force: true });
      throw err;
    }
  }

  async get(key: string): Promise<StoredFile | null> {
    try {
      const [meta] = await Promise.all([readFile(`${this.dataPath(key)}.json`, 'utf8'), stat(this.dataPath(key))]);
      return JSON.parse(meta) as StoredFile;
    } catch {
      return null;
    }
  }

  async list(): Promise<StoredFile[]> {
    const names = await readdir(this.dir);
    const keys = names.filter((n) => n.endsWith('.json')).map((n) => n.slice(0, -'.json'.length));
    const files = await Promise.all(keys.map((k) => this.get(k)));
    return files.filter((f): f is StoredFile => f !== null).sort((a, b) => a.uploadedAt - b.uploadedAt || a.key.localeCompare(b.key));
  }

  async findByCustomId(customId: string): Promise<StoredFile | null> {
    return (await this.list()).find((f) => f.customId === customId) ?? null;
  }

  async update(key: string, patch: Partial<Pick<StoredFile, 'name' | 'acl'>>): Promise<boolean> {
    const file = await this.get(key);
    if (!file) return false;
    await this.writeMeta({ ...file, ...patch });
    return true;
  }

  async delete(key: string): Promise<boolean> {
    const existed = (await this.get(key)) !== null;
    await rm(this.dataPath(key), { force: true });
    await rm(`${this.dataPath(key)}.json`, { force: true });
    return existed;
  }

  private async writeMeta(file: StoredFile): Promise<void> {
    const target = `${this.dataPath(file.key)}.json`;
    await writeFile(`${target}.tmp`, JSON.stringify(file));
    await rename(`${target}.tmp`, target);
  }
}
