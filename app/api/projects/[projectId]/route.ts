/** GET: a project with its layouts, review state and administration history (every role). PATCH: a manager assigns the checker. */
import { requireRole, requireUser } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { assignChecker, assignCheckerSchema, getProject, projectHistory } from "@/lib/db/projects";
import { listLayouts } from "@/lib/db/layouts";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "projectId");
  const project = await getProject(user, id);
  return Response.json({ project, layouts: await listLayouts(user, id), history: await projectHistory(user, id) }, { status: 200 });
});

export const PATCH = handle(async (req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireRole(["manager"]);
  const id = await idFrom(ctx.params, "projectId");
  const { checkerId } = parseWith(assignCheckerSchema, await jsonBody(req));
  return Response.json({ project: await assignChecker(user, id, checkerId) }, { status: 200 });
});
