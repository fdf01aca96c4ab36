// The local fakes (mail catcher, S3-compatible store), started as child processes from node_modules.
import { type ChildProcess, spawn } from "node:child_process";
import { mkdirSync } from "node:fs";
import { connect } from "node:net";
import { join } from "node:path";
import { projectRoot } from "./config";

const bin = (name: string) => join(projectRoot, "node_modules", ".bin", name);

export function waitForPort(port: number, host = "127.0.0.1", timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  return new Promise((resolvePromise, reject) => {
    const attempt = () => {
      const socket = connect(port, host);
      socket.once("connect", () => {
        socket.destroy();
        resolvePromise();
      });
      socket.once("error", () => {
        socket.destroy();
        if (Date.now() > deadline) reject(new Error(`nothing answered on ${host}:${port} within ${timeoutMs / 1000} s`));
        else setTimeout(attempt, 200);
      });
    };
    attempt();
  });
}

export function isPortOpen(port: number, host = "127.0.0.1"): Promise<boolean> {
  return new Promise((resolvePromise) => {
    const socket = connect(port, host);
    socket.once("connect", () => {
      socket.destroy();
      resolvePromise(true);
    });
    socket.once("error", () => resolvePromise(false));
  });
}

function startChild(label: string, command: string, args: string[], logQuietly: boolean): ChildProcess {
  const child = spawn(command, args, { stdio: ["ignore", "pipe", "pipe"], detached: false });
  const forward = (chunk: Buffer) => {
    if (!logQuietly) process.stdout.write(chunk.toString().replace(/^(?=.)/gm, `[${label}] `));
  };
  child.stdout?.on("data", forward);
  child.stderr?.on("data", (chunk: Buffer) => process.stderr.write(chunk.toString().replace(/^(?=.)/gm, `[${label}] `)));
  return child;
}

export async function startMailCatcher(opts: { smtpPort: number; webPort: number; quiet?: boolean }) {
  if (await isPortOpen(opts.smtpPort)) throw new Error(`port ${opts.smtpPort} (SMTP) is already in use; stop what runs there or set SMTP_PORT.`);
  const child = startChild(
    "mail",
    bin("maildev"),
    ["--smtp", String(opts.smtpPort), "--ip", "127.0.0.1", "--web", String(opts.webPort), "--web-ip", "127.0.0.1", "--silent"],
    opts.quiet ?? true,
  );
  await Promise.all([waitForPort(opts.smtpPort), waitForPort(opts.webPort)]);
  return child;
}

export async function startObjectStore(opts: { port: number; dir: string; bucket: string; quiet?: boolean }) {
  if (await isPortOpen(opts.port)) throw new Error(`port ${opts.port} (object store) is already in use; stop what runs there or change S3_ENDPOINT.`);
  mkdirSync(opts.dir, { recursive: true });
  const child = startChild(
    "s3",
    bin("s3rver"),
    // The CORS rule lets browsers PUT scans to presigned URLs from the app's origin.
    ["-d", opts.dir, "-a", "127.0.0.1", "-p", String(opts.port), "--silent", "--configure-bucket", opts.bucket, join(projectRoot, "scripts", "s3-cors.xml")],
    opts.quiet ?? true,
  );
  await waitForPort(opts.port);
  return child;
}

export function stopChildren(children: ChildProcess[]) {
  for (const child of children) {
    if (child.exitCode === null && !child.killed) child.kill("SIGTERM");
  }
}
