/** GET: download one of the shipped example layouts (signed-in users). */
import { readFile } from "node:fs/promises";
import path from "node:path";
import { requireUser } from "@/lib/auth/session";
import { handle } from "@/lib/api/handler";
import { notFound } from "@/lib/errors";

export const dynamic = "force-dynamic";
const types: Record<string, string> = { json: "application/json", xml: "application/xml", csv: "text/csv" };

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ file: string }> }) => {
  await requireUser();
  const { file } = await ctx.params;
  const m = /^([a-z0-9-]+)\.(json|xml|csv)$/.exec(file);
  if (!m) throw notFound("That example");
  try {
    const body = await readFile(path.join(process.cwd(), "examples", file), "utf8");
    return new Response(body, { status: 200, headers: { "content-type": `${types[m[2]]}; charset=utf-8`, "content-disposition": `attachment; filename="${file}"` } });
  } catch {
    throw notFound("That example");
  }
});
