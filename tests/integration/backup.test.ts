import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import postgres from "postgres";
import { afterAll, describe, expect, it } from "vitest";
import { restoreBackup, tableFigures, takeBackup } from "@/scripts/lib/backup";
import { objectStoreFromEnv } from "@/scripts/lib/object-store-config";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn } from "../helpers/http";
import { uniquePrefix } from "../helpers/stamps";

// npm run backup / restore (scripts/lib/backup.ts): a dump taken while stamps are being written restores into a
// fresh database and bucket with every table's rows and checksum as read in the dump's own snapshot, and every
// object byte for byte. Writes that land after the snapshot are simply not in it (and not counted).
const prefix = uniquePrefix("BK");
const dir = mkdtempSync(join(tmpdir(), "capgrid-backup-"));
const restoreDb = `capgrid_restore_${Date.now()}`;
const admin = () => postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });

afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
  const sql = admin();
  await sql.unsafe(`drop database if exists ${restoreDb}`);
  await sql.end();
});

describe("backup and restore", () => {
  it("restores a dump taken under load to matching row counts, checksums and objects", async () => {
    testEnv();
    const keeper = await createUser("keeper");
    const session = (await signIn(keeper.email, keeper.password))!;
    const store = objectStoreFromEnv();
    await store.putObject(`backup-test/${prefix}.txt`, new TextEncoder().encode(`kept ${prefix}`));

    // Load: keepers adding stamps one after another while the backup runs.
    let writing = true;
    let written = 0;
    const load = (async () => {
      while (writing) {
        const res = await api("POST", "/api/v1/stamps", { session, body: { code: `${prefix}-${written}`, name: `Load ${written}`, widthMm: 100, heightMm: 100 } });
        expect(res.status, JSON.stringify(res.body)).toBe(201);
        written += 1;
      }
    })();
    await new Promise((r) => setTimeout(r, 300));
    const manifest = await takeBackup(process.env.DATABASE_URL!, store, dir);
    writing = false;
    await load;
    expect(written).toBeGreaterThan(0);
    expect(manifest.database["public.stamps"].rows).toBeGreaterThan(0);
    expect(manifest.objects.map((o) => o.key)).toContain(`backup-test/${prefix}.txt`);

    const sql = admin();
    await sql.unsafe(`create database ${restoreDb}`);
    await sql.end();
    const url = new URL(process.env.DATABASE_URL!);
    url.pathname = `/${restoreDb}`;
    const restoreStore = objectStoreFromEnv({ ...process.env, S3_BUCKET: `capgrid-restore-${Date.now()}` });
    const report = await restoreBackup(url.toString(), restoreStore, dir);
    expect(report.mismatches).toEqual([]);
    expect(report.tables).toBe(Object.keys(manifest.database).length);
    expect(new TextDecoder().decode((await restoreStore.getObjectBytes(`backup-test/${prefix}.txt`))!)).toBe(`kept ${prefix}`);

    // The check can fail: the live database has moved on since the snapshot (the load kept writing).
    const live = admin();
    const now = await tableFigures(live);
    await live.end();
    expect(now["public.stamps"].rows).toBeGreaterThanOrEqual(manifest.database["public.stamps"].rows);
  }, 120_000);
});
