import { describe, expect, it } from "vitest";
import { useState } from "react";
import { render, screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { MentionTextarea } from "../mention-textarea";
import { members } from "../../testing/fixtures";

function Harness({ initial = "" }: { initial?: string }) {
  const [value, setValue] = useState(initial);
  return (
    <>
      <label htmlFor="box">Comment</label>
      <MentionTextarea id="box" members={members} value={value} onChange={setValue} />
      <output data-testid="value">{value}</output>
    </>
  );
}

const box = () => screen.getByRole("combobox", { name: "Comment" });
const value = () => screen.getByTestId("value").textContent;

describe("MentionTextarea", () => {
  it("suggests members whose name or a word of it starts with what follows @", async () => {
    render(<Harness />);
    await userEvent.type(box(), "Thanks @o");
    const options = screen.getAllByRole("option").map((o) => o.textContent);
    expect(options).toEqual([
      "Olwen Castellanolwen@example.test",
      "Oskar Bellweatheroskar@example.test",
      "Tamsin Orchardtamsin@example.test",
    ]);
    expect(box()).toHaveAttribute("aria-expanded", "true");
    await userEvent.type(box(), "s");
    expect(screen.getAllByRole("option")).toHaveLength(1);
  });

  it("inserts the full name with Enter and closes the list", async () => {
    render(<Harness />);
    await userEvent.type(box(), "Ask @bell");
    expect(screen.getByRole("option", { name: /Oskar Bellweather/ })).toHaveAttribute(
      "aria-selected",
      "true",
    );
    await userEvent.keyboard("{Enter}");
    expect(value()).toBe("Ask @Oskar Bellweather ");
    expect(screen.queryByRole("listbox")).toBeNull();
    await userEvent.type(box(), "about shot 2");
    expect(value()).toBe("Ask @Oskar Bellweather about shot 2");
  });

  it("moves through the suggestions with the arrow keys and picks with a click", async () => {
    render(<Harness />);
    await userEvent.type(box(), "@o");
    await userEvent.keyboard("{ArrowDown}");
    expect(screen.getAllByRole("option")[1]).toHaveAttribute("aria-selected", "true");
    await userEvent.keyboard("{ArrowUp}{ArrowUp}");
    expect(screen.getAllByRole("option")[2]).toHaveAttribute("aria-selected", "true");
    await userEvent.click(screen.getByRole("option", { name: /Olwen Castellan/ }));
    expect(value()).toBe("@Olwen Castellan ");
  });

  it("closes on Escape and leaves the text alone", async () => {
    render(<Harness />);
    await userEvent.type(box(), "@ta");
    expect(screen.getByRole("listbox")).toBeInTheDocument();
    await userEvent.keyboard("{Escape}");
    expect(screen.queryByRole("listbox")).toBeNull();
    expect(value()).toBe("@ta");
  });

  it("does not suggest inside an e-mail address or when nobody matches", async () => {
    render(<Harness />);
    await userEvent.type(box(), "write to tamsin@ex");
    expect(screen.queryByRole("listbox")).toBeNull();
    await userEvent.type(box(), " @zz");
    expect(screen.queryByRole("listbox")).toBeNull();
  });

  it("lets Enter make a new line when the list is closed", async () => {
    render(<Harness />);
    await userEvent.type(box(), "line one{Enter}line two");
    expect(value()).toBe("line one\nline two");
  });
});
