/**
 * vitest globalSetup of the `server-pg` project: a real PostgreSQL for the server suite.
 *
 * Without TEST_DATABASE_URL it starts a throwaway cluster (pg-cluster.ts) and removes it at
 * the end. With TEST_DATABASE_URL=postgres://user@host:port/db (a role allowed to CREATE
 * DATABASE) it uses that server instead and leaves it as it was. Either way it migrates one
 * template database; every test context copies it (CREATE DATABASE … TEMPLATE).
 */
import { randomBytes } from "node:crypto";
import type { TestProject } from "vitest/node";
import { openDatabase } from "../data/data-source";
import { adminQuery, withDatabase } from "./database";
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
  project.provide("pgAdminUrl", adminUrl);
  project.provide("pgTemplate", template);
  return async () => {
    try {
      if (!cluster) await adminQuery(adminUrl, `DROP DATABASE IF EXISTS "${template}"`);
    } finally {
      await cluster?.stop();
    }
  };
}
