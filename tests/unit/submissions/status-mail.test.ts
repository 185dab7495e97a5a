import { describe, expect, it } from "vitest";
import { statusMail } from "@/lib/submissions/status-mail";

// The words of each status mail (lib/submissions/status-mail.ts): creation, resubmission and each
// moderation outcome, with the moderator's note quoted where there is one.
const facts = { id: 42, board: "Test Board", revision: "v2", family: "Test FW", moderatorNote: null };

describe("status mails", () => {
  it("creation: received, pending review, with the edit link", () => {
    const m = statusMail("a@example.test", "Ann", { ...facts, status: "pending" }, "created");
    expect(m).toMatchObject({ to: "a@example.test", subject: "Shuntbook: Submission #42 received: pending review" });
    expect(m.text).toMatch(/^Hello Ann,/);
    expect(m.text).toMatch(/submission #42 for the Test Board \(revision v2\) under Test FW/);
    expect(m.text).toMatch(/\/my\/submissions\/42\/edit/);
  });

  it("a resubmission after changes were requested says it is back in the queue", () => {
    expect(statusMail("a@example.test", "Ann", { ...facts, status: "pending" }, "resubmitted").subject).toBe(
      "Shuntbook: Submission #42 updated: back in the review queue",
    );
  });

  it.each([
    ["approved", "Shuntbook: Submission #42 approved"],
    ["rejected", "Shuntbook: Submission #42 not accepted"],
    ["changes_requested", "Shuntbook: Submission #42: changes requested"],
  ] as const)("%s", (status, subject) => {
    const m = statusMail("a@example.test", "Ann", { ...facts, status, moderatorNote: "Which charger?\nPlease add it." }, "decided");
    expect(m.subject).toBe(subject);
    expect(m.text).toMatch(/The moderator wrote:\n\n {2}Which charger\?\n {2}Please add it\./);
    expect(m.text).toMatch(/All your submissions: \S+\/my\/submissions/);
  });
});

describe("the automatic approval's mail (issue 13: one mail, no 'pending review' after it)", () => {
  it("says it was published automatically, not that a moderator approved it", () => {
    const m = statusMail("a@example.test", "Ann", { ...facts, status: "approved" }, "auto_approved");
    expect(m.subject).toBe("Shuntbook: Submission #42 published automatically");
    expect(m.text).toMatch(/was published automatically/);
    expect(m.text).not.toMatch(/A moderator approved|pending review/);
  });
});
