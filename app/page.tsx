/** The root sends visitors to their projects (or to sign-in). */
import { redirect } from "next/navigation";

export default function Home() {
  redirect("/projects");
}
