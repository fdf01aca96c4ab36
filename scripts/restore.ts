// npm run restore -- <folder>: puts a backup back (pg_restore --clean into DATABASE_URL, objects into S3_BUCKET)
// and checks every table's row count and checksum and every object against the backup's manifest.
import { loadConfig } from "./lib/config";
import { restoreBackup } from "./lib/backup";
import { objectStoreFromEnv } from "./lib/object-store-config";

const dir = process.argv[2];
if (!dir) {
  console.error("Usage: npm run restore -- <backup folder> (made by npm run backup)");
  process.exit(2);
}
const env = loadConfig();
const report = await restoreBackup(env.DATABASE_URL!, objectStoreFromEnv(env), dir);
console.log(`Restored ${report.tables} tables (${report.rows} rows) and ${report.objects} objects from ${dir}.`);
if (report.mismatches.length) {
  console.error(`Not as dumped:\n  ${report.mismatches.join("\n  ")}`);
  process.exit(1);
}
console.log("Every table's rows and checksum and every object match the backup's manifest.");
