import { Client } from 'minio';
import type { Readable } from 'node:stream';

export interface ObjectStoreConfig {
  endPoint: string;
  port: number;
  useSSL: boolean;
  accessKey: string;
  secretKey: string;
  region: string;
  bucket: string;
}

/**
 * The store could not be reached (refused, reset, timed out). The API answers 503 for it, never
 * "something went wrong" and never the database's message (server/http/errors.ts).
 */
export class StorageUnavailable extends Error {
  override readonly name = 'StorageUnavailable';
  constructor(readonly cause: unknown) {
    super(`object store unavailable: ${(cause as Error)?.message ?? String(cause)}`);
  }
}

const NETWORK = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN', 'ECONNABORTED']);
async function reaching<T>(p: Promise<T>): Promise<T> {
  try {
    return await p;
  } catch (e) {
    const code = (e as { code?: string })?.code;
    if ((code && NETWORK.has(code)) || /socket hang up/i.test(String((e as Error)?.message))) throw new StorageUnavailable(e);
    throw e;
  }
}

/** The object store behind the library's files, through the minio SDK (S3-compatible). */
export class ObjectStore {
  readonly client: Client;
  readonly bucket: string;

  constructor(private cfg: ObjectStoreConfig) {
    this.client = new Client({
      endPoint: cfg.endPoint,
      port: cfg.port,
      useSSL: cfg.useSSL,
      accessKey: cfg.accessKey,
      secretKey: cfg.secretKey,
      region: cfg.region,
      pathStyle: true,
    });
    this.bucket = cfg.bucket;
  }

  async ensureBucket(): Promise<void> {
    if (!(await this.client.bucketExists(this.bucket))) await this.client.makeBucket(this.bucket, this.cfg.region);
  }

  async check(): Promise<boolean> {
    try {
      return await this.client.bucketExists(this.bucket);
    } catch {
      return false;
    }
  }

  /** Stores a buffer in one part (the local fake has no multipart listing). */
  async put(key: string, body: Buffer, contentType: string): Promise<void> {
    await reaching(this.client.putObject(this.bucket, key, body, body.length, { 'Content-Type': contentType }));
  }

  async get(key: string): Promise<Buffer> {
    return reaching(this.client.getObject(this.bucket, key).then(streamToBuffer));
  }

  async stream(key: string): Promise<Readable> {
    return reaching(this.client.getObject(this.bucket, key));
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.statObject(this.bucket, key);
      return true;
    } catch (e: any) {
      if (e?.code === 'NotFound' || e?.code === 'NoSuchKey') return false;
      throw e;
    }
  }

  async remove(keys: string[]): Promise<void> {
    if (keys.length === 0) return;
    await reaching(Promise.all(keys.map((k) => this.client.removeObject(this.bucket, k))));
  }

  async list(prefix = ''): Promise<string[]> {
    const keys: string[] = [];
    // ListObjects (v1, marker paging): the local fake answers 500 to v2's second page (more than
    // 1000 keys), which broke the sweep on a well-used bucket. Both work against S3 itself.
    const stream = this.client.listObjects(this.bucket, prefix, true);
    for await (const item of stream as AsyncIterable<{ name?: string }>) if (item.name) keys.push(item.name);
    return keys;
  }

  async listWithDates(prefix = ''): Promise<{ key: string; lastModified: Date }[]> {
    const out: { key: string; lastModified: Date }[] = [];
    const stream = this.client.listObjects(this.bucket, prefix, true);
    for await (const item of stream as AsyncIterable<{ name?: string; lastModified?: Date }>) {
      if (item.name) out.push({ key: item.name, lastModified: item.lastModified ?? new Date(0) });
    }
    return out;
  }

  /** A short-lived GET link; downloads name their file through the response headers. */
  async presignGet(key: string, seconds: number, fileName?: string, contentType?: string): Promise<string> {
    const headers: Record<string, string> = {};
    if (fileName) headers['response-content-disposition'] = `attachment; filename="${fileName.replace(/"/g, '')}"`;
    if (contentType) headers['response-content-type'] = contentType;
    return this.client.presignedGetObject(this.bucket, key, seconds, headers);
  }
}

export async function streamToBuffer(stream: Readable): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of stream) chunks.push(Buffer.isBuffer(c) ? c : Buffer.from(c));
  return Buffer.concat(chunks);
}
