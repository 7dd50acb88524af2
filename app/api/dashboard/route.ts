/** GET ?project=&checker=&rule=&days=&format=json|csv: the dashboard figures (every role reads them). */
import { requireUser } from "@/lib/auth/session";
import { handle, parseWith } from "@/lib/api/handler";
import { dashboard, dashboardCsv, dashboardFilterSchema } from "@/lib/db/dashboard";

export const dynamic = "force-dynamic";

export const GET = handle(async (req: Request) => {
  const user = await requireUser();
  const params = Object.fromEntries(new URL(req.url).searchParams);
  const { format, ...rest } = params;
  const filter = parseWith(dashboardFilterSchema, Object.fromEntries(Object.entries(rest).filter(([, v]) => v !== "")));
  const data = await dashboard(user, filter);
  if (format === "csv")
    return new Response(dashboardCsv(data), {
      status: 200,
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": 'attachment; filename="sixfold-open-findings.csv"' },
    });
  return Response.json(data, { status: 200 });
});
