import { z } from "zod";
import { multiLine, oneLine } from "@/lib/input/text";

/** "Publish to Shuntbook": both optional; the quad's firmware version is used when none is sent. */
export const publishInput = z.object(
  {
    firmwareVersion: oneLine(z.string({ error: "The firmware version is text, like dunlin" }).trim(), "The firmware version")
      .nullish()
      .transform((v) => (v ? v : null)),
    notes: multiLine(z.string({ error: "Notes are text" }), "Notes")
      .nullish()
      .transform((v) => (v && v.trim() ? v : null)),
  },
  { error: "Send the publish request as one JSON object (it may be empty)" },
);
