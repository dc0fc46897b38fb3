import { AppError } from "@/lib/server/errors";
import { route } from "@/lib/server/handler";
import { previewShare } from "@/lib/server/shares";
import { TokenParams } from "@/lib/validation/params";

// Knowing the token is the permission to see which gig it is for.
export const GET = route({ params: TokenParams, anonymous: true }, async ({ db, params }) => {
  const share = await previewShare(db, params.token);
  if (!share) throw new AppError("not_found", "That share link is not valid. Ask the leader to send it again.");
  return { share };
});
