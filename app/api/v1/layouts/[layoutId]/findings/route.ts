/** GET ?status=open|waived|resolved|reopened|all: findings of the layout's newest revision with their review state. */
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom, parseWith } from "@/lib/api/handler";
import { findingStatusQuerySchema } from "@/lib/contracts/findings";
import { latestFindings } from "@/lib/db/findings";

export const dynamic = "force-dynamic";

export const GET = handle(async (req: Request, ctx: { params: Promise<{ layoutId: string }> }) => {
  const user = await requireUser();
  const layoutId = await idFrom(ctx.params, "layoutId");
  const { status } = parseWith(findingStatusQuerySchema, Object.fromEntries(new URL(req.url).searchParams));
  return Response.json(await latestFindings(user, layoutId, status), { status: 200 });
});
