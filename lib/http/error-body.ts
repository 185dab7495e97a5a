import { z } from "zod";
import { ERROR_CODES } from "./errors";

// The one error body of the API (lib/http/respond.ts builds it).
const codes = Object.values(ERROR_CODES) as [string, ...string[]];

export const ErrorBodySchema = z
  .object({
    error: z.object({
      status: z.number().int().meta({ description: "The HTTP status, repeated for clients that only see the body." }),
      code: z.enum(codes).meta({ description: "Stable machine-readable code; the message may change." }),
      message: z.string().meta({ description: "What went wrong, in plain words." }),
      fieldErrors: z.record(z.string(), z.array(z.string())).meta({
        description: "Messages per parameter, keyed by the parameter's name; empty when no one parameter is at fault.",
        example: { page: ["page must be at most 10000"] },
      }),
    }),
  })
  .meta({ id: "Error", description: "Every 4xx and 5xx response has this body, with Cache-Control: no-store." });

export type ErrorBody = z.infer<typeof ErrorBodySchema>;
