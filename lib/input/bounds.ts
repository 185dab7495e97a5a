import { z } from "zod";

// Ids and dates arrive as JSON numbers and strings that the database would refuse with an error
// (int4 out of range, year 0): checked here so the answer is a 400 naming the field.

/** PostgreSQL integer (int4) upper bound: every row id here is one. */
const INT4_MAX = 2_147_483_647;

/** A row id chosen from a list: a positive int4, with one message for anything else. */
export const rowIdField = (message: string) => z.number({ error: message }).int(message).positive(message).max(INT4_MAX, message);

/**
 * The earliest date a pack, charge or reading may carry: nothing in the garage predates
 * hobby LiPo packs by much, and year 0 is not a date PostgreSQL knows (our own plausibility rule).
 */
const EARLIEST_DATE = "2000-01-01";

/** An ISO calendar date from 2000-01-01 to today (UTC). */
export const pastIsoDate = (label: string) =>
  z.iso
    .date({ error: `${label} must be a date like 2026-11-30` })
    .refine((d) => d >= EARLIEST_DATE, `${label} cannot be before ${EARLIEST_DATE}`)
    .refine((d) => d <= new Date().toISOString().slice(0, 10), `${label} cannot be in the future`);
