import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import { defineConfig, globalIgnores } from "eslint/config";

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  globalIgnores([".next/**", ".next-test*/**", ".data/**", ".test-data*/**", "node_modules/**", "next-env.d.ts", "db/migrations/**"]),
]);
