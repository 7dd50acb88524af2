/** POST (checker): waive with a justification, or reopen; `version` guards against concurrent changes (409). */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { statusSchema } from "@/lib/contracts/threads";
import { decideFinding } from "@/lib/review/actions";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const POST = handle(async (req: Request, ctx: { params: Promise<{ threadId: string }> }) => {
  const user = await requireRole(can.waive);
  const id = await idFrom(ctx.params, "threadId");
  const input = parseWith(statusSchema, await jsonBody(req));
  return Response.json({ thread: await decideFinding(user, id, input) }, { status: 200 });
});
