import { fileURLToPath } from "node:url";
import boundaries from "eslint-plugin-boundaries";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTs from "eslint-config-next/typescript";
import { defineConfig, globalIgnores } from "eslint/config";

// The house's layering, checked on every import (relative or "@/…", values and types alike). Each file gets
// the categories whose pattern it matches; a policy refuses imports from one category into another.
// How to add a rule: DEVELOPERS.md, "Lint rules of the house".
const houseFiles = [
  { category: "domain", pattern: ["lib/layout/**", "lib/plans/**", "lib/scans/**", "lib/stamps/**", "lib/wax/**", "lib/runs/**", "lib/units.ts"] },
  { category: "data", pattern: "lib/data/**" },
  { category: "validation", pattern: "lib/validation/**" },
  { category: "lib", pattern: "lib/**" },
  { category: "db", pattern: "db/**" },
  { category: "components", pattern: "components/**" },
  { category: "app", pattern: "app/**" },
];

const housePolicies = [
  {
    from: { file: { categories: "domain" } },
    disallow: { to: [{ module: { origin: "external", source: ["next", "react", "react-dom"] } }] },
    message:
      'house/domain-is-pure: the pure domain (lib/layout, lib/plans, lib/scans, lib/stamps, lib/wax, lib/runs, lib/units.ts) imports no framework ("{{ dependency.source }}"). Take plain values as arguments and return plain values; pages, routes and components do the rest.',
  },
  {
    from: { file: { categories: "domain" } },
    disallow: [{ to: { file: { categories: ["db", "data"] } } }, { dependency: { source: ["@/db", "@/db/**", "@/lib/data", "@/lib/data/**"] } }],
    message:
      'house/domain-is-pure: the pure domain knows no storage ("{{ dependency.source }}"). Let lib/data read and write the database and pass the values in; a row type the domain needs is declared in the domain.',
  },
  {
    from: { file: { categories: "domain" } },
    disallow: [{ to: { file: { categories: "validation" } } }, { dependency: { source: ["@/lib/validation", "@/lib/validation/**"] } }],
    message:
      'house/domain-owns-input: the pure domain owns its input schema ("{{ dependency.source }}"). Declare the schema and limits in the domain (lib/layout/schema.ts); lib/validation extends it, never the other way round.',
  },
  {
    from: { file: { categories: "components" } },
    disallow: [{ to: { file: { categories: "data" } } }, { dependency: { source: ["@/lib/data", "@/lib/data/**"] } }],
    message:
      'house/components-no-data: components never import the data layer ("{{ dependency.source }}"), not even types. Import DTO types from the contract module lib/contracts/<area>.ts; get data as props from the page or through an SWR hook in lib/swr/.',
  },
  {
    from: { file: { categories: "components" } },
    disallow: [{ to: { file: { categories: "app" } } }, { dependency: { source: ["@/app", "@/app/**"] } }],
    message:
      'house/components-no-app: components do not reach up into app/ ("{{ dependency.source }}"). Move what they need (a server action, a helper) next to the component or into lib/, or pass it in as a prop.',
  },
  {
    from: { file: { categories: "db" } },
    disallow: [{ to: { file: { categories: "lib" } } }, { dependency: { source: ["@/lib", "@/lib/**"] } }],
    message:
      'house/db-is-storage: db/ holds tables and the pool only and imports nothing from lib/ ("{{ dependency.source }}"). Code that needs both belongs in lib/data/ (or scripts/ for demo data).',
  },
  {
    from: { file: { categories: "app" } },
    disallow: [{ to: { file: { categories: "db" } } }, { dependency: { source: ["@/db", "@/db/**"] } }],
    message:
      'house/app-through-data: pages, layouts, route handlers and actions never touch the database ("{{ dependency.source }}"). Call a lib/data function: it checks the permission and returns DTOs.',
  },
];

export default defineConfig([
  ...nextVitals,
  ...nextTs,
  {
    plugins: { boundaries },
    settings: {
      "boundaries/root-path": fileURLToPath(new URL(".", import.meta.url)),
      "boundaries/dependency-nodes": ["import", "export", "dynamic-import"],
      "boundaries/files": houseFiles,
    },
    rules: {
      "boundaries/dependencies": ["error", { default: "allow", checkAllOrigins: true, policies: housePolicies }],
    },
  },
  globalIgnores([".next/**", ".next-test*/**", ".data/**", ".test-data*/**", "node_modules/**", "next-env.d.ts", "db/migrations/**"]),
]);
