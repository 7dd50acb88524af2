/** GET: a finding's thread: appearances, comments, history (every role). */
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom } from "@/lib/api/handler";
import { getThread } from "@/lib/db/threads";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ threadId: string }> }) => {
  const user = await requireUser();
  return Response.json({ thread: await getThread(user, await idFrom(ctx.params, "threadId")) }, { status: 200 });
});
