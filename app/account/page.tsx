import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { AccountScreen } from "@/components/account/AccountScreen";
import { getActor } from "@/lib/server/session";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const actor = await getActor();
  if (!actor) redirect(`/signin?callbackUrl=${encodeURIComponent("/account")}`);
  return <AccountScreen email={actor.email} name={actor.name} />;
}
