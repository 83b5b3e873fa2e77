import { describe, expect, it } from "vitest";
import { linkify } from "../mailbox-page";

describe("linkify", () => {
  it("splits text around http links and keeps the rest verbatim", () => {
    expect(linkify("Open http://127.0.0.1:3000/invite/abc to join.\nThanks")).toEqual([
      { kind: "text", value: "Open " },
      { kind: "link", value: "http://127.0.0.1:3000/invite/abc" },
      { kind: "text", value: " to join.\nThanks" },
    ]);
  });

  it("returns the text alone when it holds no link", () => {
    expect(linkify("no links here")).toEqual([{ kind: "text", value: "no links here" }]);
  });
});
