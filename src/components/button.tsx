import type { ButtonHTMLAttributes } from "react";

type Variant = "primary" | "secondary" | "quiet" | "danger";

const styles: Record<Variant, string> = {
  primary: "bg-ink text-card hover:bg-ink-deep disabled:bg-ink-faint",
  secondary: "border border-ink-soft text-ink bg-card hover:bg-paper-deep disabled:text-ink-faint",
  quiet: "text-ink hover:bg-paper-deep disabled:text-ink-faint",
  danger: "border border-brick text-brick bg-card hover:bg-brick-soft disabled:opacity-60",
};

export function Button({
  variant = "primary",
  className = "",
  type = "button",
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type={type}
      className={`inline-flex items-center justify-center gap-1.5 rounded-md px-3.5 py-1.5 text-sm font-medium transition-colors disabled:cursor-not-allowed ${styles[variant]} ${className}`}
      {...props}
    />
  );
}
