import { remark } from "remark";
import rehypeSanitize, { defaultSchema, type Options as SanitizeSchema } from "rehype-sanitize";
import rehypeStringify from "rehype-stringify";
import remarkRehype, { type Options as RemarkRehypeOptions } from "remark-rehype";
import { normalizeUri } from "micromark-util-sanitize-uri";

// Contributors' notes are Markdown written by strangers and shown to everyone, so the renderer is
// the XSS boundary. Three layers, all from the unified ecosystem rather than code of our own:
//   1. remark-rehype without allowDangerousHtml: raw HTML in the Markdown never reaches the output
//      (tags are dropped, text between them stays text).
//   2. rehype-sanitize with GitHub's allow-list, narrowed further below: no images (a third-party
//      image in a note would tell its host who read the note; Markdown images become plain links),
//      no form controls, and links only to http(s) and mailto, so javascript:, vbscript: and data:
//      URLs lose their href.
//   3. rehype-stringify escapes every text node and attribute value.

/** Same cap as the submissions.notes CHECK constraint; it also bounds the parser's work. */
export const NOTES_MAX_LENGTH = 10_000;

/** Every link leaves with these: no ranking credit for spam, no window.opener, no Referer. */
export const LINK_REL = ["nofollow", "noopener", "noreferrer"];

const DROPPED_TAGS = new Set(["img", "picture", "source", "input"]);

const NOTES_SCHEMA: SanitizeSchema = {
  ...defaultSchema,
  tagNames: (defaultSchema.tagNames ?? []).filter((tag) => !DROPPED_TAGS.has(tag)),
  protocols: { ...defaultSchema.protocols, href: ["http", "https", "mailto"] },
  // a fenced block's language becomes a class; keep it to a plain word so no URL-like text
  // ("```data:text/html,…") reaches an attribute
  attributes: { ...defaultSchema.attributes, code: [["className", /^language-[\w+#-]+$/]] },
  // `required` adds rel to every <a> after the attribute allow-list ran (which does not allow rel,
  // so a smuggled one is removed first).
  required: { a: { rel: LINK_REL } },
};

// ![alt](url) becomes a link labelled with its alt text, so the reader keeps the information
// without the page fetching anything from a stranger's server. The URL is normalised (percent-
// encoded) as remark's own link and image handlers do, so no raw "<" or quote reaches the href.
const imageAsLink: NonNullable<NonNullable<RemarkRehypeOptions["handlers"]>["image"]> = (_state, node: { url: string; alt?: string | null }) => ({
  type: "element",
  tagName: "a",
  properties: { href: normalizeUri(node.url) },
  children: [{ type: "text", value: node.alt || node.url }],
});

const processor = remark()
  .use(remarkRehype, { allowDangerousHtml: false, handlers: { image: imageAsLink } })
  .use(rehypeSanitize, NOTES_SCHEMA)
  .use(rehypeStringify)
  .freeze();

// The Markdown → HTML step recurses once per nesting level: thousands of nested quotes ("> > > …")
// fit in the length cap, cost seconds (quadratic) and overflow the stack near 5,000. No honest
// note nests quotes this deep, so such input (or anything else that overflows) is shown as text.
const MAX_QUOTE_DEPTH = 16;
const TOO_DEEP_QUOTES = new RegExp(`^(?:[ \\t]{0,3}>){${MAX_QUOTE_DEPTH + 1}}`, "m");

/** The note as one escaped paragraph, built as a tree so rehype-stringify does the escaping. */
function asPlainText(markdown: string): string {
  return processor.stringify({
    type: "root",
    children: [{ type: "element", tagName: "p", properties: {}, children: [{ type: "text", value: markdown }] }],
  });
}

export class NotesTooLongError extends RangeError {
  constructor(readonly length: number) {
    super(`Notes are limited to ${NOTES_MAX_LENGTH.toLocaleString("en")} characters; these have ${length.toLocaleString("en")}.`);
    this.name = "NotesTooLongError";
  }
}

/**
 * Markdown → sanitised HTML, safe to put into a page with dangerouslySetInnerHTML. Throws
 * NotesTooLongError above NOTES_MAX_LENGTH characters (validate the field before storing it).
 */
export function renderMarkdown(markdown: string): string {
  if (markdown.length > NOTES_MAX_LENGTH) throw new NotesTooLongError(markdown.length);
  if (TOO_DEEP_QUOTES.test(markdown)) return asPlainText(markdown);
  try {
    return String(processor.processSync(markdown));
  } catch (error) {
    if (error instanceof RangeError) return asPlainText(markdown);
    throw error;
  }
}
