/**
 * POST (designer, bearer token or session): the layout file as the request body; the content type picks the
 * encoding (application/json, application/xml or text/xml, text/csv with ?length=&force=). 201 with the
 * engine's report and the revision's URL; 422 with located errors for a refused file.
 */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, parseWith, readBodyLimited } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/policy";
import { appLink } from "@/lib/mail/outbox";
import { MAX_FILE_BYTES } from "@/lib/layout/model";
import { uploadOptionsSchema, uploadRevision } from "@/lib/upload";

export const dynamic = "force-dynamic";

function encodingOf(contentType: string): "json" | "xml" | "csv" | undefined {
  const t = contentType.toLowerCase();
  if (t.includes("json")) return "json";
  if (t.includes("xml")) return "xml";
  if (t.includes("csv")) return "csv";
  return undefined;
}

export const POST = handle(async (req: Request, ctx: { params: Promise<{ layoutId: string }> }) => {
  const user = await requireRole(can.uploadRevision);
  const layoutId = await idFrom(ctx.params, "layoutId");
  const encoding = encodingOf(req.headers.get("content-type") ?? "");
  if (!encoding) throw new AppError(415, "Send the file with Content-Type application/json, application/xml or text/csv.");
  const q = Object.fromEntries(new URL(req.url).searchParams);
  const options = parseWith(uploadOptionsSchema, {
    fileName: req.headers.get("x-file-name") || q.name || `upload.${encoding}`,
    encoding,
    length: q.length,
    force: q.force,
  });
  const bytes = await readBodyLimited(req, MAX_FILE_BYTES);
  const result = await uploadRevision(user, layoutId, bytes, options);
  if (!result.ok) return Response.json({ error: "The file was refused; nothing was stored.", errors: result.errors }, { status: 422 });
  return Response.json(
    {
      ...result.report,
      warnings: result.warnings,
      revision: { id: result.revision.id, number: result.revision.number, url: appLink(`/layouts/${layoutId}?revision=${result.revision.id}`) },
    },
    { status: 201 },
  );
});
