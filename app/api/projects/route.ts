/** GET: every signed-in role lists projects. POST: managers create one. */
import { requireRole, requireUser } from "@/lib/auth/session";
import { handle, jsonBody, parseWith } from "@/lib/api/handler";
import { createProject, listProjects, projectInputSchema } from "@/lib/db/projects";

export const dynamic = "force-dynamic";

export const GET = handle(async () => {
  const user = await requireUser();
  return Response.json({ projects: await listProjects(user) }, { status: 200 });
});

export const POST = handle(async (req: Request) => {
  const user = await requireRole(["manager"]);
  const input = parseWith(projectInputSchema, await jsonBody(req));
  return Response.json({ project: await createProject(user, input) }, { status: 201 });
});
