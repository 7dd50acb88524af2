/** POST: a designer creates a layout in a project. */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { createLayout, layoutInputSchema } from "@/lib/db/layouts";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const POST = handle(async (req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireRole(can.createLayout);
  const projectId = await idFrom(ctx.params, "projectId");
  const input = parseWith(layoutInputSchema, await jsonBody(req));
  return Response.json({ layout: await createLayout(user, projectId, input) }, { status: 201 });
});
