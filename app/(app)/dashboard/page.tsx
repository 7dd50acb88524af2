/** The open-findings dashboard (written for managers, readable by every role). */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { DashboardView } from "@/components/dashboard/dashboard-view";

export const metadata: Metadata = { title: "Dashboard" };

export default async function DashboardPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  await requirePageUser("/dashboard");
  const sp = await searchParams;
  // the filters come from the address (bookmarkable); the view keeps them there as they change
  return <DashboardView initial={{ project: sp.project ?? "", checker: sp.checker ?? "", rule: sp.rule ?? "", days: sp.days ?? "60" }} />;
}
