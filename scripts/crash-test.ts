// npm run crash-test — kills the app (`kill -9`) and then PostgreSQL (`pg_ctl stop -m immediate`) in the middle of
// a burst of check-outs, returns, waxing records and stamp edits, starts each again, and checks after every round:
// every acknowledged write (a 2xx answer received) is in the database; no stamp has two open check-outs; each
// waxing's wax use and progress row are one-to-one, with stock movements that add up to its grams; each stamp's
// impression count is the sum of the impressions recorded for it; the history has one entry per check-out and
// return. Prints a line per round and the figures. A throwaway stack (CAPGRID_TEST_SLOT, default 12).
//   npm run crash-test [-- --rounds 20 --db-rounds 10]
import { rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { numberOption, sessionCookie } from "./lib/sign-in";
import { restartCluster, stopClusterAbruptly } from "./lib/postgres-faults";
import { startRestartableTestApp, testEnvironment } from "./lib/test-stack";

const argv = process.argv.slice(2);
const appRounds = numberOption(argv, "--rounds", 20);
const dbRounds = numberOption(argv, "--db-rounds", 10);
const slot = Number(process.env.CAPGRID_TEST_SLOT ?? 12);

const STAMPS = 8;
const RUNS = 3;
/** How long the app gets to answer GET /api/health with 200 once PostgreSQL is up again, before it is restarted. */
const RECONNECT_LIMIT_MS = 60_000;
const PREFIX = "CRASH";
const today = new Date().toISOString().slice(0, 10);
const due = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const pick = <T>(list: readonly T[]) => list[Math.floor(Math.random() * list.length)];
const between = (a: number, b: number) => a + Math.floor(Math.random() * (b - a + 1));

type Kind = "checkout" | "return" | "progress" | "edit";
interface Write {
  kind: Kind;
  marker: string;
  round: number;
  impressions?: number;
  sentAt: number;
  answeredAt?: number;
  status?: number;
}

const { env, dataDir } = testEnvironment(slot);
const appUrl = env.APP_URL!;
console.log(`[crash] throwaway stack in ${dataDir}, app on ${appUrl}; ${appRounds} app kills, ${dbRounds} PostgreSQL stops`);
// The server's errors while PostgreSQL is down are many; they go to a file, not the screen.
const appLog = join(tmpdir(), `capgrid-crash-test-${slot}-app.log`);
rmSync(appLog, { force: true });
const app = await startRestartableTestApp(dataDir, { logFile: appLog });
let failed = false;
try {
  const { database } = await import("@/db");
  const { stamps } = await import("@/db/schema");
  const { seedUsers, demoUsers } = await import("./seed/users");
  const { seedWax } = await import("./seed/wax");
  const { client, db } = database();
  await seedUsers(db);
  await seedWax(db);
  const admin = demoUsers.find((u) => u.role === "admin")!;
  const cookie = await sessionCookie(appUrl, admin.email, admin.password);

  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- the script reads whatever the API answered
  const call = async (method: string, path: string, body?: unknown): Promise<{ status: number; json: any }> => {
    try {
      const response = await fetch(`${appUrl}${path}`, {
        method,
        headers: { cookie, accept: "application/json", ...(body === undefined ? {} : { "content-type": "application/json" }) },
        body: body === undefined ? undefined : JSON.stringify(body),
        signal: AbortSignal.timeout(15_000),
      });
      const text = await response.text();
      // eslint-disable-next-line @typescript-eslint/no-explicit-any -- as above
      let json: any = null;
      try {
        json = text ? JSON.parse(text) : null;
      } catch {
        json = { raw: text.slice(0, 200) };
      }
      return { status: response.status, json };
    } catch {
      return { status: 0, json: null }; // no answer: connection refused or reset
    }
  };
  const must = async (method: string, path: string, body: unknown, status: number) => {
    const r = await call(method, path, body);
    if (r.status !== status) throw new Error(`${method} ${path} answered ${r.status}: ${JSON.stringify(r.json)}`);
    return r.json;
  };

  // Fixtures: stamps to check out, return and edit; runs whose waxing stage has one stamp of its own.
  const codes = Array.from({ length: STAMPS }, (_, i) => `${PREFIX}-K${i + 1}`);
  await db.insert(stamps).values(codes.map((code) => ({ code, name: `Crash stamp ${code}`, widthMm: 200, heightMm: 200 })));
  const recipes = (await must("GET", "/api/v1/wax/recipes", undefined, 200)).recipes as { id: string; archivedAt?: string | null }[];
  const recipe = recipes.find((r) => !r.archivedAt)!;
  const runs: { id: string; stageId: string; code: string }[] = [];
  for (let i = 1; i <= RUNS; i++) {
    const code = `${PREFIX}-W${i}`;
    await db.insert(stamps).values({ code, name: `Crash wax stamp ${code}`, widthMm: 200, heightMm: 200 });
    const motif = (
      await must("POST", "/api/v1/motifs", { name: `Crash motif ${i}`, stamps: [{ code, role: "main" }], colourways: [{ name: "Cream", colours: [{ name: "Cream", swatch: "#f4efe6", waxStamps: [code], face: "front" }, { name: "Indigo", swatch: "#1f3a5f" }] }] }, 201)
    ).motif;
    const layout = { cloth: { widthMm: 1150, lengthMm: 30_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { code }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" };
    const plan = (await must("POST", "/api/v1/plans", { name: `Crash plan ${i}`, layout, motifId: motif.id }, 201)).plan;
    const run = (await must("POST", "/api/v1/runs", { name: `Crash run ${i}`, motifId: motif.id, colourwayId: motif.colourways[0].id, cloth: "mori 115 cm", metres: 30, planIds: [plan.id], recipeId: recipe.id }, 201)).run;
    const stage = run.stages.find((s: { kind: string }) => s.kind === "wax");
    runs.push({ id: run.id, stageId: stage.id, code });
  }
  const allCodes = [...codes, ...runs.map((r) => r.code)];

  // --- the burst --------------------------------------------------------------------------------------------
  const writes: Write[] = [];
  const faults: { start: number; end: number }[] = [];
  const unexpected: string[] = [];
  const tally = { acknowledged: 0, conflicts: 0, noAnswer: 0, failedInFault: 0 };
  const versions = new Map<string, number>();
  let seq = 0;
  let round = 0;
  let burstOn = false;
  // Between a fault and the service answering again, clients wait (as a person would) instead of hammering.
  let down = false;

  const inFault = (w: Write) => faults.some((f) => w.sentAt <= f.end && (w.answeredAt ?? Infinity) >= f.start) || faults.some((f) => f.end === Infinity);
  const send = async (kind: Kind, method: string, path: string, body: Record<string, unknown>, marker: string, okStatus: number, extra: Partial<Write> = {}) => {
    const w: Write = { kind, marker, round, sentAt: performance.now(), ...extra };
    writes.push(w);
    const r = await call(method, path, body);
    w.answeredAt = performance.now();
    w.status = r.status;
    if (r.status === okStatus) tally.acknowledged++;
    else if (r.status === 409) tally.conflicts++;
    else if (inFault(w) && r.status === 0) tally.noAnswer++;
    else if (inFault(w)) tally.failedInFault++;
    else unexpected.push(`round ${round}: ${method} ${path} → ${r.status} ${JSON.stringify(r.json)?.slice(0, 200)}`);
    return r;
  };
  const pause = async (status: number) => {
    await sleep(status === 0 || status >= 500 ? 50 : between(0, 10));
    while (down && burstOn) await sleep(50);
  };

  const shelfWorker = async () => {
    while (burstOn) {
      const code = pick(codes);
      const marker = `cr-${++seq}`;
      const r =
        Math.random() < 0.5
          ? await send("checkout", "POST", `/api/v1/stamps/${code}/checkout`, { borrowerName: `Stamper ${seq % 20}`, workstation: `Table ${seq % 6}`, dueOn: due, note: marker }, marker, 201)
          : await (async () => {
              const impressions = between(1, 30);
              return send("return", "POST", `/api/v1/stamps/${code}/return`, { note: marker, impressions }, marker, 200, { impressions });
            })();
      await pause(r.status);
    }
  };
  const waxWorker = async (run: (typeof runs)[number]) => {
    while (burstOn) {
      const marker = `cr-${++seq}`;
      const impressions = between(5, 40);
      const r = await send("progress", "POST", `/api/v1/runs/${run.id}/stages/${run.stageId}/progress`, { doneOn: today, metres: 0.2, gramsUsed: between(10, 40), impressions, note: marker }, marker, 201, { impressions });
      await pause(r.status);
    }
  };
  const editWorker = async (mine: string[]) => {
    while (burstOn) {
      const code = pick(mine);
      if (!versions.has(code)) {
        const got = await call("GET", `/api/v1/stamps/${code}`);
        if (got.status === 200) versions.set(code, got.json.stamp.version);
        else await pause(got.status);
        continue;
      }
      const marker = `cr-${++seq}`;
      const r = await send("edit", "PATCH", `/api/v1/stamps/${code}`, { version: versions.get(code), notes: marker }, marker, 200);
      if (r.status === 200) versions.set(code, r.json.stamp.version);
      else versions.delete(code); // 409 or no answer: read the version again
      await pause(r.status);
    }
  };
  const startBurst = () => {
    burstOn = true;
    return Promise.all([
      ...Array.from({ length: 8 }, () => shelfWorker()),
      ...runs.flatMap((run) => [waxWorker(run), waxWorker(run)]),
      editWorker(codes.slice(0, 4)),
      editWorker(codes.slice(4)),
    ]);
  };
  const untilHealthy = async (timeoutMs = 90_000) => {
    const deadline = performance.now() + timeoutMs;
    while (performance.now() < deadline) {
      if ((await call("GET", "/api/health")).status === 200) return;
      await sleep(50);
    }
    throw new Error(`the app did not answer GET /api/health with 200 within ${timeoutMs / 1000} s`);
  };

  // --- the checks -------------------------------------------------------------------------------------------
  const verify = async () => {
    const problems: string[] = [];
    const acked = (kind: Kind) => writes.filter((w) => w.kind === kind && w.status !== undefined && w.status >= 200 && w.status < 300);
    const unanswered = (kind: Kind) => writes.filter((w) => w.kind === kind && (w.status === 0 || (w.status ?? 0) >= 500));
    const stampRows = await client<{ id: string; code: string; impressions_count: number }[]>`SELECT id, code, impressions_count FROM stamps WHERE code = ANY(${allCodes})`;
    const ids = stampRows.map((s) => s.id);
    const stageIds = runs.map((r) => r.stageId);

    const checkoutNotes = new Set((await client<{ note: string }[]>`SELECT note FROM checkouts WHERE stamp_id = ANY(${ids}) AND note IS NOT NULL`).map((r) => r.note));
    const returnNotes = new Set((await client<{ note: string }[]>`SELECT note FROM stamp_events WHERE kind = 'returned' AND stamp_id = ANY(${ids}) AND note IS NOT NULL`).map((r) => r.note));
    const progressNotes = new Set((await client<{ note: string }[]>`SELECT note FROM run_progress WHERE stage_id = ANY(${stageIds}) AND note IS NOT NULL`).map((r) => r.note));
    const editNotes = new Set(
      (await client<{ to: string }[]>`SELECT c->>'to' AS to FROM stamp_events, jsonb_array_elements(details->'changes') c WHERE kind = 'edited' AND stamp_id = ANY(${ids}) AND c->>'field' = 'notes'`).map((r) => r.to),
    );
    const stored: Record<Kind, Set<string>> = { checkout: checkoutNotes, return: returnNotes, progress: progressNotes, edit: editNotes };
    const lost: Record<Kind, number> = { checkout: 0, return: 0, progress: 0, edit: 0 };
    const committedUnanswered: Record<Kind, number> = { checkout: 0, return: 0, progress: 0, edit: 0 };
    for (const kind of Object.keys(stored) as Kind[]) {
      for (const w of acked(kind)) if (!stored[kind].has(w.marker)) lost[kind]++;
      for (const w of unanswered(kind)) if (stored[kind].has(w.marker)) committedUnanswered[kind]++;
      if (lost[kind]) problems.push(`${lost[kind]} acknowledged ${kind}s missing`);
    }

    const doubleOpen = await client`SELECT stamp_id, count(*)::int AS n FROM checkouts WHERE returned_at IS NULL AND stamp_id = ANY(${ids}) GROUP BY stamp_id HAVING count(*) > 1`;
    if (doubleOpen.length) problems.push(`${doubleOpen.length} stamps with two open check-outs`);
    const history = await client<{ code: string; rows: number; out_events: number; returned: number; return_events: number }[]>`
      SELECT s.code,
        (SELECT count(*)::int FROM checkouts c WHERE c.stamp_id = s.id) AS rows,
        (SELECT count(*)::int FROM stamp_events e WHERE e.stamp_id = s.id AND e.kind = 'checked_out') AS out_events,
        (SELECT count(*)::int FROM checkouts c WHERE c.stamp_id = s.id AND c.returned_at IS NOT NULL) AS returned,
        (SELECT count(*)::int FROM stamp_events e WHERE e.stamp_id = s.id AND e.kind = 'returned') AS return_events
      FROM stamps s WHERE s.id = ANY(${ids})`;
    for (const h of history) if (h.rows !== h.out_events || h.returned !== h.return_events) problems.push(`${h.code}: ${h.rows} check-outs / ${h.out_events} in history, ${h.returned} returned / ${h.return_events} in history`);

    const [pairing] = await client<{ uses: number; progress: number; orphan_uses: number; progress_without_use: number; stock_off: number; impressions_off: number }[]>`
      SELECT
        (SELECT count(*)::int FROM wax_uses WHERE run_stage_id = ANY(${stageIds})) AS uses,
        (SELECT count(*)::int FROM run_progress WHERE stage_id = ANY(${stageIds})) AS progress,
        (SELECT count(*)::int FROM wax_uses w WHERE w.run_stage_id = ANY(${stageIds}) AND NOT EXISTS (SELECT 1 FROM run_progress p WHERE p.wax_use_id = w.id)) AS orphan_uses,
        (SELECT count(*)::int FROM run_progress p WHERE p.stage_id = ANY(${stageIds}) AND p.wax_use_id IS NULL) AS progress_without_use,
        (SELECT count(*)::int FROM wax_uses w WHERE w.run_stage_id = ANY(${stageIds})
           AND abs(coalesce((SELECT sum(m.kg) FROM wax_stock_movements m WHERE m.wax_use_id = w.id AND m.kind = 'use'), 0) + w.grams / 1000) > 1e-9) AS stock_off,
        (SELECT count(*)::int FROM run_progress p WHERE p.stage_id = ANY(${stageIds})
           AND p.impressions IS DISTINCT FROM (SELECT sum(i.impressions)::int FROM wax_use_impressions i WHERE i.wax_use_id = p.wax_use_id)) AS impressions_off`;
    if (pairing.uses !== pairing.progress || pairing.orphan_uses || pairing.progress_without_use) problems.push(`wax uses ${pairing.uses} vs progress rows ${pairing.progress} (${pairing.orphan_uses} uses alone, ${pairing.progress_without_use} records without a use)`);
    if (pairing.stock_off) problems.push(`${pairing.stock_off} wax uses whose stock movements do not add up to their grams`);
    if (pairing.impressions_off) problems.push(`${pairing.impressions_off} waxing records whose impressions differ from their wax use's`);

    const impressions = await client<{ code: string; count: number; recorded: number }[]>`
      SELECT s.code, s.impressions_count AS count,
        coalesce((SELECT sum((e.details->>'impressions')::int) FROM stamp_events e WHERE e.stamp_id = s.id AND e.kind = 'returned'), 0)::int
        + coalesce((SELECT sum(i.impressions) FROM wax_use_impressions i JOIN wax_uses w ON w.id = i.wax_use_id WHERE i.stamp_id = s.id AND w.withdrawn_at IS NULL), 0)::int AS recorded
      FROM stamps s WHERE s.id = ANY(${ids})`;
    for (const s of impressions) if (s.count !== s.recorded) problems.push(`${s.code}: impression count ${s.count}, recorded ${s.recorded}`);
    return { problems, committedUnanswered, pairing, totalImpressions: impressions.reduce((a, s) => a + s.count, 0) };
  };

  // --- the rounds -------------------------------------------------------------------------------------------
  interface RoundFigures {
    fault: "app" | "db";
    acknowledged: number;
    inFlight: number;
    committedUnanswered: number;
    downMs: number;
    /** PostgreSQL was back but the app did not reconnect within RECONNECT_LIMIT_MS; it was restarted. */
    appRestarted: boolean;
    problems: string[];
  }
  const figures: RoundFigures[] = [];
  const countCommitted = (c: Record<Kind, number>) => Object.values(c).reduce((a, b) => a + b, 0);
  let committedBefore = 0;

  const runRound = async (fault: "app" | "db") => {
    round++;
    const ackBefore = tally.acknowledged;
    const burst = startBurst();
    await sleep(between(400, 1600));
    const f = { start: performance.now(), end: Infinity };
    faults.push(f);
    down = true;
    const inFlight = writes.filter((w) => w.status === undefined).length;
    if (fault === "app") {
      await app.kill();
      await sleep(200);
      await app.restart();
    } else {
      stopClusterAbruptly(app.pgDir);
      await sleep(1000);
      restartCluster(app.pgDir, env.DATABASE_URL!);
    }
    let appRestarted = false;
    try {
      await untilHealthy(fault === "app" ? 90_000 : RECONNECT_LIMIT_MS);
    } catch (error) {
      if (fault === "app") throw error;
      // PostgreSQL is up again but the app's pool has not come back: a finding, printed; restart the app and go on.
      appRestarted = true;
      await app.kill();
      await app.restart();
      await untilHealthy();
    }
    f.end = performance.now();
    down = false;
    await sleep(600); // the burst goes on against the restarted service
    burstOn = false;
    await burst;
    const result = await verify();
    const committed = countCommitted(result.committedUnanswered);
    const r: RoundFigures = { fault, acknowledged: tally.acknowledged - ackBefore, inFlight, committedUnanswered: committed - committedBefore, downMs: f.end - f.start, appRestarted, problems: result.problems };
    committedBefore = committed;
    figures.push(r);
    console.log(
      `[crash] round ${String(round).padStart(2)} ${fault === "app" ? "kill -9 app     " : "stop -m immediate"}: ${String(r.acknowledged).padStart(4)} acknowledged, ${String(inFlight).padStart(2)} in flight at the fault (${r.committedUnanswered} committed without an answer), back after ${(r.downMs / 1000).toFixed(1)} s${appRestarted ? ` (the app had not reconnected ${RECONNECT_LIMIT_MS / 1000} s after PostgreSQL was up: restarted it)` : ""} — ${result.problems.length ? `PROBLEMS: ${result.problems.join("; ")}` : "all acknowledged writes there, nothing double-booked"}`,
    );
    return result;
  };

  for (let i = 0; i < appRounds; i++) await runRound("app");
  for (let i = 0; i < dbRounds; i++) await runRound("db");
  const final = await verify();

  const byKind = (kind: Kind) => writes.filter((w) => w.kind === kind && (w.status ?? 0) >= 200 && (w.status ?? 0) < 300).length;
  const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)] ?? 0;
  const appFig = figures.filter((r) => r.fault === "app");
  const dbFig = figures.filter((r) => r.fault === "db");
  console.log(`\nCrash and restart: ${appFig.length} × kill -9 of the app, ${dbFig.length} × pg_ctl stop -m immediate, each in the middle of a burst`);
  console.log(`  writes sent ${writes.length}: ${tally.acknowledged} acknowledged (check-outs ${byKind("checkout")}, returns ${byKind("return")}, waxing records ${byKind("progress")}, edits ${byKind("edit")}), ${tally.conflicts} answered 409 (expected), ${tally.noAnswer} without an answer and ${tally.failedInFault} refused with 5xx during a fault`);
  console.log(`  acknowledged writes missing after restart: ${figures.reduce((a, r) => a + r.problems.filter((p) => p.includes("acknowledged")).length, 0) === 0 && final.problems.length === 0 ? 0 : "SEE ABOVE"}`);
  console.log(`  committed without an answer (in flight at the fault, found in the database): ${countCommitted(final.committedUnanswered)} of ${figures.reduce((a, r) => a + r.inFlight, 0)} in flight`);
  console.log(`  wax uses ${final.pairing.uses} = waxing records ${final.pairing.progress}; impressions counted ${final.totalImpressions} = recorded; stamps with two open check-outs: 0 expected`);
  if (appFig.length) console.log(`  app back (port open, GET /api/health 200) after a kill: median ${(median(appFig.map((r) => r.downMs)) / 1000).toFixed(1)} s, slowest ${(Math.max(...appFig.map((r) => r.downMs)) / 1000).toFixed(1)} s`);
  const reconnected = dbFig.filter((r) => !r.appRestarted);
  if (reconnected.length) console.log(`  app answering again after PostgreSQL's stop (1 s down, restart, recovery): median ${(median(reconnected.map((r) => r.downMs)) / 1000).toFixed(1)} s, slowest ${(Math.max(...reconnected.map((r) => r.downMs)) / 1000).toFixed(1)} s (${reconnected.length} of ${dbFig.length} stops)`);
  const stuck = dbFig.length - reconnected.length;
  if (stuck) console.log(`  FINDING: after ${stuck} of ${dbFig.length} stops the app had not reconnected ${RECONNECT_LIMIT_MS / 1000} s after PostgreSQL was up (GET /api/health 503, database down) and was restarted`);
  const hung = unexpected.filter((u) => / → 0 null$/.test(u)).length;
  console.log(`  unexpected answers outside a fault (not 2xx or 409): ${unexpected.length}, of which ${hung} no answer within 15 s (the request hung)`);
  for (const u of unexpected.slice(0, 10)) console.log(`    ${u}`);
  const problems = [...new Set([...figures.flatMap((r) => r.problems), ...final.problems])];
  for (const p of problems) console.log(`  PROBLEM: ${p}`);
  failed = problems.length > 0 || unexpected.length > 0;
  console.log(`  the server's standard error: ${appLog}`);
  console.log(problems.length ? "\ndata: NOT held (see the problems above)" : "\ndata: held — every acknowledged write survived, nothing double-booked or counted twice");
  console.log(unexpected.length || stuck ? `service: NOT held — ${unexpected.length} requests outside a fault went unanswered or failed${stuck ? `, ${stuck} restart(s) needed` : ""}` : "service: held — every request outside a fault answered 2xx or 409");
  await client.end({ timeout: 1 });
} catch (error) {
  console.error(error);
  failed = true;
} finally {
  app.stop();
}
process.exit(failed ? 1 : 0);
