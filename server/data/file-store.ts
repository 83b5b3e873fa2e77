/**
 * Where uploaded files' bytes live.
 *
 * - Database (the default): in the `attachments.content` column (BLOB on SQLite, bytea on
 *   PostgreSQL), written in the same transaction as the row.
 * - Object storage: any S3-compatible store (AWS S3, MinIO, Ceph, s3rver in tests) through the
 *   AWS SDK v3, chosen with S3_ENDPOINT / S3_BUCKET / S3_ACCESS_KEY_ID / S3_SECRET_ACCESS_KEY
 *   (server/main.ts). The row then carries `objectKey` and an empty `content`. The object is
 *   written before the row's transaction and deleted after the row's; a leftover object (a
 *   refused transaction, a plan or team removed by a cascade, a failed delete) is removed by
 *   `sweepOrphanObjects`, which start.ts runs at start and every hour.
 *
 * A row whose objectKey is null is always read from the database, so turning object storage
 * on later keeps older uploads readable.
 */
import { Readable } from "node:stream";
import {
  DeleteObjectsCommand,
  GetObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";
import { In, type DataSource } from "typeorm";
import { Attachment } from "./entities/attachment";

/** Settings of an S3-compatible object store. */
export interface ObjectStoreSettings {
  /** e.g. https://s3.eu-central-1.amazonaws.com or http://127.0.0.1:9000 (MinIO). */
  endpoint: string;
  bucket: string;
  /** Default "us-east-1" (most S3-compatible servers ignore it). */
  region?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Path-style URLs (http://host/bucket/key). Default true: what MinIO and s3rver need. */
  forcePathStyle?: boolean;
  /** Key prefix inside the bucket. Default "spreadsight/". */
  prefix?: string;
}

/** The bytes of uploads: kept in the database, or in an object store. */
export interface FileStore {
  readonly kind: "database" | "s3";
  /** Stores the bytes of a new attachment; returns the objectKey for its row (null: the row's
   * own content column holds them). Called before the row's transaction. */
  put(attachment: { id: string; teamId: string; planId: string }, bytes: Buffer, mediaType: string): Promise<string | null>;
  /** The object's bytes as a stream. */
  read(objectKey: string): Promise<Readable>;
  /** Deletes objects (missing ones are fine). */
  remove(objectKeys: string[]): Promise<void>;
  /** Every object key under this store's prefix, with its age. */
  list(): AsyncIterable<{ key: string; lastModified: Date | undefined }>;
}

/** Bytes stay in the attachments row. */
export const databaseFileStore: FileStore = {
  kind: "database",
  async put() {
    return null;
  },
  async read() {
    throw new Error("database file store: the bytes are in the attachments row");
  },
  async remove() {},
  async *list() {},
};

/** Reads the object store settings from the environment, or null when S3_BUCKET is unset. */
export function objectStoreFromEnv(env: NodeJS.ProcessEnv): ObjectStoreSettings | null {
  if (!env.S3_BUCKET && !env.S3_ENDPOINT) return null;
  if (!env.S3_BUCKET || !env.S3_ENDPOINT) {
    throw new Error("object storage needs both S3_ENDPOINT and S3_BUCKET (or neither)");
  }
  return {
    endpoint: env.S3_ENDPOINT,
    bucket: env.S3_BUCKET,
    region: env.S3_REGION || undefined,
    accessKeyId: env.S3_ACCESS_KEY_ID || env.AWS_ACCESS_KEY_ID || undefined,
    secretAccessKey: env.S3_SECRET_ACCESS_KEY || env.AWS_SECRET_ACCESS_KEY || undefined,
    forcePathStyle: env.S3_FORCE_PATH_STYLE ? env.S3_FORCE_PATH_STYLE !== "false" : undefined,
    prefix: env.S3_PREFIX ?? undefined,
  };
}

/** A FileStore on an S3-compatible object store. */
export function s3FileStore(settings: ObjectStoreSettings): FileStore & { client: S3Client } {
  const client = new S3Client({
    endpoint: settings.endpoint,
    region: settings.region ?? "us-east-1",
    forcePathStyle: settings.forcePathStyle ?? true,
    credentials:
      settings.accessKeyId && settings.secretAccessKey
        ? { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey }
        : undefined,
  });
  const Bucket = settings.bucket;
  const prefix = settings.prefix ?? "spreadsight/";
  return {
    kind: "s3",
    client,
    async put(attachment, bytes, mediaType) {
      const Key = `${prefix}attachments/${attachment.teamId}/${attachment.planId}/${attachment.id}`;
      await client.send(new PutObjectCommand({ Bucket, Key, Body: bytes, ContentType: mediaType }));
      return Key;
    },
    async read(Key) {
      const { Body } = await client.send(new GetObjectCommand({ Bucket, Key }));
      if (!(Body instanceof Readable)) throw new Error(`object ${Key} has no readable body`);
      return Body;
    },
    async remove(keys) {
      for (let i = 0; i < keys.length; i += 1000) {
        const Objects = keys.slice(i, i + 1000).map((Key) => ({ Key }));
        if (Objects.length) {
          await client.send(new DeleteObjectsCommand({ Bucket, Delete: { Objects, Quiet: true } }));
        }
      }
    },
    async *list() {
      let ContinuationToken: string | undefined;
      do {
        const page = await client.send(
          new ListObjectsV2Command({ Bucket, Prefix: `${prefix}attachments/`, ContinuationToken }),
        );
        for (const object of page.Contents ?? []) {
          if (object.Key) yield { key: object.Key, lastModified: object.LastModified };
        }
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (ContinuationToken);
    },
  };
}

const stores = new WeakMap<DataSource, FileStore>();

/** Makes `store` the file store of everything that runs on this DataSource. */
export function useFileStore(dataSource: DataSource, store: FileStore): void {
  stores.set(dataSource, store);
}

/** The file store for this DataSource (the database one unless useFileStore chose another). */
export function fileStoreOf(dataSource: DataSource): FileStore {
  return stores.get(dataSource) ?? databaseFileStore;
}

/** An attachment's bytes as a stream, wherever they are. */
export async function readAttachmentBytes(dataSource: DataSource, id: string): Promise<Readable> {
  const row = await dataSource
    .getRepository(Attachment)
    .createQueryBuilder("a")
    .select(["a.id", "a.objectKey"])
    .where("a.id = :id", { id })
    .getOne();
  if (!row) throw new Error(`attachment ${id} not found`);
  if (row.objectKey) return fileStoreOf(dataSource).read(row.objectKey);
  const withContent = await dataSource
    .getRepository(Attachment)
    .createQueryBuilder("a")
    .select(["a.id", "a.content"])
    .where("a.id = :id", { id })
    .getOne();
  return Readable.from([Buffer.from(withContent!.content)]);
}

/** Deletes objects, logging instead of failing (the sweep retries later). */
export async function removeObjectsQuietly(
  dataSource: DataSource,
  keys: (string | null)[],
  warn: (error: unknown) => void = () => {},
): Promise<void> {
  const present = keys.filter((k): k is string => Boolean(k));
  if (!present.length) return;
  await fileStoreOf(dataSource).remove(present).catch(warn);
}

/**
 * Deletes the objects no attachments row points at any more (plans or teams removed by a
 * cascade, refused uploads, failed deletes) once they are older than `minAgeMs` (default one
 * hour, so an upload whose row is still being written is never touched). Returns how many.
 */
export async function sweepOrphanObjects(
  dataSource: DataSource,
  options: { minAgeMs?: number; now?: Date } = {},
): Promise<number> {
  const store = fileStoreOf(dataSource);
  if (store.kind === "database") return 0;
  const cutoff = (options.now ?? new Date()).getTime() - (options.minAgeMs ?? 60 * 60 * 1000);
  let removed = 0;
  let batch: string[] = [];
  const flush = async () => {
    if (!batch.length) return;
    const rows = await dataSource
      .getRepository(Attachment)
      .createQueryBuilder("a")
      .select(["a.id", "a.objectKey"])
      .where({ objectKey: In(batch) })
      .getMany();
    const kept = new Set(rows.map((r) => r.objectKey));
    const orphans = batch.filter((key) => !kept.has(key));
    await store.remove(orphans);
    removed += orphans.length;
    batch = [];
  };
  for await (const object of store.list()) {
    if (object.lastModified && object.lastModified.getTime() > cutoff) continue;
    batch.push(object.key);
    if (batch.length >= 500) await flush();
  }
  await flush();
  return removed;
}
