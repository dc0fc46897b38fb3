// Small shared schemas for ids, e-mail addresses and instruments (roles: lib/band/roles).
import { z } from "zod";
import { INSTRUMENT_IDS } from "@/lib/music/instruments";

export const InstrumentIdSchema = z.enum(INSTRUMENT_IDS, { message: "Choose an instrument: concert, concert-bass, bb, eb or f" });
export type InstrumentId = z.infer<typeof InstrumentIdSchema>;

export const EmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, "That e-mail address is too long")
  .pipe(z.email({ message: "Enter an e-mail address like name@example.com" }));

export const IdSchema = z.string().min(1).max(64).regex(/^[A-Za-z0-9_-]+$/, "Not a valid id");

/** An ISO-8601 date-time in the future is checked by the use case; here only the shape. */
export const IsoDateTimeSchema = z.iso.datetime({ offset: true, message: "Use an ISO date-time like 2026-12-31T23:00:00Z" });
