import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { LINK_REL, NOTES_MAX_LENGTH, NotesTooLongError, renderMarkdown } from "@/lib/content/markdown";

// Vectors after the OWASP XSS Filter Evasion Cheat Sheet
// (https://cheatsheetseries.owasp.org/cheatsheets/XSS_Filter_Evasion_Cheat_Sheet.html),
// reproduced from memory, not copied: a representative set of its families (plain script, event
// handlers, javascript:/vbscript:/data: URLs with case, entity, whitespace and backtick
// obfuscation, frames, style and expression(), malformed and nested tags), plus the Markdown-only
// routes to the same places (link and image destinations, autolinks, reference definitions).
const OWASP_VECTORS_FROM_MEMORY: Array<[name: string, input: string]> = [
  ["plain script", "<script>alert('XSS')</script>"],
  ["script with src", '<SCRIPT SRC="https://xss.example/xss.js"></SCRIPT>'],
  ["img onerror", "<img src=x onerror=alert(1)>"],
  ["img javascript: src", "<IMG SRC=\"javascript:alert('XSS');\">"],
  ["img src case-mixed, no quotes", "<IMG SRC=JaVaScRiPt:alert('XSS')>"],
  ["img src in backticks", "<IMG SRC=`javascript:alert(1)`>"],
  [
    "img src with HTML entities",
    "<IMG SRC=&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;&#97;&#108;&#101;&#114;&#116;&#40;&#39;&#88;&#83;&#83;&#39;&#41;>",
  ],
  ["img src with embedded tab entity", '<IMG SRC="jav&#x09;ascript:alert(1);">'],
  ["img src with embedded newline", '<IMG SRC="jav&#x0A;ascript:alert(1);">'],
  ["malformed img with quoted script", '<IMG """><SCRIPT>alert("XSS")</SCRIPT>">'],
  ["svg onload", "<svg/onload=alert(1)>"],
  ["body onload", "<BODY ONLOAD=alert('XSS')>"],
  ["iframe javascript:", '<IFRAME SRC="javascript:alert(1);"></IFRAME>'],
  ["style tag with expression()", "<STYLE>li {list-style-image: url(\"javascript:alert('XSS')\");}</STYLE><UL><LI>XSS</LI></UL>"],
  ["style attribute with expression()", "<DIV STYLE=\"width: expression(alert('XSS'));\">x</DIV>"],
  ["data: URL in a link", '<a href="data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==">click</a>'],
  ["half-open double script", "<<SCRIPT>alert(1);//<</SCRIPT>"],
  ["script without closing tag", "<SCRIPT SRC=https://xss.example/xss.js?< B >"],
  ["meta refresh to data:", '<META HTTP-EQUIV="refresh" CONTENT="0;url=data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg">'],
  [
    "object/embed",
    '<OBJECT TYPE="text/x-scriptlet" DATA="https://xss.example/scriptlet.html"></OBJECT><EMBED SRC="data:image/svg+xml;base64,PHN2Zz48L3N2Zz4=">',
  ],
  ["vbscript: in a link", '<a href="vbscript:msgbox(1)">x</a>'],
  ["Markdown link to javascript:", "[x](javascript:alert(1))"],
  ["Markdown link, case and entity obfuscated", "[x](JaVaScRiPt&#58;alert(1)) [y](jav&#x09;ascript:alert(1)) [z]( javascript:alert(1) )"],
  ["Markdown link with URL-encoded scheme", "[x](javascript%3Aalert(1)) [y](&#x6A;avascript:alert(1))"],
  ["Markdown image to javascript:", "![x](javascript:alert(1))"],
  ["Markdown link to data: and vbscript:", "[a](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==) [b](vbscript:msgbox(1))"],
  ["autolink with javascript:", "<javascript:alert(1)>"],
  ["reference definition to javascript:", "[x][r]\n\n[r]: javascript:alert(1)"],
  ["link title breaking out", '[x](https://ok.example "title\\" onmouseover=\\"alert(1))'],
  ["nested and malformed tags", "<div><p>text<script>alert(1)</script></div></p><a href='javascript:alert(1)'<b>x</b>"],
  ["event handler in a Markdown-looking HTML block", "<details open ontoggle=alert(1)>\n\n**x**\n\n</details>"],
];

/**
 * No part of the output may be able to run script: the simple check the issue asks for. Text is
 * escaped by the stringifier (a literal "<" leaves as "&#x3C;"), so every "<" in the output opens a
 * real tag; words like "javascript:" or "onload=" inside escaped text are inert, and only the tags
 * themselves (names, attributes, URLs) are searched for them.
 */
function expectNoScriptCapableOutput(html: string): void {
  expect(html).not.toMatch(/<(script|iframe|frame|style|object|embed|meta|svg|math|body|img|base|link|form|input)\b/i);
  // a tag runs to the first ">" outside a quoted attribute value; inside quotes "<" and ">" are
  // inert text (an href of "j<" is just a relative URL)
  const tags = html.match(/<(?:[^>"]|"[^"]*")*>/g) ?? [];
  for (const tag of tags) {
    expect(tag).toMatch(/^<\/?(a|p|em|strong|code|pre|ul|ol|li|blockquote|br|hr|h[1-6]|div|details|summary|del|b|i)( (?:[^<>"]|"[^"]*")*)?>$/);
    expect(tag).not.toMatch(/\son\w+\s*=/i);
    expect(tag).not.toMatch(/javascript:|vbscript:|data:|expression\s*\(/i);
    expect(tag).not.toMatch(/\sstyle\s*=/i);
    // an allowed scheme, or none at all (a relative URL: no ":" before the first "/", "?" or "#",
    // as in the WHATWG URL parser), which a browser resolves against our own origin
    for (const [, href] of tag.matchAll(/href="([^"]*)"/g)) expect(href).toMatch(/^(https?:|mailto:|[^:/?#]*([/?#]|$))/);
  }
}

describe("renderMarkdown against the OWASP XSS Filter Evasion Cheat Sheet (vectors from memory)", () => {
  it.each(OWASP_VECTORS_FROM_MEMORY)("%s", (_name, input) => {
    expectNoScriptCapableOutput(renderMarkdown(input));
  });

  it("the same vectors inside ordinary Markdown (list item, blockquote, emphasis) stay inert", () => {
    for (const [, input] of OWASP_VECTORS_FROM_MEMORY) {
      expectNoScriptCapableOutput(renderMarkdown(`- item ${input}\n\n> quote ${input}\n\n*${input}*`));
    }
  });

  it("random splices of the vectors' pieces stay inert (fast-check)", () => {
    const pieces = [
      "<",
      ">",
      "<script>",
      "</script>",
      "<img src=x ",
      "onerror=alert(1)",
      "javascript:",
      "jav&#x09;ascript:",
      "&#106;",
      "[x](",
      ")",
      "![y](",
      "<",
      '"',
      "'",
      "`",
      "\n\n",
      "> ",
      "- ",
      "*",
      "data:text/html,",
      "<a href=",
      "<svg",
      " onload=",
      "style=",
      "&",
    ];
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...pieces), { maxLength: 40 }), (parts) => {
        expectNoScriptCapableOutput(renderMarkdown(parts.join("")));
      }),
      { numRuns: 500 },
    );
  });
});

describe("renderMarkdown keeps safe Markdown", () => {
  it("renders paragraphs, emphasis, lists, code and headings", () => {
    const html = renderMarkdown("## Bench\n\nMeasured **16.8 V** with a *multimeter*.\n\n- pack 1\n- pack 2\n\n`vbat` and\n\n```\n1 2 3\n```");
    expect(html).toContain("<h2>Bench</h2>");
    expect(html).toContain("<strong>16.8 V</strong>");
    expect(html).toContain("<em>multimeter</em>");
    expect(html).toContain("<li>pack 1</li>");
    expect(html).toContain("<code>vbat</code>");
    expect(html).toContain("<pre><code>1 2 3\n</code></pre>");
  });

  it("keeps http(s) and mailto links, each with rel nofollow noopener noreferrer", () => {
    const html = renderMarkdown("[log](https://logs.example/run/1) <https://auto.example/x> [mail](mailto:a@b.example)");
    const rel = `rel="${LINK_REL.join(" ")}"`;
    expect(html).toContain(`<a href="https://logs.example/run/1" ${rel}>log</a>`);
    expect(html).toContain(`<a href="https://auto.example/x" ${rel}>https://auto.example/x</a>`);
    expect(html).toContain(`<a href="mailto:a@b.example" ${rel}>mail</a>`);
  });

  it("a link to a refused scheme keeps its text but loses its href", () => {
    expect(renderMarkdown("[click me](javascript:alert(1))")).toBe(`<p><a rel="${LINK_REL.join(" ")}">click me</a></p>`);
  });

  it("turns images into links labelled by their alt text, so a note loads nothing from elsewhere", () => {
    const html = renderMarkdown("![shunt close-up](https://photos.example/shunt.jpg)");
    expect(html).not.toContain("<img");
    expect(html).toContain(`<a href="https://photos.example/shunt.jpg" rel="${LINK_REL.join(" ")}">shunt close-up</a>`);
  });

  it("drops raw HTML tags but keeps their text, escaped", () => {
    expect(renderMarkdown("a <b>bold</b> & <i>x</i> 1 < 2")).toBe("<p>a bold &#x26; x 1 &#x3C; 2</p>");
  });

  it("prefixes ids so a note cannot clobber the page's own element ids", () => {
    expect(renderMarkdown("[a][main]\n\n[main]: https://x.example")).not.toMatch(/id="main"/);
  });
});

describe("renderMarkdown input cap", () => {
  it("renders exactly NOTES_MAX_LENGTH characters and refuses one more", () => {
    expect(renderMarkdown("a".repeat(NOTES_MAX_LENGTH))).toContain("a".repeat(100));
    expect(() => renderMarkdown("a".repeat(NOTES_MAX_LENGTH + 1))).toThrow(NotesTooLongError);
  });

  it("quotes nested deeper than any honest note are shown as escaped text, quickly and without a stack overflow", () => {
    const started = performance.now();
    const html = renderMarkdown(">".repeat(6000) + " <script>alert(1)</script>");
    expect(html.startsWith("<p>>>>>")).toBe(true);
    expect(html).toContain("&#x3C;script>alert(1)&#x3C;/script>");
    expectNoScriptCapableOutput(html);
    expect(performance.now() - started).toBeLessThan(1000);
  });

  it("ordinary nesting still renders as Markdown", () => {
    expect(renderMarkdown("> > quoted twice")).toBe("<blockquote>\n<blockquote>\n<p>quoted twice</p>\n</blockquote>\n</blockquote>");
    const started = performance.now();
    renderMarkdown("[".repeat(3000) + "*".repeat(3000) + "_".repeat(3000));
    expect(performance.now() - started).toBeLessThan(3000);
  });
});
