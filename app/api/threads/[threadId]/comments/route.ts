/** POST (designer, checker): add a markdown comment to a thread. */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { commentSchema } from "@/lib/contracts/threads";
import { commentOnThread } from "@/lib/review/actions";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const POST = handle(async (req: Request, ctx: { params: Promise<{ threadId: string }> }) => {
  const user = await requireRole(can.comment);
  const id = await idFrom(ctx.params, "threadId");
  const { body } = parseWith(commentSchema, await jsonBody(req));
  return Response.json({ comment: await commentOnThread(user, id, body) }, { status: 201 });
});
