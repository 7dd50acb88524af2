/** PATCH: edit one's own comment (the earlier text stays in its history). */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { commentSchema, editComment } from "@/lib/db/threads";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const PATCH = handle(async (req: Request, ctx: { params: Promise<{ commentId: string }> }) => {
  const user = await requireRole(can.comment);
  const id = await idFrom(ctx.params, "commentId");
  const { body } = parseWith(commentSchema, await jsonBody(req));
  return Response.json({ comment: await editComment(user, id, body) }, { status: 200 });
});
