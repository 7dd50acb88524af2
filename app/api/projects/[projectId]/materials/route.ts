/** GET: a project's materials library (every role). POST: add or replace an entry (admins and managers). */
import { requireRole, requireUser } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { listProjectMaterials, projectMaterialSchema, setProjectMaterial } from "@/lib/db/materials";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "projectId");
  return Response.json({ materials: await listProjectMaterials(user, id) }, { status: 200 });
});

export const POST = handle(async (req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireRole(["admin", "manager"]);
  const id = await idFrom(ctx.params, "projectId");
  const input = parseWith(projectMaterialSchema, await jsonBody(req));
  return Response.json({ materials: await setProjectMaterial(user, id, input) }, { status: 201 });
});
