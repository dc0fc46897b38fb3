// Bodies for bands, members and invites.
import { z } from "zod";
import { RoleSchema } from "@/lib/band/roles";
import { EmailSchema, IdSchema, InstrumentIdSchema, IsoDateTimeSchema } from "./common";

export const BandCreateSchema = z
  .object({
    name: z.string().trim().min(1, "A band needs a name").max(120, "That name is too long (120 characters at most)"),
    city: z.string().trim().max(120, "That city is too long (120 characters at most)").nullable().default(null),
    instrument: InstrumentIdSchema.default("concert"),
  })
  .strict();
export type BandCreate = z.infer<typeof BandCreateSchema>;

export const InviteCreateSchema = z
  .object({
    email: EmailSchema,
    role: RoleSchema,
    instrument: InstrumentIdSchema.default("concert"),
    /** For a sub: when their access ends. */
    accessExpiresAt: IsoDateTimeSchema.nullable().default(null),
  })
  .strict();
export type InviteCreate = z.infer<typeof InviteCreateSchema>;

export const MemberUpdateSchema = z
  .object({
    role: RoleSchema.optional(),
    instrument: InstrumentIdSchema.optional(),
    expiresAt: IsoDateTimeSchema.nullable().optional(),
  })
  .strict()
  .refine((v) => v.role !== undefined || v.instrument !== undefined || v.expiresAt !== undefined, {
    message: "Send a role, an instrument or an access end time",
  });
export type MemberUpdate = z.infer<typeof MemberUpdateSchema>;

export const MyInstrumentSchema = z
  .object({
    instrument: InstrumentIdSchema,
    /** Set to change the part you read in one band; leave out to change your default. */
    bandId: IdSchema.optional(),
  })
  .strict();
export type MyInstrument = z.infer<typeof MyInstrumentSchema>;

