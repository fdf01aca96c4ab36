// npm run backup [-- --out <folder>]: the database (pg_dump, one snapshot) and every object in the store, with a
// manifest of row counts and checksums read in the dump's own snapshot. Uses the same DATABASE_URL and S3_*
// variables as the app, so it backs up a managed database and a real bucket the same way.
import { join } from "node:path";
import { loadConfig, projectRoot } from "./lib/config";
import { takeBackup } from "./lib/backup";
import { objectStoreFromEnv } from "./lib/object-store-config";

const env = loadConfig();
const args = process.argv.slice(2);
const out = args.includes("--out") ? args[args.indexOf("--out") + 1] : join(projectRoot, "backups", new Date().toISOString().replace(/[:.]/g, "-"));
const started = Date.now();
const manifest = await takeBackup(env.DATABASE_URL!, objectStoreFromEnv(env), out);
const rows = Object.values(manifest.database).reduce((a, t) => a + t.rows, 0);
console.log(`Backup in ${out}: ${Object.keys(manifest.database).length} tables, ${rows} rows, ${manifest.objects.length} objects (+${manifest.objectsAfterSnapshot.length} written during the backup) in ${((Date.now() - started) / 1000).toFixed(1)} s.`);
