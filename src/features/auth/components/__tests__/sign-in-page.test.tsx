import { describe, expect, it } from "vitest";
import { screen, waitFor } from "@testing-library/react";
import userEvent from "@testing-library/user-event";
import { renderWithApp, stubFetch, testMe } from "@/testing/render";
import { SignInPage } from "../sign-in-page";

describe("SignInPage", () => {
  it("shows inline errors for an invalid e-mail and an empty password and sends nothing", async () => {
    const calls = stubFetch({});
    renderWithApp(<SignInPage />, { me: null });
    await userEvent.type(screen.getByLabelText("E-mail"), "not-an-address");
    await userEvent.click(screen.getByRole("button", { name: "Sign in" }));
    expect(await screen.findByText("enter a valid e-mail address")).toBeInTheDocument();
    expect(screen.getByText("password is required")).toBeInTheDocument();
    expect(screen.getByLabelText("E-mail")).toHaveAttribute("aria-invalid", "true");
    expect(calls).toHaveLength(0);
  });

  it("shows the server's message when the credentials are refused", async () => {
    stubFetch({
      "POST /api/auth/sign-in": () => ({
        status: 401,
        body: { error: { code: "invalid_credentials", message: "E-mail or password is wrong." } },
      }),
    });
    renderWithApp(<SignInPage />, { me: null });
    await userEvent.type(screen.getByLabelText("E-mail"), "lead@example.test");
    await userEvent.type(screen.getByLabelText("Password"), "wrong password");
    await userEvent.click(screen.getByRole("button", { name: "Sign in" }));
    expect(await screen.findByText("E-mail or password is wrong.")).toBeInTheDocument();
  });

  it("posts the lower-cased e-mail and goes to the next page on success", async () => {
    const calls = stubFetch({ "POST /api/auth/sign-in": () => ({ status: 200, body: testMe() }) });
    const { router } = renderWithApp(<SignInPage />, {
      me: null,
      path: "/sign-in",
      route: "/sign-in?next=%2Fteam",
      extraRoutes: [{ path: "/team", element: <p>team page</p> }],
    });
    await userEvent.type(screen.getByLabelText("E-mail"), "Lead@Example.test");
    await userEvent.type(screen.getByLabelText("Password"), "a long password");
    await userEvent.click(screen.getByRole("button", { name: "Sign in" }));
    await waitFor(() => expect(router.state.location.pathname).toBe("/team"));
    expect(calls[0].body).toEqual({ email: "lead@example.test", password: "a long password" });
  });

  it("shows the rate limit's wait and points to the password reset", async () => {
    stubFetch({
      "POST /api/auth/sign-in": () => ({
        status: 429,
        body: {
          error: {
            code: "rate_limited",
            message: "Too many attempts: for your security, try again in 15 minutes.",
          },
        },
      }),
    });
    renderWithApp(<SignInPage />, { me: null });
    await userEvent.type(screen.getByLabelText("E-mail"), "lead@example.test");
    await userEvent.type(screen.getByLabelText("Password"), "a password");
    await userEvent.click(screen.getByRole("button", { name: "Sign in" }));
    const alert = await screen.findByRole("alert");
    expect(alert).toHaveTextContent("try again in 15 minutes");
    expect(alert).toHaveTextContent("reset it instead");
    expect(alert).not.toHaveTextContent("900 seconds");
  });
});
