/** GET: the caller's API tokens. POST {name}: create one (the token is in this answer only). Session only. */
import { requireUser } from "@/lib/auth/session";
import { handle, jsonBody, parseWith } from "@/lib/api/handler";
import { createToken, listTokens, tokenInputSchema } from "@/lib/db/tokens";

export const dynamic = "force-dynamic";

export const GET = handle(async () => {
  const user = await requireUser();
  return Response.json({ tokens: await listTokens(user) }, { status: 200 });
});

export const POST = handle(async (req: Request) => {
  const user = await requireUser();
  const { name } = parseWith(tokenInputSchema, await jsonBody(req));
  const created = await createToken(user, name);
  return Response.json(created, { status: 201, headers: { "cache-control": "no-store" } });
});
