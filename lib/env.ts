import "server-only";
import { z } from "zod";

// An empty value (as .env.example leaves it) means "use the default".
const optionalCount = z.preprocess((v) => (v === "" ? undefined : v), z.coerce.number().int().positive().optional());

/** "https://a.example, http://b.example:8080" → each entry's origin; empty means none. */
const originList = z.preprocess(
  (v) => (typeof v === "string" ? v.split(",").map((s) => s.trim()).filter(Boolean) : v),
  z.array(z.url({ protocol: /^https?$/ }).transform((u) => new URL(u).origin)).default([]),
);

// Parsed once at start-up; a missing or malformed variable stops the app with a clear message.
const schema = z.object({
  DATABASE_URL: z.url(),
  /** The app's public address: links in e-mails, the origin writes must come from, https → HSTS and Secure cookies. */
  APP_URL: z.url().default("http://localhost:3000"),
  /** More origins the app is reached under (comma-separated), accepted like APP_URL's by the same-origin check. */
  APP_ORIGINS: originList,
  /**
   * How many reverse proxies stand in front of the app (0 or empty: none). Only then does scripts/server.ts
   * take the client's address from X-Forwarded-For and keep the forwarded headers; otherwise it drops them.
   */
  TRUST_PROXY: z.preprocess((v) => (v === "" ? undefined : v), z.coerce.number().int().min(0).max(10).default(0)),
  AUTH_SECRET: z.string().min(16, "AUTH_SECRET must be at least 16 characters (openssl rand -base64 33)"),
  SMTP_HOST: z.string().min(1),
  SMTP_PORT: z.coerce.number().int().positive(),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  SMTP_SECURE: z.stringbool().default(false),
  MAIL_FROM: z.string().min(3).default("Capgrid <no-reply@capgrid.test>"),
  MAIL_VIEWER_URL: z.union([z.url(), z.literal("")]).optional(),
  S3_ENDPOINT: z.union([z.url(), z.literal("")]).optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: z.string().min(3),
  S3_ACCESS_KEY_ID: z.string().min(1),
  S3_SECRET_ACCESS_KEY: z.string().min(1),
  S3_FORCE_PATH_STYLE: z.stringbool().default(true),
  SCAN_MAX_BYTES: optionalCount,
  SCAN_MAX_PIXELS: optionalCount,
});

export type Env = z.infer<typeof schema>;

function parseEnv(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((issue) => `  ${issue.path.join(".")}: ${issue.message}`);
    throw new Error(`Invalid environment (see .env.example):\n${lines.join("\n")}`);
  }
  return parsed.data;
}

let cached: Env | undefined;

/** The validated environment; read lazily so `next build` does not need every variable. */
export function env(): Env {
  cached ??= parseEnv();
  return cached;
}
