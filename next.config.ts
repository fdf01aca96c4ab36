import type { NextConfig } from "next";
import createNextIntlPlugin from "next-intl/plugin";

const withNextIntl = createNextIntlPlugin("./lib/i18n/request.ts");

// Forms that carry a picture (a new-stamp request's sketch, a quality finding's photo) post it to a server action: the action's body may be as
// large as a scan (SCAN_MAX_BYTES, else lib/scans' default of 200 MiB) plus room for the other fields and the
// multipart framing. The picture itself is checked against the scan limit by lib/scans.
const scanMaxBytes = Number(process.env.SCAN_MAX_BYTES) || 200 * 1024 * 1024;

const nextConfig: NextConfig = {
  // paper.js pulls in jsdom for SVG import/export, which the bundler cannot trace.
  // clipper2-wasm: on the server Node loads its CommonJS build, which reads the .wasm beside it.
  serverExternalPackages: ["paper", "@node-rs/argon2", "sharp", "clipper2-wasm", "pino"],
  // In the browser its ES build is bundled (the .wasm becomes an asset); its Node-only branch imports "module".
  turbopack: { resolveAlias: { module: { browser: "./lib/layout/polygon/browser-module-stub.ts" } } },
  experimental: { serverActions: { bodySizeLimit: scanMaxBytes + 1024 * 1024 } },
  poweredByHeader: false,
  typedRoutes: false,
  // The test run builds into its own folder so it never disturbs a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || ".next",
};

export default withNextIntl(nextConfig);
