/** One upload path for the browser and the token API: size check, worker analysis, store or record the refusal. */
import "server-only";
import { z } from "zod";
import { forbidden, notFound } from "@/lib/errors";
import { allowed } from "@/lib/policy";
import { MAX_FILE_BYTES, type Encoding } from "@/lib/layout/model";
import { forceUnits, lengthUnits } from "@/lib/layout/units";
import { analyseInWorker } from "@/lib/worker/run-analysis";
import { recordRefusedUpload, storeRevision, type RevisionSummaryDto } from "@/lib/db/revisions";
import { layoutExists } from "@/lib/db/layouts";
import { overridesForLayout } from "@/lib/db/overrides";
import { materialsForLayout } from "@/lib/db/materials";
import type { SessionUser } from "@/lib/auth/session";
import type { Report } from "@/lib/engine";

export const uploadOptionsSchema = z.object({
  fileName: z.string().trim().min(1).max(255).default("layout"),
  encoding: z.enum(["json", "xml", "csv"]).optional(),
  length: z.enum(lengthUnits).optional(),
  force: z.enum(forceUnits).optional(),
});

export type UploadResult =
  { ok: true; revision: RevisionSummaryDto; report: Report; warnings: string[] } | { ok: false; errors: { location: string; message: string }[] };

/** Validates, analyses (in a worker) and stores a revision, or records the refused attempt. */
export async function uploadRevision(
  user: SessionUser,
  layoutId: number,
  bytes: Uint8Array,
  options: z.infer<typeof uploadOptionsSchema>,
): Promise<UploadResult> {
  if (!allowed(user.role, "uploadRevision")) throw forbidden("Only designers upload revisions.");
  if (!(await layoutExists(layoutId))) throw notFound("That layout");
  // an empty or oversized file is refused like any other bad file: located errors, the attempt recorded
  if (bytes.byteLength === 0 || bytes.byteLength > MAX_FILE_BYTES) {
    const message = bytes.byteLength === 0 ? "the file is empty" : `the file is ${(bytes.byteLength / 1048576).toFixed(1)} MB; the limit is 5 MB`;
    const errors = [{ location: "file", message }];
    await recordRefusedUpload(user, layoutId, options.fileName, bytes.byteLength, errors);
    return { ok: false, errors };
  }
  // the project's rule overrides in force now are the ones this revision is analysed (and stored) with
  const overrides = await overridesForLayout(layoutId);
  // the project's materials library resolves ids the file does not declare; the stored layout keeps the copy used
  const library = await materialsForLayout(layoutId);
  const outcome = await analyseInWorker(bytes, {
    fileName: options.fileName,
    encoding: options.encoding as Encoding | undefined,
    length: options.length,
    force: options.force,
    overrides,
    library,
  });
  if (!outcome.ok) {
    await recordRefusedUpload(user, layoutId, options.fileName, bytes.byteLength, outcome.errors);
    return { ok: false, errors: outcome.errors };
  }
  const revision = await storeRevision(user, layoutId, {
    fileName: options.fileName,
    encoding: outcome.encoding,
    raw: outcome.text,
    layout: outcome.layout,
    report: outcome.report,
    overrides,
  });
  return { ok: true, revision, report: outcome.report, warnings: outcome.warnings ?? [] };
}
