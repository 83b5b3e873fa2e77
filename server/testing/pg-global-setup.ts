/**
 * vitest globalSetup of the `server-pg` project: a real PostgreSQL for the server suite.
 *
 * Without TEST_DATABASE_URL it starts a throwaway cluster (pg-cluster.ts) and removes it at
 * the end. With TEST_DATABASE_URL=postgres://user@host:port/db (a role allowed to CREATE
 * DATABASE) it uses that server instead and leaves it as it was. Either way it migrates one
 * template database; every test context copies it (CREATE DATABASE … TEMPLATE).
 *
 * It also starts a fake S3 server (s3rver): in this project uploads go to object storage, so
 * `npm test` proves PostgreSQL and the object store together (the `server` project keeps files
 * in SQLite).
 */
import { randomBytes } from "node:crypto";
import type { TestProject } from "vitest/node";
import { openDatabase } from "../data/data-source";
import { adminQuery, withDatabase } from "./database";
import { startFakeS3, type FakeS3 } from "./fake-s3";
import { startPgCluster, type PgCluster } from "./pg-cluster";

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  let cluster: PgCluster | null = null;
  let adminUrl = process.env.TEST_DATABASE_URL;
  if (!adminUrl) {
    cluster = await startPgCluster();
    adminUrl = cluster.url;
  }
  const template = `spreadsight_template_${randomBytes(4).toString("hex")}`;
  try {
    await adminQuery(adminUrl, `CREATE DATABASE "${template}"`);
    const dataSource = await openDatabase({ url: withDatabase(adminUrl, template) });
    await dataSource.destroy();
  } catch (error) {
    await cluster?.stop();
    throw error;
  }
  let s3: FakeS3;
  try {
    s3 = await startFakeS3();
  } catch (error) {
    await cluster?.stop();
    throw error;
  }
  project.provide("pgAdminUrl", adminUrl);
  project.provide("pgTemplate", template);
  project.provide("s3Settings", s3.settings);
  return async () => {
    try {
      await s3.close();
      if (!cluster) await adminQuery(adminUrl, `DROP DATABASE IF EXISTS "${template}"`);
    } finally {
      await cluster?.stop();
    }
  };
}
