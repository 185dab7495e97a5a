import type { z } from "zod";

// The one rule for free text people type (names, labels, notes, reasons): no control characters.
// NUL cannot be stored in a PostgreSQL text column at all (it answered 500 before), and the other
// C0/C1 controls (escape, bell, backspace …) only ever arrive by accident or to spoof what a
// moderator sees. One-line fields refuse line breaks and tabs too; multi-line fields (notes,
// Markdown) keep tab, line feed and carriage return. Plain zod: the forms check with it as well.

// C0 controls, DEL and the C1 range (Unicode "Cc", from memory of the Unicode character database)
const IN_A_LINE = /[\u0000-\u001f\u007f-\u009f]/;
const IN_TEXT = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/;

const message = (label: string, lineBreaks: boolean) =>
  `${label} cannot contain control characters${lineBreaks ? " (such as NUL or line breaks)" : " (such as NUL)"}`;

/** `schema` that also refuses any control character, line breaks and tabs included. */
export function oneLine<S extends z.ZodString>(schema: S, label: string): S {
  return schema.refine((s) => !IN_A_LINE.test(s), message(label, true)) as S;
}

/** `schema` that refuses control characters other than tab, line feed and carriage return. */
export function multiLine<S extends z.ZodString>(schema: S, label: string): S {
  return schema.refine((s) => !IN_TEXT.test(s), message(label, false)) as S;
}

/** For checks outside zod (next-auth's form fields): true when `s` holds a control character. */
export const hasLineControl = (s: string): boolean => IN_A_LINE.test(s);
