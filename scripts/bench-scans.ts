// Benchmark of scan processing (lib/scans): a 600 DPI scan of a 20 × 20 cm stamp (4724 × 4724 px) verified,
// thumbnailed and measured, with the share of decoding; peak memory for an 8000 × 8000 scan; and how long the
// event loop stalls while two such scans are processed at once. Each measurement runs in a fresh child process.
// Run: npm run bench -- scans   (or npx tsx scripts/bench-scans.ts)
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Writable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { monitorEventLoopDelay } from "node:perf_hooks";
import sharp from "sharp";
import { motifSvg, renderScan } from "@/scripts/seed/scan-art";
import { createScanLimiter, processScan, renderCoverageOverlay, type ScanStage } from "@/lib/scans";

const LIMITS = { maxBytes: 256 * 1024 * 1024, maxPixels: 80_000_000 };
const RUNS = 5;
const TARGET_MS = 1000;
const TARGET_PEAK_MB = 500;

interface TimingReport {
  file: string;
  sizeBytes: number;
  totalMs: number;
  stagesMs: Partial<Record<ScanStage, number>>;
  decodeAloneMs: number;
  overlayMs: number;
}

interface MemoryReport {
  file: string;
  maxRssMb: number;
  sampledPeakRssMb: number;
  totalMs: number;
}

interface StallReport {
  sequentialMs: number;
  maxDelayMs: number;
  p99DelayMs: number;
  limitedMaxDelayMs: number;
  limitedMs: number;
}

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const mb = (bytes: number) => bytes / (1024 * 1024);

/** Full decode with nothing kept: libvips streams the pixels into a sink that drops them. */
async function decodeAlone(bytes: Buffer): Promise<number> {
  const t0 = performance.now();
  const sink = new Writable({ write: (_chunk, _enc, done) => done() });
  await pipeline(sharp(bytes, { limitInputPixels: LIMITS.maxPixels, failOn: "warning", sequentialRead: true }).raw(), sink);
  return performance.now() - t0;
}

async function childTiming(file: string): Promise<TimingReport> {
  const bytes = readFileSync(file);
  await processScan(bytes, LIMITS); // warm-up: first use loads codecs
  const totals: number[] = [];
  const stages: Partial<Record<ScanStage, number[]>> = {};
  const decodes: number[] = [];
  const overlays: number[] = [];
  for (let k = 0; k < RUNS; k++) {
    const t0 = performance.now();
    const scan = await processScan(bytes, { ...LIMITS, onStage: (stage, ms) => (stages[stage] ??= []).push(ms) });
    totals.push(performance.now() - t0);
    const o0 = performance.now();
    await renderCoverageOverlay(scan.analysis, { polarity: scan.coverage.polarity, threshold: scan.coverage.threshold });
    overlays.push(performance.now() - o0);
    decodes.push(await decodeAlone(bytes));
  }
  const stagesMs: Partial<Record<ScanStage, number>> = {};
  for (const [stage, values] of Object.entries(stages)) stagesMs[stage as ScanStage] = median(values);
  return { file, sizeBytes: bytes.length, totalMs: median(totals), stagesMs, decodeAloneMs: median(decodes), overlayMs: median(overlays) };
}

async function childMemory(file: string, process_: boolean): Promise<MemoryReport> {
  const bytes = readFileSync(file);
  let peak = process.memoryUsage.rss();
  const sampler = setInterval(() => (peak = Math.max(peak, process.memoryUsage.rss())), 5);
  const t0 = performance.now();
  if (process_) await processScan(bytes, LIMITS);
  const totalMs = performance.now() - t0;
  clearInterval(sampler);
  return { file, maxRssMb: process.resourceUsage().maxRSS / 1024, sampledPeakRssMb: mb(peak), totalMs };
}

/** Two scans at once, first unlimited, then through a limiter of one: the event loop's worst delay each time. */
async function childStall(file: string): Promise<StallReport> {
  const bytes = readFileSync(file);
  await processScan(bytes, LIMITS);
  const t0 = performance.now();
  await processScan(bytes, LIMITS);
  const sequentialMs = performance.now() - t0;
  const measure = async (run: () => Promise<unknown>) => {
    const histogram = monitorEventLoopDelay({ resolution: 5 });
    histogram.enable();
    const start = performance.now();
    await run();
    const ms = performance.now() - start;
    histogram.disable();
    return { ms, max: histogram.max / 1e6, p99: histogram.percentile(99) / 1e6 };
  };
  const free = await measure(() => Promise.all([processScan(bytes, LIMITS), processScan(bytes, LIMITS)]));
  const limiter = createScanLimiter({ concurrency: 1, maxQueued: 4 });
  const limited = await measure(() => Promise.all([limiter.run(() => processScan(bytes, LIMITS)), limiter.run(() => processScan(bytes, LIMITS))]));
  return { sequentialMs, maxDelayMs: free.max, p99DelayMs: free.p99, limitedMaxDelayMs: limited.max, limitedMs: limited.ms };
}

function runChild<T>(args: string[]): T {
  const result = spawnSync(join(process.cwd(), "node_modules", ".bin", "tsx"), [join("scripts", "bench-scans.ts"), "--child", ...args], {
    encoding: "utf8",
    maxBuffer: 16 * 1024 * 1024,
  });
  if (result.status !== 0) throw new Error(`child ${args.join(" ")} failed:\n${result.stderr}`);
  return JSON.parse(result.stdout.trim().split("\n").pop()!) as T;
}

async function generate(dir: string) {
  const files: Record<string, string> = {};
  const write = async (name: string, sizeMm: number, format: "png" | "jpeg") => {
    const svg = motifSvg({ seed: 1742, widthMm: sizeMm, heightMm: sizeMm, family: "lotus" });
    const path = join(dir, name);
    writeFileSync(path, await renderScan(svg, 600, { format, quality: 92 }));
    files[name] = path;
  };
  // 200 mm at 600 DPI = 4724 px; 8000 px at 600 DPI = 338.67 mm.
  await write("4724-600dpi.png", 200, "png");
  await write("4724-600dpi.jpg", 200, "jpeg");
  await write("8000-600dpi.png", (8000 / 600) * 25.4, "png");
  await write("8000-600dpi.jpg", (8000 / 600) * 25.4, "jpeg");
  for (const side of [4724, 8000]) {
    const tiff = join(dir, `${side}-600dpi.tif`);
    await sharp(readFileSync(files[`${side}-600dpi.png`]), { limitInputPixels: false })
      .tiff({ compression: "lzw", predictor: "horizontal", xres: 600 / 25.4, yres: 600 / 25.4 })
      .toFile(tiff);
    files[`${side}-600dpi.tif`] = tiff;
  }
  return files;
}

const cell = (value: string, width: number) => value.padEnd(width);
const verdict = (ok: boolean) => (ok ? "met" : "MISSED");

async function main() {
  const dir = mkdtempSync(join(tmpdir(), "capgrid-bench-scans-"));
  try {
    console.log("Generating invented motif scans (SVG rendered by sharp, with cloth grain)…");
    const files = await generate(dir);

    const timings = ["4724-600dpi.png", "4724-600dpi.jpg", "4724-600dpi.tif"].map((name) => runChild<TimingReport>(["timing", files[name]]));
    console.log(`\nVerify + strip + thumbnails (256, 1024 WebP) + grey raster + pHash + Otsu coverage, median of ${RUNS} runs`);
    console.log(
      [cell("scan", 18), cell("file MB", 8), cell("total ms", 9), cell("decode ms", 10), cell("share", 6), cell("decode alone", 13), cell("other steps (ms)", 62), cell("target", 9), "result"].join(" "),
    );
    for (const t of timings) {
      const s = t.stagesMs;
      const others = `check ${s.check?.toFixed(0)} · sha256 ${s.sha256?.toFixed(0)}∥ · original ${s.original?.toFixed(0)} · thumbs ${s.thumbnails?.toFixed(0)} · pHash ${s.phash?.toFixed(0)} · coverage ${s.coverage?.toFixed(0)}`;
      console.log(
        [
          cell(t.file.split("/").pop()!, 18),
          cell(mb(t.sizeBytes).toFixed(1), 8),
          cell(t.totalMs.toFixed(0), 9),
          cell((s.decode ?? 0).toFixed(0), 10),
          cell(`${(((s.decode ?? 0) / t.totalMs) * 100).toFixed(0)} %`, 6),
          cell(`${t.decodeAloneMs.toFixed(0)} ms`, 13),
          cell(others, 62),
          cell(`< ${TARGET_MS}`, 9),
          t.file.endsWith(".tif") ? "(no target)" : verdict(t.totalMs < TARGET_MS),
        ].join(" "),
      );
    }
    console.log(`Review overlay (WebP, 1024 px) on request: ${timings.map((t) => `${t.file.split(".").pop()} ${t.overlayMs.toFixed(0)} ms`).join(", ")}`);
    console.log("decode = full decode streamed into the reduction to 2048 px; 'decode alone' = the same decode into a sink; ∥ = runs beside decode.");

    console.log("\nPeak memory, one scan per fresh process (maxRSS from process.resourceUsage())");
    console.log([cell("scan", 18), cell("file MB", 8), cell("peak RSS MB", 12), cell("sampled MB", 11), cell("idle MB", 8), cell("time ms", 8), cell("target", 9), "result"].join(" "));
    for (const name of ["8000-600dpi.png", "8000-600dpi.jpg", "8000-600dpi.tif"]) {
      const idle = runChild<MemoryReport>(["memory-idle", files[name]]);
      const m = runChild<MemoryReport>(["memory", files[name]]);
      console.log(
        [
          cell(name, 18),
          cell(mb(readFileSync(files[name]).length).toFixed(1), 8),
          cell(m.maxRssMb.toFixed(0), 12),
          cell(m.sampledPeakRssMb.toFixed(0), 11),
          cell(idle.maxRssMb.toFixed(0), 8),
          cell(m.totalMs.toFixed(0), 8),
          cell(`< ${TARGET_PEAK_MB}`, 9),
          verdict(m.maxRssMb < TARGET_PEAK_MB),
        ].join(" "),
      );
    }
    console.log("idle = the same process after loading the code and reading the file, without processing. TIFF is re-encoded (deflate) to strip its tags.");

    const stall = runChild<StallReport>(["stall", files["4724-600dpi.png"]]);
    console.log("\nTwo keepers upload 4724² PNG scans at once: worst event-loop delay (other requests wait this long)");
    console.log(`  one scan alone:                 ${stall.sequentialMs.toFixed(0)} ms`);
    console.log(`  two at once, unlimited:         loop max ${stall.maxDelayMs.toFixed(0)} ms, p99 ${stall.p99DelayMs.toFixed(0)} ms`);
    console.log(`  two through a limiter of one:   loop max ${stall.limitedMaxDelayMs.toFixed(0)} ms, both done in ${stall.limitedMs.toFixed(0)} ms`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

const argv = process.argv.slice(2);
if (argv[0] === "--child") {
  const [, mode, file] = argv;
  const report =
    mode === "timing"
      ? await childTiming(file)
      : mode === "memory"
        ? await childMemory(file, true)
        : mode === "memory-idle"
          ? await childMemory(file, false)
          : await childStall(file);
  console.log(JSON.stringify(report));
} else {
  await main();
}
