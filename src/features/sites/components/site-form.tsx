import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { siteCreateSchema, type SiteCreateInput } from "@/contracts/sites";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { ErrorNotice } from "@/components/feedback";

/** Create or rename a site. */
export function SiteForm({
  initial,
  submitLabel,
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  initial?: SiteCreateInput;
  submitLabel: string;
  pending: boolean;
  error: unknown;
  onSubmit: (values: SiteCreateInput) => void;
  onCancel: () => void;
}) {
  const form = useForm<SiteCreateInput>({
    resolver: zodResolver(siteCreateSchema),
    defaultValues: initial ?? { name: "", description: "" },
  });
  return (
    <form noValidate className="flex flex-col gap-4" onSubmit={form.handleSubmit(onSubmit)}>
      <Field label="Site name" error={form.formState.errors.name?.message}>
        <input className="field-input" {...form.register("name")} />
      </Field>
      <Field
        label="Ground conditions"
        hint="What the desk study and boreholes suggest: materials, water table, expected depth to rock."
        error={form.formState.errors.description?.message}
      >
        <textarea className="field-input min-h-24" {...form.register("description")} />
      </Field>
      {error ? <ErrorNotice error={error} title="Could not save the site" /> : null}
      <div className="flex gap-2">
        <Button type="submit" disabled={pending}>
          {submitLabel}
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
