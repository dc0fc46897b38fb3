// Bodies for sign-up and sign-in-link requests, shared by the forms and the route handlers.
import { z } from "zod";
import { EmailSchema, InstrumentIdSchema } from "./common";

export const PASSWORD_MIN = 8;

export const PasswordSchema = z
  .string()
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters for the password`)
  .max(200, "That password is too long (200 characters at most)");

export const SignUpSchema = z
  .object({
    name: z.string().trim().min(1, "Tell us your name").max(100, "That name is too long (100 characters at most)"),
    email: EmailSchema,
    password: PasswordSchema,
    instrument: InstrumentIdSchema.default("concert"),
  })
  .strict();
export type SignUpInput = z.infer<typeof SignUpSchema>;

export const SignInLinkRequestSchema = z
  .object({
    email: EmailSchema,
    callbackUrl: z.string().max(500).optional(),
  })
  .strict();
export type SignInLinkRequest = z.infer<typeof SignInLinkRequestSchema>;
