/** Runs parse + analysis in a worker thread so a large layout blocks neither the page nor other users. */
import "server-only";
import { existsSync } from "node:fs";
import path from "node:path";
import { Worker } from "node:worker_threads";
import { AppError } from "@/lib/errors";
import type { Encoding, Layout, LayoutError } from "@/lib/layout/model";
import type { ForceUnit, LengthUnit } from "@/lib/layout/units";
import type { Report } from "@/lib/engine";

export type AnalysisOutcome =
  | { ok: true; layout: Layout; report: Report; encoding: Encoding; text: string; warnings: string[] }
  | { ok: false; errors: LayoutError[] };

/** The worker bundle, built by `node scripts/build-worker.mjs` (part of the start and test commands). */
export function workerPath(): string {
  return path.join(process.cwd(), "dist", "analyse-worker.cjs");
}

/** Parses and analyses a file in a fresh worker thread, with a time limit. */
export function analyseInWorker(
  bytes: Uint8Array,
  options: { fileName: string; encoding?: Encoding; length?: LengthUnit; force?: ForceUnit },
  timeoutMs = Number(process.env.SIXFOLD_ANALYSIS_TIMEOUT_MS ?? 120_000),
): Promise<AnalysisOutcome> {
  const file = workerPath();
  if (!existsSync(file)) return Promise.reject(new AppError(503, "The analysis worker is not built. Run `node scripts/build-worker.mjs`."));
  return new Promise((resolve, reject) => {
    const worker = new Worker(file);
    const timer = setTimeout(() => {
      void worker.terminate();
      reject(new AppError(503, `The analysis took longer than ${Math.round(timeoutMs / 1000)} s and was stopped. Nothing was stored.`));
    }, timeoutMs);
    worker.once("message", (msg: AnalysisOutcome & { crashed?: boolean; message?: string }) => {
      clearTimeout(timer);
      void worker.terminate();
      if (msg.crashed) reject(new AppError(500, "The analysis failed on this file. Nothing was stored."));
      else resolve(msg);
    });
    worker.once("error", (err) => {
      clearTimeout(timer);
      reject(err);
    });
    worker.postMessage({ ...options, bytes });
  });
}
