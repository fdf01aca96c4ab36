import type { NextConfig } from "next";
import createNextIntlPlugin from "next-intl/plugin";

const withNextIntl = createNextIntlPlugin("./lib/i18n/request.ts");

const nextConfig: NextConfig = {
  // paper.js pulls in jsdom for SVG import/export, which the bundler cannot trace.
  serverExternalPackages: ["paper", "@node-rs/argon2", "sharp"],
  poweredByHeader: false,
  typedRoutes: false,
  // The test run builds into its own folder so it never disturbs a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || ".next",
};

export default withNextIntl(nextConfig);
