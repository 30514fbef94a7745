import { redirect } from "next/navigation";
import { currentViewer } from "@/lib/auth/session";

export default async function Home() {
  const viewer = await currentViewer();
  redirect(viewer ? "/projects" : "/signin");
}
