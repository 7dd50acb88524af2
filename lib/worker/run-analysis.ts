/**
 * Runs parse + analysis in worker threads so a large layout blocks neither the page nor other users.
 * The threads are long-lived (piscina pool): starting a fresh thread per upload cost ≈ 180 ms of CPU to load
 * and compile the 1.7 MB engine bundle, against ≈ 4 ms for the analysis of a typical layout.
 */
import "server-only";
import { existsSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { Piscina } from "piscina";
import { AppError } from "@/lib/errors";
import type { Encoding, Layout, LayoutError, Material } from "@/lib/layout/model";
import type { ForceUnit, LengthUnit } from "@/lib/layout/units";
import type { Report } from "@/lib/engine";
import type { RuleOverride } from "@/rules";
import type { DrawingSheet } from "@/lib/report/drawing-images";

export type AnalysisOutcome =
  { ok: true; layout: Layout; report: Report; encoding: Encoding; text: string; warnings: string[] } | { ok: false; errors: LayoutError[] };

/** The worker bundle, built by `node scripts/build-worker.mjs` (part of the start and test commands). */
export function workerPath(): string {
  return path.join(process.cwd(), "dist", "analyse-worker.cjs");
}

/** Analyses waiting for a thread beyond this many (default 64) are refused with 503 rather than queued without bound. */
const maxQueued = () => Math.max(1, Number(process.env.SIXFOLD_ANALYSIS_QUEUE ?? 64));

let pool: Piscina | null = null;
let poolThreads = 1;
/** Analyses handed to the pool and not finished yet (running or waiting); counted here, not by piscina's own queue bound. */
let inFlight = 0;

function analysisPool(file: string): Piscina {
  if (pool) return pool;
  poolThreads = Math.max(1, Math.min(Number(process.env.SIXFOLD_ANALYSIS_THREADS ?? 2), os.availableParallelism()));
  pool = new Piscina({ filename: file, name: "analyse", minThreads: 0, maxThreads: poolThreads, idleTimeout: 5 * 60_000 });
  return pool;
}

/** The pool's live thread ids and finished task count (for the tests). */
export function analysisPoolStats(): { threadIds: number[]; completed: number } {
  return { threadIds: pool ? pool.threads.map((t) => t.threadId) : [], completed: pool ? pool.completed : 0 };
}

/** Stops the analysis and drawing threads (tests and shutdown); the next analysis or drawing starts a new pool. */
export async function closeAnalysisPool(): Promise<void> {
  const [p, d] = [pool, drawPool];
  pool = null;
  drawPool = null;
  if (p) await p.destroy();
  if (d) await d.destroy();
}

let drawPool: Piscina | null = null;

/**
 * The four drawing views of a revision rendered to PNG for its PDF report, in a pooled thread (one; a report
 * download is rare next to an upload). Throws a 503 when the drawing bundle is missing or the time runs out.
 */
export async function drawingsInWorker(layout: Layout, report: Report, timeoutMs = 60_000): Promise<DrawingSheet> {
  const file = path.join(process.cwd(), "dist", "drawing-worker.cjs");
  if (!existsSync(file)) throw new AppError(503, "The drawing worker is not built. Run `node scripts/build-worker.mjs`.");
  drawPool ??= new Piscina({ filename: file, name: "default", minThreads: 0, maxThreads: 1, idleTimeout: 60_000 });
  try {
    return await drawPool.run({ layout, report }, { signal: AbortSignal.timeout(timeoutMs) });
  } catch (err) {
    const e = err as Error;
    if (e?.name === "AbortError")
      throw new AppError(503, `The drawings of this report did not finish within ${Math.round(timeoutMs / 1000)} s. Try again later.`);
    console.error("[drawings] worker failed", e);
    throw new AppError(500, "The drawings of this report could not be rendered.");
  }
}

/**
 * Parses and analyses a file in a pooled worker thread. The time limit covers waiting for a free thread and
 * the analysis; when it runs out the thread is terminated (piscina replaces it) and nothing is stored.
 */
export async function analyseInWorker(
  bytes: Uint8Array,
  options: { fileName: string; encoding?: Encoding; length?: LengthUnit; force?: ForceUnit; overrides?: Record<string, RuleOverride>; library?: Material[] },
  timeoutMs = Number(process.env.SIXFOLD_ANALYSIS_TIMEOUT_MS ?? 120_000),
): Promise<AnalysisOutcome> {
  const file = workerPath();
  if (!existsSync(file)) throw new AppError(503, "The analysis worker is not built. Run `node scripts/build-worker.mjs`.");
  const p = analysisPool(file);
  if (inFlight >= poolThreads + maxQueued()) {
    throw new AppError(503, `${maxQueued()} layouts are already waiting for analysis. Nothing was stored; try again in a minute.`);
  }
  const signal = AbortSignal.timeout(timeoutMs);
  let msg: AnalysisOutcome & { crashed?: boolean; message?: string };
  inFlight++;
  try {
    msg = await p.run({ ...options, bytes }, { signal });
  } catch (err) {
    const e = err as Error;
    if (e?.name === "AbortError" || signal.aborted) {
      throw new AppError(
        503,
        `The analysis did not finish within ${Math.max(1, Math.round(timeoutMs / 1000))} s (waiting for a free analysis thread included) and was stopped. Nothing was stored.`,
      );
    }
    console.error("[analysis] worker failed", e);
    throw new AppError(500, "The analysis failed on this file. Nothing was stored.");
  } finally {
    inFlight--;
  }
  if (msg.crashed) throw new AppError(500, "The analysis failed on this file. Nothing was stored.");
  return msg;
}
