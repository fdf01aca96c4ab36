// npm run load — autocannon against a production build served by scripts/server.ts on loopback (a throwaway
// stack with the demo data; CAPGRID_TEST_SLOT, default 11). Each route runs for --duration seconds with
// --connections connections, right after a run of the trivial handler (GET /api/auth/csrf) for --baseline
// seconds, so each ratio compares two runs made minutes apart at most on the same busy machine. Routes: the
// health check, GET /api/v1/me (only the session check), the stamps list, the plans list, one stamp, the layout
// API and a mixed run of reads with check-outs and returns (409 answers there are expected, not errors).
// Prints requests/s, p50, p99, errors (non-2xx other than an expected 409, socket errors, timeouts) and the ratio
// to the trivial handler beside the goal: every read route at half of it or more, p99 under 500 ms.
// --only <text> runs the routes whose label contains it; --profile <dir> runs the server under `node --cpu-prof`
// and prints where its time went (scripts/lib/cpu-profile.ts).
//   npm run load [-- --duration 60 --connections 50 --baseline 20 --only stamps --profile /tmp/capgrid-profile]
import { mkdirSync, rmSync } from "node:fs";
import { resolve } from "node:path";
import autocannon from "autocannon";
import { printProfileSummary } from "./lib/cpu-profile";
import { numberOption, sessionCookie } from "./lib/sign-in";
import { startRestartableTestApp, startTestApp, testEnvironment } from "./lib/test-stack";

const argv = process.argv.slice(2);
const duration = numberOption(argv, "--duration", 60);
const connections = numberOption(argv, "--connections", 50);
const baseline = numberOption(argv, "--baseline", Math.max(5, Math.round(duration / 3)));
const textOption = (name: string) => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);
const only = textOption("--only");
const profileDir = textOption("--profile") && resolve(textOption("--profile")!);
const slot = Number(process.env.CAPGRID_TEST_SLOT ?? 11);
const RATIO_GOAL = 0.5;
const P99_GOAL_MS = 500;
const MIXED_STAMPS = 20;

// 1150 mm mori with 25 mm margins, a 200 × 200 mm stamp stepped straight over 100 m (tests/integration/layout-api.test.ts).
const layoutBody = { cloth: { widthMm: 1150, lengthMm: 100_000, margins: { leftMm: 25, rightMm: 25 } }, stamp: { widthMm: 200, heightMm: 200 }, gap: { xMm: 0, yMm: 0 }, arrangement: "straight" };

interface Target {
  label: string;
  /** A read route: held to the goal. */
  read: boolean;
  options: Partial<autocannon.Options>;
  /** Statuses that are answers, not errors, besides 2xx. */
  expected?: number[];
}

interface Figures {
  rps: number;
  p50: number;
  p99: number;
  total: number;
  errors: number;
  expected: number;
  /** The statuses counted as errors, "503×12". */
  errorCodes: string;
}

const { env, dataDir } = testEnvironment(slot);
const appUrl = env.APP_URL!;
// The server listens on 127.0.0.1 only; the load goes there directly (APP_URL names localhost).
const loopback = `http://127.0.0.1:${env.PORT}`;
if (profileDir) {
  rmSync(profileDir, { recursive: true, force: true });
  mkdirSync(profileDir, { recursive: true });
}
// With --profile the server runs under `node --cpu-prof` (the same server, in a process group of its own).
const app = profileDir ? await startRestartableTestApp(dataDir, { nodeArgs: ["--cpu-prof", `--cpu-prof-dir=${profileDir}`] }) : await startTestApp(dataDir);
let failed = false;
try {
  const { database } = await import("@/db");
  const { stamps } = await import("@/db/schema");
  const { seedDemo } = await import("./lib/seed");
  const { demoUsers } = await import("./seed/users");
  const { client, db } = database();
  const seededAt = performance.now();
  await seedDemo(db);
  const mixedCodes = Array.from({ length: MIXED_STAMPS }, (_, i) => `LOAD-${String(i + 1).padStart(2, "0")}`);
  await db.insert(stamps).values(mixedCodes.map((code) => ({ code, name: `Load stamp ${code}`, widthMm: 200, heightMm: 200 })));
  await client.unsafe("ANALYZE");
  const [{ n: stampCount }] = await client<{ n: number }[]>`SELECT count(*)::int AS n FROM stamps`;
  const [{ n: planCount }] = await client<{ n: number }[]>`SELECT count(*)::int AS n FROM plans`;
  await client.end();
  const admin = demoUsers.find((u) => u.role === "admin")!;
  const cookie = await sessionCookie(appUrl, admin.email, admin.password);
  console.log(`[load] demo data in ${((performance.now() - seededAt) / 1000).toFixed(1)} s: ${stampCount} stamps, ${planCount} plans; signed in as the demo admin`);

  const due = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
  let seq = 0;
  const mixedRequest = (): autocannon.Request => {
    const code = mixedCodes[Math.floor(Math.random() * mixedCodes.length)];
    const roll = Math.random();
    if (roll < 0.4) return { method: "GET", path: "/api/v1/stamps?pageSize=50" };
    if (roll < 0.6) return { method: "GET", path: `/api/v1/stamps/${code}` };
    if (roll < 0.8) {
      seq++;
      return { method: "POST", path: `/api/v1/stamps/${code}/checkout`, headers: { "content-type": "application/json" }, body: JSON.stringify({ borrowerName: `Stamper ${seq % 20}`, workstation: `Table ${seq % 6}`, dueOn: due }) };
    }
    return { method: "POST", path: `/api/v1/stamps/${code}/return`, headers: { "content-type": "application/json" }, body: JSON.stringify({ impressions: 1 + (seq % 30) }) };
  };

  const signedIn = { headers: { cookie, accept: "application/json" } };
  const trivial: Target = { label: "GET /api/auth/csrf (trivial)", read: false, options: { url: `${loopback}/api/auth/csrf` } };
  const allTargets: Target[] = [
    { label: "GET /api/health", read: false, options: { url: `${loopback}/api/health` } },
    { label: "GET /api/v1/me (session check only)", read: true, options: { url: `${loopback}/api/v1/me`, ...signedIn } },
    { label: "GET /api/v1/stamps?pageSize=50", read: true, options: { url: `${loopback}/api/v1/stamps?pageSize=50`, ...signedIn } },
    { label: "GET /api/v1/plans", read: true, options: { url: `${loopback}/api/v1/plans`, ...signedIn } },
    { label: "GET /api/v1/stamps/CP-0001", read: true, options: { url: `${loopback}/api/v1/stamps/CP-0001`, ...signedIn } },
    { label: "POST /api/v1/layout (100 m plan)", read: true, options: { url: `${loopback}/api/v1/layout`, method: "POST", body: JSON.stringify(layoutBody), headers: { ...signedIn.headers, "content-type": "application/json" } } },
    {
      label: "mixed: 60 % reads, check-outs, returns",
      read: false,
      expected: [409],
      options: {
        ...signedIn,
        requests: [
          {
            setupRequest: (request: autocannon.Request) => {
              const next = mixedRequest();
              return { ...request, ...next, headers: { ...request.headers, ...(next.headers ?? {}) } };
            },
          },
        ],
      },
    },
  ];

  const targets = allTargets.filter((t) => !only || t.label.includes(only));
  if (!targets.length) throw new Error(`no route's label contains "${only}"`);

  const measure = async (target: Target, seconds: number, conns = connections): Promise<Figures> => {
    const result = await autocannon({ url: loopback, connections: conns, duration: seconds, timeout: 30, ...target.options } as autocannon.Options);
    const codes = result.statusCodeStats as unknown as Record<string, { count: number }>;
    let expected = 0;
    let bad = 0;
    const badCodes: string[] = [];
    for (const [code, { count }] of Object.entries(codes ?? {})) {
      const status = Number(code);
      if (status >= 200 && status < 300) continue;
      if (target.expected?.includes(status)) expected += count;
      else {
        bad += count;
        badCodes.push(`${status}×${count}`);
      }
    }
    if (result.errors) badCodes.push(`socket errors×${result.errors}`);
    if (result.timeouts) badCodes.push(`timeouts×${result.timeouts}`);
    return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, total: result.requests.total, errors: bad + result.errors + result.timeouts, expected, errorCodes: badCodes.join(", ") };
  };

  // Warm-up: every route a moment at a few connections, so module loading and first compiles are not measured.
  for (const t of [trivial, ...targets]) await measure(t, 2, 4);

  const minutes = (targets.length * (duration + baseline)) / 60;
  console.log(`[load] ${connections} connections, ${duration} s per route, the trivial handler ${baseline} s before each (about ${minutes.toFixed(0)} min)\n`);
  const header = `${"route".padEnd(42)} ${"req/s".padStart(7)} ${"p50".padStart(8)} ${"p99".padStart(8)} ${"errors".padStart(7)} ${"409".padStart(6)} ${"trivial".padStart(8)} ${"ratio".padStart(6)}  goal (ratio ≥ ${RATIO_GOAL}, p99 < ${P99_GOAL_MS} ms)`;
  console.log(header);
  const rows: string[] = [];
  const perRequest = new Map<string, { route: number; trivial: number }>();
  let misses = 0;
  for (const target of targets) {
    const base = await measure(trivial, baseline);
    const f = await measure(target, duration);
    const ratio = f.rps / base.rps;
    const verdict = target.read ? (ratio >= RATIO_GOAL && f.p99 < P99_GOAL_MS && f.errors === 0 ? "met" : `MISSED${ratio < RATIO_GOAL ? " (ratio)" : ""}${f.p99 >= P99_GOAL_MS ? " (p99)" : ""}${f.errors ? " (errors)" : ""}`) : f.errors === 0 ? "0 errors" : "ERRORS";
    if (verdict !== "met" && verdict !== "0 errors") misses++;
    const line = `${target.label.padEnd(42)} ${f.rps.toFixed(0).padStart(7)} ${`${f.p50} ms`.padStart(8)} ${`${f.p99} ms`.padStart(8)} ${String(f.errors).padStart(7)} ${String(f.expected).padStart(6)} ${base.rps.toFixed(0).padStart(8)} ${ratio.toFixed(2).padStart(6)}  ${verdict}${f.errorCodes ? ` [${f.errorCodes}]` : ""}`;
    rows.push(line);
    perRequest.set(target.label, { route: 1000 / f.rps, trivial: 1000 / base.rps });
    console.log(line);
    console.log(`${"  (trivial handler just before)".padEnd(42)} ${base.rps.toFixed(0).padStart(7)} ${`${base.p50} ms`.padStart(8)} ${`${base.p99} ms`.padStart(8)} ${String(base.errors).padStart(7)}`);
  }
  // At saturation 1/throughput is what one request costs the machine (app, PostgreSQL and load generator together).
  const me = perRequest.get(allTargets[1].label);
  if (me) {
    console.log(`\nmachine time per request at saturation (1 / req/s): trivial ${me.trivial.toFixed(1)} ms, the session check alone (GET /api/v1/me) ${me.route.toFixed(1)} ms`);
    for (const [label, cost] of perRequest) if (label !== allTargets[1].label && label !== allTargets[0].label) console.log(`  ${label}: ${cost.route.toFixed(1)} ms, of which beyond the session check ${(cost.route - me.route).toFixed(1)} ms`);
  }
  console.log(`\n${misses ? `${misses} route(s) missed the goal` : "every route met the goal"} (${connections} connections, ${duration} s each; the load generator runs on the same machine as the app and PostgreSQL)`);
  failed = misses > 0;
} catch (error) {
  console.error(error);
  failed = true;
} finally {
  app.stop();
}
if (profileDir) {
  // The profile is written when the server exits after SIGTERM.
  await new Promise((done) => setTimeout(done, 8000));
  printProfileSummary(profileDir);
}
process.exit(failed ? 1 : 0);
