import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Link, Navigate, useNavigate, useSearchParams } from "react-router-dom";
import { signInSchema, type SignInInput } from "@/contracts/auth";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { ErrorNotice, Notice } from "@/components/feedback";
import { paths } from "@/app/paths";
import { useSignIn } from "../api/sign-in";
import { useMe } from "../api/me";
import { AuthFrame } from "./auth-frame";
import { friendlierRateLimit } from "./link-problem";
import { safeNext } from "../safe-next";

/** Only same-app paths are followed after sign-in. */

export function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const signIn = useSignIn();
  const form = useForm<SignInInput>({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: "", password: "" },
  });
  const next = safeNext(params.get("next"));

  if (me.data) return <Navigate to={next} replace />;

  const onSubmit = form.handleSubmit((values) =>
    signIn.mutate(values, { onSuccess: () => navigate(next, { replace: true }) }),
  );

  return (
    <AuthFrame title="Sign in">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {params.get("ended") === "1" ? (
          <Notice tone="caution">
            Your session has ended (signed out elsewhere, or the password was changed). Sign in
            again to carry on where you were.
          </Notice>
        ) : null}
        <Field label="E-mail" error={form.formState.errors.email?.message}>
          <input
            className="field-input"
            type="email"
            autoComplete="username"
            {...form.register("email")}
          />
        </Field>
        <Field label="Password" error={form.formState.errors.password?.message}>
          <input
            className="field-input"
            type="password"
            autoComplete="current-password"
            {...form.register("password")}
          />
        </Field>
        {signIn.isError ? (
          <ErrorNotice error={friendlierRateLimit(signIn.error)} title="Could not sign in" />
        ) : null}
        <Button type="submit" disabled={signIn.isPending}>
          {signIn.isPending ? "Signing in…" : "Sign in"}
        </Button>
        <Link to={paths.forgot} className="text-sm text-ink underline">
          Forgot your password?
        </Link>
      </form>
    </AuthFrame>
  );
}
