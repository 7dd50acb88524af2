/** GET: one revision with its report, parsed layout and findings (every role). */
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom } from "@/lib/api/handler";
import { getRevision } from "@/lib/db/revisions";
import { blockingFindings } from "@/lib/db/releases";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ revisionId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "revisionId");
  const revision = await getRevision(user, id);
  return Response.json({ revision, blocking: await blockingFindings(id) }, { status: 200 });
});
