import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import { defineConfig, globalIgnores } from "eslint/config";

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    // The wax estimator is a pure domain: no framework, storage, transport or shared app layers.
    files: ["lib/wax/**/*.ts"],
    rules: {
      "no-restricted-imports": [
        "error",
        {
          patterns: [
            {
              group: ["next", "next/*", "next-*", "react", "react/*", "react-dom", "react-dom/*", "server-only"],
              message: "lib/wax is pure: it may import zod, @/lib/units and @/lib/errors only.",
            },
            {
              group: ["@/db", "@/db/*", "@/lib/data", "@/lib/data/*", "@/lib/validation", "@/lib/validation/*", "@/app/*", "@/components/*"],
              message: "lib/wax is pure: it may import zod, @/lib/units and @/lib/errors only.",
            },
          ],
        },
      ],
    },
  },
  globalIgnores([".next/**", ".next-test*/**", ".data/**", ".test-data*/**", "node_modules/**", "next-env.d.ts", "db/migrations/**"]),
]);
