/** GET ?format=md|pdf: the report of a revision (the stored one once released). */
import { z } from "zod";
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom, parseWith } from "@/lib/api/handler";
import { getRevision } from "@/lib/db/revisions";
import { currentReportMarkdown } from "@/lib/report/release";
import { reportPdf } from "@/lib/report/pdf";
import { drawingsInWorker } from "@/lib/worker/run-analysis";

export const dynamic = "force-dynamic";
const querySchema = z.object({ format: z.enum(["md", "pdf"]).default("md") });

export const GET = handle(async (req: Request, ctx: { params: Promise<{ revisionId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "revisionId");
  const { format } = parseWith(querySchema, Object.fromEntries(new URL(req.url).searchParams));
  const rev = await getRevision(user, id);
  const md = await currentReportMarkdown(user, id);
  const base = `sixfold-layout-${rev.layoutId}-r${rev.number}`;
  if (format === "md") {
    return new Response(md, {
      status: 200,
      headers: { "content-type": "text/markdown; charset=utf-8", "content-disposition": `attachment; filename="${base}.md"` },
    });
  }
  const pdf = await reportPdf(md, await drawingsInWorker(rev.layout, rev.report));
  return new Response(Buffer.from(pdf), {
    status: 200,
    headers: { "content-type": "application/pdf", "content-disposition": `attachment; filename="${base}.pdf"` },
  });
});
