/** POST (designer, checker): add a markdown comment to a thread. */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { addComment, commentSchema } from "@/lib/db/threads";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const POST = handle(async (req: Request, ctx: { params: Promise<{ threadId: string }> }) => {
  const user = await requireRole(can.comment);
  const id = await idFrom(ctx.params, "threadId");
  const { body } = parseWith(commentSchema, await jsonBody(req));
  return Response.json({ comment: await addComment(user, id, body) }, { status: 201 });
});
