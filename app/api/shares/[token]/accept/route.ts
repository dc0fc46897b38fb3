import { ready } from "@/db";
import { route } from "@/lib/server/handler";
import { acceptShare } from "@/lib/server/shares";
import { TokenParams } from "@/lib/validation/params";

export const POST = route({ params: TokenParams }, async ({ actor, params }) => acceptShare(await ready(), actor, params.token));
