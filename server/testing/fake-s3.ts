/**
 * A local fake S3 server (s3rver) for tests: one bucket, files in a temporary folder, on a
 * free port of 127.0.0.1. Its credentials are s3rver's fixed S3RVER / S3RVER.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import S3rver from "s3rver";
import type { ObjectStoreSettings } from "../data/file-store";

export interface FakeS3 {
  settings: ObjectStoreSettings;
  close(): Promise<void>;
}

export async function startFakeS3(bucket = "spreadsight-test"): Promise<FakeS3> {
  const directory = mkdtempSync(join(tmpdir(), "spreadsight-s3-"));
  const server = new S3rver({
    address: "127.0.0.1",
    port: 0,
    silent: true,
    directory,
    configureBuckets: [{ name: bucket }],
  });
  const { port } = await server.run();
  return {
    settings: {
      endpoint: `http://127.0.0.1:${port}`,
      bucket,
      region: "us-east-1",
      accessKeyId: "S3RVER",
      secretAccessKey: "S3RVER",
      forcePathStyle: true,
    },
    async close() {
      await server.close();
      rmSync(directory, { recursive: true, force: true });
    },
  };
}
