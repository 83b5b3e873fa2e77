import { forwardRef, useId, type InputHTMLAttributes, type ReactNode } from "react";

/**
 * A compact input for a table cell: its accessible name comes from `label` (the column and
 * row), its inline error sits under it and is announced with it.
 */
export const CellInput = forwardRef<
  HTMLInputElement,
  InputHTMLAttributes<HTMLInputElement> & { label: string; error?: string; unit?: string }
>(function CellInput({ label, error, unit, className = "", ...props }, ref) {
  const id = useId();
  return (
    <div className="flex min-w-0 flex-col gap-0.5">
      <div className="flex items-center gap-1">
        <input
          ref={ref}
          aria-label={label}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error` : undefined}
          className={`field-input px-2! py-1! font-mono text-sm! ${className}`}
          {...props}
        />
        {unit ? <span className="text-xs whitespace-nowrap text-ink-soft">{unit}</span> : null}
      </div>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-xs leading-snug font-medium text-brick">
          {error}
        </p>
      ) : null}
    </div>
  );
});

/** A column's heading repeated inside its cell on a phone, where the table head is hidden. */
export function PhoneLabel({ children }: { children: ReactNode }) {
  return (
    <span
      aria-hidden="true"
      className="mb-0.5 block text-[0.65rem] font-semibold tracking-wide text-ink-soft uppercase sm:hidden"
    >
      {children}
    </span>
  );
}
