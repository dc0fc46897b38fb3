import "server-only";
// The signed-in user for server components, route handlers and server actions.
import { getServerSession } from "next-auth";
import type { Actor } from "./access";
import { authOptions } from "./auth-options";

export async function getActor(): Promise<Actor | null> {
  const session = await getServerSession(authOptions);
  const user = session?.user as { id?: string; email?: string | null; name?: string | null } | undefined;
  if (!user?.id || !user.email) return null;
  return { userId: user.id, email: user.email, name: user.name ?? user.email };
}
