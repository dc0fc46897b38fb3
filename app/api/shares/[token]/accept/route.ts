import { route } from "@/lib/server/handler";
import { acceptShare } from "@/lib/server/shares";
import { TokenParams } from "@/lib/validation/params";

export const POST = route({ params: TokenParams }, async ({ db, actor, params }) => acceptShare(db, actor, params.token));
