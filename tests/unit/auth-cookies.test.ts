import { afterEach, describe, expect, it, vi } from "vitest";

// The Auth.js configuration alone: the data layer it calls is not needed to hand out a CSRF cookie.
vi.mock("@/lib/data/sessions", () => ({ openSession: vi.fn(), revokeSession: vi.fn(), sessionLifetimeSeconds: 43_200 }));
vi.mock("@/lib/data/sign-in", () => ({ checkCredentials: vi.fn() }));

async function csrfCookie(appUrl: string, requestUrl: string): Promise<string> {
  vi.resetModules();
  vi.stubEnv("APP_URL", appUrl);
  vi.stubEnv("AUTH_SECRET", "a test secret that is long enough");
  const { handlers } = await import("@/lib/auth/config");
  const response = await handlers.GET(new Request(`${requestUrl}/api/auth/csrf`) as never);
  return response.headers.getSetCookie().find((c) => c.includes("authjs.csrf-token"))!;
}

afterEach(() => vi.unstubAllEnvs());

describe("Auth.js cookies", () => {
  it("are Secure (with the __Host- name) when APP_URL is https, even when TLS ends at a proxy in front", async () => {
    const cookie = await csrfCookie("https://capgrid.example", "http://capgrid.example");
    expect(cookie).toMatch(/^__Host-authjs\.csrf-token=/);
    expect(cookie).toMatch(/;\s*Secure/i);
  });

  it("are not Secure on a plain-http APP_URL (local use)", async () => {
    const cookie = await csrfCookie("http://localhost:3000", "http://localhost:3000");
    expect(cookie).toMatch(/^authjs\.csrf-token=/);
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });
});
