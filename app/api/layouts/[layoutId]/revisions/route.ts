/** POST (designer): upload a layout file as a new revision (multipart: file, length, force). 201, or 422 with located errors. */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, parseWith, readBodyLimited } from "@/lib/api/handler";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/policy";
import { uploadOptionsSchema, uploadRevision } from "@/lib/upload";
import { MAX_FILE_BYTES } from "@/lib/layout/model";

export const dynamic = "force-dynamic";

export const POST = handle(async (req: Request, ctx: { params: Promise<{ layoutId: string }> }) => {
  const user = await requireRole(can.uploadRevision);
  const layoutId = await idFrom(ctx.params, "layoutId");
  // the form's own fields and boundaries get 64 kB beyond the file limit
  const body = await readBodyLimited(req, MAX_FILE_BYTES + 64 * 1024);
  let form: FormData;
  try {
    form = await new Response(body, { headers: { "content-type": req.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new AppError(422, "Send the file as multipart/form-data with a field named file.");
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError(422, "No file was attached (field name: file).", { errors: [{ location: "file", message: "missing" }] });
  const options = parseWith(uploadOptionsSchema, {
    fileName: file.name || "layout",
    encoding: form.get("encoding") || undefined,
    length: form.get("length") || undefined,
    force: form.get("force") || undefined,
  });
  const result = await uploadRevision(user, layoutId, new Uint8Array(await file.arrayBuffer()), options);
  if (!result.ok) return Response.json({ error: "The file was refused; nothing was stored.", errors: result.errors }, { status: 422 });
  return Response.json(
    { revision: result.revision, report: result.report, warnings: result.warnings, url: `/layouts/${layoutId}?revision=${result.revision.id}` },
    { status: 201 },
  );
});
