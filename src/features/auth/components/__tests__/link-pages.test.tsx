import { describe, expect, it } from "vitest";
import { screen } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch } from "@/testing/render";
import { ResetPasswordPage } from "../password-pages";
import { AcceptInvitationPage } from "../accept-invitation-page";

const TOKEN = "abcdefghijklmnopqrstuvwxyz234567";
const refusal = (status: number, code: string, message: string, fields?: object) => () => ({
  status,
  body: { error: { code, message, ...(fields ? { fields } : {}) } },
});

async function submitReset(token: string) {
  renderWithApp(<ResetPasswordPage />, {
    me: null,
    path: "/reset/:token",
    route: `/reset/${token}`,
  });
  await userEvent.type(screen.getByLabelText("New password"), "a-new-password-1");
  await userEvent.type(screen.getByLabelText("Repeat the new password"), "a-new-password-1");
  await userEvent.click(screen.getByRole("button", { name: "Set password" }));
}

describe("ResetPasswordPage with a link that cannot be used", () => {
  for (const [code, words] of [
    ["reset_used", /already been used: each link works once/],
    ["reset_expired", /expired: links work for one hour/],
  ] as const) {
    it(`${code}: says so, drops the form and offers a new link`, async () => {
      stubFetch({
        [`POST /api/auth/password-reset/${TOKEN}`]: refusal(410, code, "server words"),
      });
      await submitReset(TOKEN);
      expect(await screen.findByRole("alert")).toHaveTextContent(words);
      expect(screen.queryByLabelText("New password")).toBeNull();
      expect(screen.getByRole("link", { name: "Ask for a new reset link" })).toHaveAttribute(
        "href",
        "/forgot-password",
      );
    });
  }

  it("explains a mistyped link in plain words, not the server's path check", async () => {
    stubFetch({
      "POST /api/auth/password-reset/abc": refusal(
        400,
        "invalid_input",
        "invalid path: token: token must be 32 lower-case base32 characters",
        { token: ["token must be 32 lower-case base32 characters"] },
      ),
    });
    await submitReset("abc");
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent(/incomplete or mistyped/);
    expect(alert).not.toHaveTextContent(/invalid path/);
  });

  it("keeps the form for a password the server refuses", async () => {
    stubFetch({
      [`POST /api/auth/password-reset/${TOKEN}`]: refusal(400, "invalid_input", "too weak", {
        password: ["too weak"],
      }),
    });
    await submitReset(TOKEN);
    expect(await screen.findByText("too weak")).toBeInTheDocument();
    expect(screen.getByLabelText("New password")).toBeInTheDocument();
  });
});

describe("AcceptInvitationPage with a link that cannot be used", () => {
  it("points a used invitation to sign in", async () => {
    stubFetch({
      [`GET /api/invitations/token/${TOKEN}`]: refusal(410, "invitation_used", "used"),
    });
    renderWithApp(<AcceptInvitationPage />, {
      me: null,
      path: "/invite/:token",
      route: `/invite/${TOKEN}`,
    });
    expect(await screen.findByRole("alert")).toHaveTextContent(/already been accepted/);
    expect(screen.getByRole("link", { name: "Sign in" })).toHaveAttribute("href", "/sign-in");
  });

  it("explains a mistyped invitation link in plain words", async () => {
    stubFetch({
      "GET /api/invitations/token/abc": refusal(400, "invalid_input", "invalid path: token: …", {
        token: ["token must be 32 lower-case base32 characters"],
      }),
    });
    renderWithApp(<AcceptInvitationPage />, {
      me: null,
      path: "/invite/:token",
      route: "/invite/abc",
    });
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent(/incomplete or mistyped/);
    expect(alert).not.toHaveTextContent(/invalid path/);
  });
});
