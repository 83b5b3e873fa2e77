import { Link } from "react-router-dom";
import { ApiError, errorMessage } from "@/lib/api-client";
import { paths } from "@/app/paths";

/** Why an e-mailed link (password reset or invitation) can no longer be used, in plain words. */
const LINK_WORDS: Record<string, string> = {
  reset_not_found:
    "This reset link is not one we sent, or a newer one replaced it. Ask for a new link.",
  reset_used: "This reset link has already been used: each link works once. Ask for a new link.",
  reset_expired: "This reset link has expired: links work for one hour. Ask for a new link.",
  invitation_not_found:
    "This invitation link is not one we sent, or a newer invitation replaced it. Ask your team's admin to invite you again.",
  invitation_used:
    "This invitation has already been accepted. Sign in with the address and password chosen then.",
  invitation_revoked: "This invitation was withdrawn. Ask your team's admin to invite you again.",
  invitation_expired:
    "This invitation has expired: invitations work for 7 days. Ask your team's admin to invite you again.",
};

/** The server's answer when the link's token itself is wrong (mistyped or cut-off link). */
const isBadToken = (error: ApiError) => error.code === "invalid_input" && !!error.fields?.token;

/** True when the error says the link itself is unusable (rather than, say, a short password). */
export function isLinkProblem(error: unknown): error is ApiError {
  return error instanceof ApiError && (error.code in LINK_WORDS || isBadToken(error));
}

/**
 * Explains an unusable reset or invitation link and offers the way on: a new reset link, or
 * sign in when an invitation was already accepted.
 */
export function LinkProblem({ error, kind }: { error: unknown; kind: "reset" | "invitation" }) {
  const message =
    error instanceof ApiError && error.code in LINK_WORDS
      ? LINK_WORDS[error.code]
      : error instanceof ApiError && isBadToken(error)
        ? `This ${kind === "reset" ? "reset" : "invitation"} link is incomplete or mistyped: open it again from the e-mail, or copy the whole address.`
        : errorMessage(error);
  const used = error instanceof ApiError && error.code === "invitation_used";
  return (
    <div className="flex flex-col gap-3">
      <div
        role="alert"
        className="rounded-md border border-brick/40 bg-brick-soft px-4 py-3 text-sm text-brick"
      >
        <p className="font-semibold">
          {kind === "reset" ? "This reset link cannot be used" : "This invitation cannot be used"}
        </p>
        <p className="mt-0.5">{message}</p>
      </div>
      {kind === "reset" ? (
        <Link to={paths.forgot} className="text-sm text-ink underline">
          Ask for a new reset link
        </Link>
      ) : null}
      <Link to={paths.signIn} className="text-sm text-ink underline">
        {used ? "Sign in" : "Back to sign in"}
      </Link>
    </div>
  );
}

/**
 * A rate-limit refusal (the server words the wait) with what to do meanwhile; any other
 * error is returned as it is.
 */
export function friendlierRateLimit(error: unknown): unknown {
  if (!(error instanceof ApiError) || error.code !== "rate_limited") return error;
  return new Error(`${error.message} If you have forgotten the password, reset it instead.`);
}
