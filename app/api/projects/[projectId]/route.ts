/** GET: a project with its layouts and their review state (every role). */
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom } from "@/lib/api/handler";
import { getProject } from "@/lib/db/projects";
import { listLayouts } from "@/lib/db/layouts";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "projectId");
  const project = await getProject(user, id);
  return Response.json({ project, layouts: await listLayouts(user, id) }, { status: 200 });
});
