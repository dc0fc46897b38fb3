/** What a member-screen server action hands back to its form. */
export interface MemberFormState {
  status: "idle" | "ok" | "error";
  message: string;
  /** Field name → message, announced beside the field. */
  fields: Record<string, string>;
  /** The error's code ("payment_required" when the plan is full), so the form can offer the way on. */
  code?: string;
}

export const IDLE: MemberFormState = { status: "idle", message: "", fields: {} };
