// npm run remind — e-mails every borrower whose stamp check-out is overdue (for a daily cron job).
// Uses DATABASE_URL and the SMTP settings from the environment, .env or .env.example.
import { loadConfig } from "./lib/config";
import { allowServerModules } from "./lib/server-modules";

loadConfig();
allowServerModules();
const { database } = await import("@/db");
const { remindOverdueBorrowers } = await import("@/lib/data/stamps/mail");

const { client } = database();
try {
  // A daily job starts a little earlier or later each day: 20 hours keeps it from skipping yesterday's
  // borrowers, while a keeper's click an hour before still counts.
  const result = await remindOverdueBorrowers({ gapHours: 20 });
  for (const s of result.sent) console.log(`reminded ${s.borrowerName} <${s.borrowerEmail}> about ${s.code}`);
  for (const s of result.skipped) console.log(`skipped ${s.borrowerName} (${s.code}): reminded at ${s.lastRemindedAt}`);
  for (const w of result.withoutEmail) console.log(`no e-mail address for ${w.borrowerName} (${w.code}): tell them in person`);
  for (const f of result.failed) console.error(`could not send the reminder for ${f.code} to ${f.borrowerName}`);
  console.log(`${result.sent.length} reminder(s) sent, ${result.skipped.length} skipped, ${result.withoutEmail.length} without an address, ${result.failed.length} failed.`);
  process.exitCode = result.failed.length ? 1 : 0;
} finally {
  await client.end();
}
