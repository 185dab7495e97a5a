import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { EvidencePhotos } from "@/components/photos/evidence-photos";

// The upload component renders on its own (the submission form embeds it), server side included:
// no browser API is touched before it mounts. Its interactive behaviour (progress, refusals,
// thumbnails, removal) was checked in headless Chromium against a running app.
describe("<EvidencePhotos> in isolation", () => {
  const html = renderToStaticMarkup(<EvidencePhotos draftKey="draft-1" onChange={() => undefined} />);

  it("renders a labelled file input that accepts exactly the three formats, described by the hint and the error area", () => {
    const input = html.match(/<input[^>]*type="file"[^>]*>/)?.[0] ?? "";
    expect(input).toContain('accept="image/jpeg,image/png,image/webp"');
    expect(input).toContain("multiple");
    const id = input.match(/id="([^"]+)"/)?.[1];
    expect(html).toContain(`for="${id}"`);
    const describedBy = input.match(/aria-describedby="([^"]+)"/)?.[1].split(" ") ?? [];
    expect(describedBy).toHaveLength(2);
    for (const ref of describedBy) expect(html).toContain(`id="${ref}"`);
  });

  it("states the limits and what happens to location data, and starts with nothing added", () => {
    expect(html).toContain("JPEG, PNG or WebP, up to 8 MB each");
    expect(html).toContain("Location and camera details are removed");
    expect(html).toContain("0 of 8 photos added");
    expect(html).not.toContain("<progress");
  });
});
