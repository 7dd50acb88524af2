/** DELETE: remove an entry from a project's materials library (admins and managers). */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom } from "@/lib/api/handler";
import { removeProjectMaterial } from "@/lib/db/materials";

export const dynamic = "force-dynamic";

export const DELETE = handle(async (_req: Request, ctx: { params: Promise<{ projectId: string; materialId: string }> }) => {
  const user = await requireRole(["admin", "manager"]);
  const id = await idFrom(ctx.params, "projectId");
  const { materialId } = await ctx.params;
  await removeProjectMaterial(user, id, decodeURIComponent(materialId));
  return new Response(null, { status: 204 });
});
