/** Personal settings: API tokens for CAD scripts, and which mails to receive. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { SettingsView } from "@/components/settings/settings-view";

export const metadata: Metadata = { title: "Settings" };

export default async function SettingsPage() {
  const user = await requirePageUser("/settings");
  return <SettingsView name={user.name} />;
}
