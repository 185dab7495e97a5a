import { z } from "zod";

/** "Publish to Shuntbook": both optional; the quad's firmware version is used when none is sent. */
export const publishInput = z.object(
  {
    firmwareVersion: z
      .string({ error: "The firmware version is text, like dunlin" })
      .trim()
      .nullish()
      .transform((v) => (v ? v : null)),
    notes: z
      .string({ error: "Notes are text" })
      .nullish()
      .transform((v) => (v && v.trim() ? v : null)),
  },
  { error: "Send the publish request as one JSON object (it may be empty)" },
);
