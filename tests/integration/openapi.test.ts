import { readdirSync, readFileSync, statSync } from "node:fs";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { createUser } from "../helpers/db";
import { testEnv } from "../helpers/env";
import { api, signIn, type Session } from "../helpers/http";

const methodsOf = (source: string) => [...source.matchAll(/\b(GET|POST|PUT|PATCH|DELETE): apiRoute\(/g)].map((m) => m[1]);

/** Every route file under app/api/v1 with its URL template and the methods it implements. */
function routeFiles(dir = "app/api/v1"): { path: string; methods: string[] }[] {
  return readdirSync(dir).flatMap((name) => {
    const full = join(dir, name);
    if (statSync(full).isDirectory()) return name === "[...path]" ? [] : routeFiles(full);
    if (name !== "route.ts") return [];
    const path = "/" + dir.replace(/\[(\w+)\]/g, "{$1}").replace(/^app\//, "");
    return [{ path, methods: methodsOf(readFileSync(full, "utf8")) }];
  });
}

let designer: Session;
beforeAll(async () => {
  const user = await createUser("designer");
  designer = (await signIn(user.email, user.password))!;
});

describe("the API describes itself", () => {
  it("lists every route file with a summary for each of its methods", async () => {
    const res = await api("GET", "/api/v1/openapi.json", { session: designer });
    expect(res.status).toBe(200);
    expect(res.body.openapi).toBe("3.1.0");
    const files = routeFiles();
    expect(files.length).toBeGreaterThan(30);
    for (const file of files) {
      expect(file.methods.length, `${file.path} declares no method through apiRoute`).toBeGreaterThan(0);
      for (const method of file.methods) {
        const op = res.body.paths[file.path]?.[method.toLowerCase()];
        expect(op, `${method} ${file.path} is missing from openapi.json (app/api/v1/route-index.ts)`).toBeTruthy();
        expect(op.summary, `${method} ${file.path} has no summary (apiDocs.operations.${op.operationId})`).toMatch(/\w{3,}/);
      }
    }
  });

  it("takes parameters and bodies from the zod schemas", async () => {
    const { body } = await api("GET", "/api/v1/openapi.json", { session: designer });
    const list = body.paths["/api/v1/stamps"].get;
    expect(list.parameters.map((p: { name: string }) => p.name)).toEqual(expect.arrayContaining(["q", "condition", "sort", "page", "pageSize"]));
    const create = body.paths["/api/v1/stamps"].post.requestBody.content["application/json"].schema;
    expect(create.required).toEqual(expect.arrayContaining(["code", "name", "widthMm", "heightMm"]));
    const checkout = body.paths["/api/v1/stamps/{code}/checkout"].post;
    expect(checkout.parameters).toContainEqual(expect.objectContaining({ name: "code", in: "path", required: true }));
    expect(checkout["x-roles"]).toEqual(["admin", "keeper"]);
    expect(body.paths["/api/v1/layout"].post.requestBody.content["application/json"].schema.properties.arrangement.enum).toContain("half-drop");
  });

  it("is for signed-in callers only", async () => {
    expect((await api("GET", "/api/v1/openapi.json")).status).toBe(401);
  });
});

describe("methods a route does not have", () => {
  it("answer 405 with the JSON error body and the allowed methods", async () => {
    const res = await fetch(`${testEnv().appUrl}/api/v1/layout`, { headers: { cookie: designer.cookie } });
    expect(res.status).toBe(405);
    expect(res.headers.get("allow")).toBe("OPTIONS, POST");
    const body = await res.json();
    expect(body.error.code).toBe("methodNotAllowed");
    expect(body.error.message).toMatch(/GET/);
  });

  it("answer 405 on every route for a method it lacks", async () => {
    for (const file of routeFiles()) {
      const missing = ["PUT", "PATCH", "DELETE", "POST", "GET"].find((m) => !file.methods.includes(m))!;
      const path = file.path.replace("{code}", "CP-0001").replace(/\{id\}/g, "00000000-0000-4000-8000-000000000000");
      const res = await api(missing, path, { session: designer });
      expect(res.status, `${missing} ${path}`).toBe(405);
      expect(res.body.error.code).toBe("methodNotAllowed");
    }
  });
});
