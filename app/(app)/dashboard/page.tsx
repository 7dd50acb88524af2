/** The open-findings dashboard (written for managers, readable by every role). */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { DashboardView } from "@/components/dashboard/dashboard-view";

export const metadata: Metadata = { title: "Dashboard" };

export default async function DashboardPage() {
  await requirePageUser("/dashboard");
  return <DashboardView />;
}
