import { describe, expect, it } from "vitest";
import { findMentions } from "./comments";

const members = [
  { userId: "u-ines", name: "Ines Varga-Lind", email: "ines.varga@example.test" },
  { userId: "u-pip", name: "Pip Galloway", email: "pip@example.test" },
  { userId: "u-pipg", name: "P. Galloway", email: "pip.galloway@example.test" },
  { userId: "u-tob", name: "Tobias Renshaw", email: "lead@example.test" },
];

describe("findMentions", () => {
  it("matches a full name, case-insensitively, with punctuation after it", () => {
    expect(findMentions("@ines varga-lind, please check.", members)).toEqual(["u-ines"]);
    expect(findMentions("Thanks @TOBIAS RENSHAW!", members)).toEqual(["u-tob"]);
  });

  it("matches the local part of an e-mail address, even at the end of a sentence", () => {
    expect(findMentions("ask @lead.", members)).toEqual(["u-tob"]);
    expect(findMentions("ask @ines.varga", members)).toEqual(["u-ines"]);
  });

  it("prefers the longest match: @pip.galloway is not @pip", () => {
    expect(findMentions("cc @pip.galloway", members)).toEqual(["u-pipg"]);
    expect(findMentions("cc @pip", members)).toEqual(["u-pip"]);
  });

  it("ignores e-mail addresses, longer words and strangers", () => {
    expect(findMentions("write to someone@lead.test", members)).toEqual([]);
    expect(findMentions("@leadership decided", members)).toEqual([]);
    expect(findMentions("@nobody here", members)).toEqual([]);
    expect(findMentions("a lone @ sign", members)).toEqual([]);
  });

  it("collects several people once each", () => {
    expect(findMentions("@lead @pip @lead", members).sort()).toEqual(["u-pip", "u-tob"]);
  });

  it("mentions both members when two share a name", () => {
    const twins = [
      { userId: "a", name: "Sam Reed", email: "sam.a@example.test" },
      { userId: "b", name: "Sam Reed", email: "sam.b@example.test" },
    ];
    expect(findMentions("@Sam Reed", twins).sort()).toEqual(["a", "b"]);
  });
});
