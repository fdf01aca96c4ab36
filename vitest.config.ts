import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

const root = fileURLToPath(new URL(".", import.meta.url));

export default defineConfig({
  // server-only guards Next bundles; the tests call the data layer directly.
  resolve: { alias: { "@": root, "server-only": `${root}tests/helpers/empty-module.ts` } },
  test: {
    projects: [
      {
        extends: true,
        test: {
          name: "unit",
          include: ["tests/unit/**/*.test.ts"],
          environment: "node",
          // Image and polygon tests take a few seconds alone; a busy 2-core machine must not fail them on time.
          testTimeout: 20_000,
          // next-auth imports "next/server" without an extension, which Node's own resolver refuses.
          server: { deps: { inline: ["next-auth"] } },
        },
      },
      {
        extends: true,
        test: {
          name: "integration",
          include: ["tests/integration/**/*.test.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: "e2e",
          include: ["tests/e2e/**/*.test.ts"],
          setupFiles: ["tests/helpers/e2e-setup.ts"],
          environment: "node",
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 120_000,
          // A page on a busy 2-core machine may take seconds to answer a debounced search: poll up to 10 s, not 1.
          expect: { poll: { timeout: 10_000 } },
        },
      },
    ],
  },
});
