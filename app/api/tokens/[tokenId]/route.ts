/** DELETE: revoke one of the caller's tokens. */
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom } from "@/lib/api/handler";
import { revokeToken } from "@/lib/db/tokens";

export const dynamic = "force-dynamic";

export const DELETE = handle(async (_req: Request, ctx: { params: Promise<{ tokenId: string }> }) => {
  const user = await requireUser();
  await revokeToken(user, await idFrom(ctx.params, "tokenId"));
  return Response.json({ ok: true }, { status: 200 });
});
