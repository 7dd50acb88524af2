/** POST (checker): waive with a justification, or reopen; `version` guards against concurrent changes (409). */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { changeStatus, statusSchema } from "@/lib/db/threads";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const POST = handle(async (req: Request, ctx: { params: Promise<{ threadId: string }> }) => {
  const user = await requireRole(can.waive);
  const id = await idFrom(ctx.params, "threadId");
  const input = parseWith(statusSchema, await jsonBody(req));
  return Response.json({ thread: await changeStatus(user, id, input) }, { status: 200 });
});
