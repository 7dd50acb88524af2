/** GET: a layout with its revisions, threads and history (every role). */
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom } from "@/lib/api/handler";
import { getLayout } from "@/lib/db/layouts";
import { listRevisions } from "@/lib/db/revisions";
import { listThreads } from "@/lib/db/threads";
import { listEvents } from "@/lib/db/events";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ layoutId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "layoutId");
  const layout = await getLayout(user, id);
  const [revisions, threads, history] = await Promise.all([listRevisions(user, id), listThreads(user, id), listEvents({ layoutId: id })]);
  return Response.json({ layout, revisions, threads, history }, { status: 200 });
});
