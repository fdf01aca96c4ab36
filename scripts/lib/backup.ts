// Backups of the whole workshop: a pg_dump of the database and a copy of every object in the store, with a
// manifest of each table's row count and checksum taken inside the dump's own snapshot, so a restore can prove
// it brought back exactly what was dumped. Objects written after the snapshot are copied too and listed as such.
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { dirname, join, relative } from "node:path";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import postgres from "postgres";
import type { ObjectStore } from "@/lib/object-store";
import { findPostgresBin } from "./postgres";

export interface TableFigures {
  rows: number;
  /** md5 over the table's rows as text, in order: the same content gives the same sum. */
  checksum: string;
}

export interface Manifest {
  takenAt: string;
  database: Record<string, TableFigures>;
  /** Objects the database pointed at or that were in the store when the dump's snapshot was taken. */
  objects: { key: string; sizeBytes: number; sha256: string }[];
  /** Objects that appeared in the store after the snapshot (written while the backup ran): copied, not counted. */
  objectsAfterSnapshot: string[];
}

/** pg_dump and pg_restore: PG_BIN when set, else the Debian server's (scripts/lib/postgres.ts), else the PATH. */
export function pgTool(name: "pg_dump" | "pg_restore"): string {
  if (process.env.PG_BIN) return join(process.env.PG_BIN, name);
  try {
    const bin = findPostgresBin();
    if (existsSync(join(bin, name))) return join(bin, name);
  } catch {
    // not installed locally: a managed database's client tools on the PATH
  }
  return name;
}

const quoteIdent = (name: string) => `"${name.replaceAll('"', '""')}"`;

/** Row count and checksum of every table of the app's schemas, read in the transaction `sql` runs in. */
export async function tableFigures(sql: postgres.Sql | postgres.TransactionSql): Promise<Record<string, TableFigures>> {
  const tables = await sql<{ schema: string; name: string }[]>`
    select table_schema as schema, table_name as name from information_schema.tables
    where table_type = 'BASE TABLE' and table_schema in ('public', 'drizzle') order by 1, 2`;
  const figures: Record<string, TableFigures> = {};
  for (const t of tables) {
    const qualified = `${quoteIdent(t.schema)}.${quoteIdent(t.name)}`;
    const [row] = await sql.unsafe<{ rows: string; checksum: string | null }[]>(`select count(*)::text as rows, md5(coalesce(string_agg(x::text, E'\\n' order by x::text), '')) as checksum from ${qualified} x`);
    figures[`${t.schema}.${t.name}`] = { rows: Number(row.rows), checksum: row.checksum ?? "" };
  }
  return figures;
}

async function listKeys(store: ObjectStore): Promise<{ key: string; size: number }[]> {
  const keys: { key: string; size: number }[] = [];
  let token: string | undefined;
  do {
    const page = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) if (o.Key) keys.push({ key: o.Key, size: o.Size ?? 0 });
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys;
}

const sha256 = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

/** Takes a backup into `dir`: db.dump, objects/, manifest.json. */
export async function takeBackup(databaseUrl: string, store: ObjectStore, dir: string): Promise<Manifest> {
  mkdirSync(join(dir, "objects"), { recursive: true });
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} });
  try {
    // One repeatable-read transaction exports its snapshot; pg_dump dumps that same snapshot while it stays open,
    // and the figures are read inside it, so the manifest describes exactly what the dump holds.
    return await sql.begin("isolation level repeatable read read only", async (tx) => {
      const [{ snapshot }] = await tx<{ snapshot: string }[]>`select pg_export_snapshot() as snapshot`;
      const before = new Set((await listKeys(store)).map((k) => k.key));
      const dump = spawnSync(pgTool("pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--snapshot=${snapshot}`, `--file=${join(dir, "db.dump")}`, databaseUrl], { encoding: "utf8" });
      if (dump.status !== 0) throw new Error(`pg_dump failed: ${dump.stderr || dump.error?.message}`);
      const database = await tableFigures(tx);
      const objects: Manifest["objects"] = [];
      const after: string[] = [];
      for (const { key } of await listKeys(store)) {
        const bytes = await store.getObjectBytes(key);
        if (!bytes) continue; // deleted while we copied
        const file = join(dir, "objects", key);
        mkdirSync(dirname(file), { recursive: true });
        writeFileSync(file, bytes);
        if (before.has(key)) objects.push({ key, sizeBytes: bytes.length, sha256: sha256(bytes) });
        else after.push(key);
      }
      const manifest: Manifest = { takenAt: new Date().toISOString(), database, objects, objectsAfterSnapshot: after };
      writeFileSync(join(dir, "manifest.json"), JSON.stringify(manifest, null, 2));
      return manifest;
    });
  } finally {
    await sql.end();
  }
}

function filesUnder(root: string): string[] {
  if (!existsSync(root)) return [];
  return readdirSync(root, { recursive: true, encoding: "utf8" })
    .map((f) => join(root, f))
    .filter((f) => statSync(f).isFile());
}

export interface RestoreReport {
  tables: number;
  rows: number;
  mismatches: string[];
  objects: number;
}

/**
 * Restores `dir` into the (empty or old) database and the store, then checks every table's rows and checksum and
 * every object's bytes against the manifest. Mismatches are listed, not hidden.
 */
export async function restoreBackup(databaseUrl: string, store: ObjectStore, dir: string): Promise<RestoreReport> {
  const manifest = JSON.parse(readFileSync(join(dir, "manifest.json"), "utf8")) as Manifest;
  const restore = spawnSync(pgTool("pg_restore"), ["--clean", "--if-exists", "--no-owner", "--no-privileges", "--single-transaction", `--dbname=${databaseUrl}`, join(dir, "db.dump")], { encoding: "utf8" });
  if (restore.status !== 0) throw new Error(`pg_restore failed: ${restore.stderr || restore.error?.message}`);
  await store.ensureBucket();
  const root = join(dir, "objects");
  const files = filesUnder(root);
  for (const file of files) await store.putObject(relative(root, file).split("\\").join("/"), readFileSync(file));

  const mismatches: string[] = [];
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} });
  try {
    const now = await tableFigures(sql);
    for (const [table, want] of Object.entries(manifest.database)) {
      const got = now[table];
      if (!got) mismatches.push(`${table}: missing`);
      else if (got.rows !== want.rows || got.checksum !== want.checksum) mismatches.push(`${table}: ${got.rows} rows (${got.checksum}), dumped ${want.rows} (${want.checksum})`);
    }
  } finally {
    await sql.end();
  }
  for (const o of manifest.objects) {
    const bytes = await store.getObjectBytes(o.key);
    if (!bytes || sha256(bytes) !== o.sha256) mismatches.push(`object ${o.key}: ${bytes ? "different bytes" : "missing"}`);
  }
  const rows = Object.values(manifest.database).reduce((a, t) => a + t.rows, 0);
  return { tables: Object.keys(manifest.database).length, rows, mismatches, objects: files.length };
}
