// The app's HTTP server: node:http in front of Next's own request handler, so that the app knows the
// client's real address. `next start` passes a client-sent X-Forwarded-For through unchanged; here every
// request gets the socket's address in `clientAddressHeader`, whatever the client sent, and the
// X-Forwarded-* headers are dropped — unless TRUST_PROXY says how many proxies in front add them.
// Used by `npm start`, `npm run dev`, `npm run serve` and the test stack.
//   tsx scripts/server.ts [--dev] [--port 3000] [--host 127.0.0.1]
import { createServer } from "node:http";
import next from "next";
import { clientAddress, clientAddressHeader, forwardedHeaders, serverMarkerVariable } from "../lib/client-address";
import { loadConfig, projectRoot } from "./lib/config";
import { allowServerModules } from "./lib/server-modules";

const argv = process.argv.slice(2);
const option = (name: string) => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);
const dev = argv.includes("--dev");
const env = loadConfig();
const port = Number(option("--port") ?? env.PORT ?? 3000);
const hostname = option("--host") ?? env.CAPGRID_HOST ?? "127.0.0.1";
const trustedProxies = /^\d+$/.test(env.TRUST_PROXY ?? "") ? Number(env.TRUST_PROXY) : 0;

// Next.js reads NODE_ENV itself; `next start` and `next dev` set it the same way.
Object.assign(process.env, { NODE_ENV: dev ? "development" : "production", [serverMarkerVariable]: "1" });

const app = next({ dev, dir: projectRoot, hostname, port });
const handle = app.getRequestHandler();
await app.prepare();

const server = createServer((req, res) => {
  const address = clientAddress(req.socket.remoteAddress, req.headers["x-forwarded-for"], trustedProxies);
  if (trustedProxies === 0) for (const name of forwardedHeaders) delete req.headers[name];
  if (address) req.headers[clientAddressHeader] = address;
  else delete req.headers[clientAddressHeader];
  void handle(req, res);
});
// The job workers (lib/jobs): in this process beside Next, on the same database; JOBS=off leaves them to other servers.
if (!dev && process.env.JOBS !== "off") {
  allowServerModules();
  const { startJobWorkers } = await import("@/lib/jobs/workers");
  await startJobWorkers();
}

server.listen(port, hostname, () => console.log(`[server] ${dev ? "development" : "production"} on http://${hostname}:${port}${trustedProxies ? `, behind ${trustedProxies} trusted prox${trustedProxies === 1 ? "y" : "ies"}` : ""}`));

const stop = () => {
  server.close(() => process.exit(0));
  server.closeAllConnections();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
