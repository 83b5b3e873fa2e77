import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { activeMention, insertMention, matchMembers, splitMentions } from "../mentions";
import { members } from "../../testing/fixtures";

describe("activeMention", () => {
  it("finds the @query that ends at the caret", () => {
    expect(activeMention("Ask @Osk", 8)).toEqual({ start: 4, query: "Osk" });
    expect(activeMention("@", 1)).toEqual({ start: 0, query: "" });
    expect(activeMention("(@ta", 4)).toEqual({ start: 1, query: "ta" });
  });

  it("ignores e-mail addresses, other lines and a caret before the @", () => {
    expect(activeMention("mail tamsin@example", 19)).toBeNull();
    expect(activeMention("@Osk\nnext", 9)).toBeNull();
    expect(activeMention("Ask @Osk", 3)).toBeNull();
  });

  it("never throws and always points at an @ before the caret", () => {
    fc.assert(
      fc.property(fc.string(), fc.nat(), (text, caret) => {
        const m = activeMention(text, caret);
        if (m === null) return true;
        return text[m.start] === "@" && m.start < Math.max(0, Math.min(caret, text.length));
      }),
    );
  });
});

describe("matchMembers", () => {
  it("ranks a full-name prefix before a word prefix, ignoring case and accents", () => {
    const names = matchMembers(members, "O").map((m) => m.name);
    expect(names).toEqual(["Olwen Castellan", "Oskar Bellweather", "Tamsin Orchard"]);
    expect(
      matchMembers([{ userId: "x", name: "Émile Roux", email: "e@x.test" }], "emi"),
    ).toHaveLength(1);
  });

  it("falls back to the e-mail address and respects the limit", () => {
    expect(matchMembers(members, "tamsin@").map((m) => m.name)).toEqual(["Tamsin Orchard"]);
    expect(matchMembers(members, "", 2)).toHaveLength(2);
  });
});

describe("insertMention", () => {
  it("replaces the typed query by the full name and a space, keeping what follows", () => {
    const text = "Ask @osk about it";
    const m = activeMention(text, 8)!;
    expect(insertMention(text, m, 8, "Oskar Bellweather")).toEqual({
      text: "Ask @Oskar Bellweather about it",
      caret: 23,
    });
  });
});

describe("splitMentions", () => {
  it("marks mentions of known names, longest first, and nothing else", () => {
    const parts = splitMentions("@Ann Lee and @Ann, not a@Ann or @Bob", ["Ann", "Ann Lee"]);
    expect(parts).toEqual([
      { kind: "mention", value: "@Ann Lee" },
      { kind: "text", value: " and " },
      { kind: "mention", value: "@Ann" },
      { kind: "text", value: ", not a@Ann or @Bob" },
    ]);
  });

  it("gives back the whole body when joined", () => {
    fc.assert(
      fc.property(
        fc.string(),
        (body) =>
          splitMentions(body, ["Ann Lee", "Bo"])
            .map((p) => p.value)
            .join("") === body,
      ),
    );
  });
});
