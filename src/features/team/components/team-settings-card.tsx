import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { can, type Role } from "@/contracts/common";
import {
  MAX_SEISMOGRAPH_CHANNELS,
  MIN_SEISMOGRAPH_CHANNELS,
  type TeamSettings,
} from "@/contracts/team";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { Card, ErrorNotice, Loading, Notice } from "@/components/feedback";
import { useTeamSettings, useUpdateTeamSettings } from "../api/team-settings";

const RANGE = `a whole number from ${MIN_SEISMOGRAPH_CHANNELS} to ${MAX_SEISMOGRAPH_CHANNELS}`;

/** The form's own wording of the contract's rule (whole channels, 2…1024). */
const formSchema = z.object({
  seismographChannels: z
    .number({ error: `Seismograph channels must be ${RANGE}` })
    .int(`Seismograph channels must be ${RANGE}`)
    .min(MIN_SEISMOGRAPH_CHANNELS, `Seismograph channels must be ${RANGE}`)
    .max(MAX_SEISMOGRAPH_CHANNELS, `Seismograph channels must be ${RANGE}`),
});

const EXPLAINED =
  "Channels the team’s seismograph records at once. In every plan the designer’s Apply choices flag a spread that needs more, with the number of lays a roll-along takes.";

/**
 * Recording equipment: the team's seismograph channel count. An admin edits it (design.md: the
 * admin runs the team); every other role sees it read-only.
 */
export function TeamSettingsCard({ role }: { role: Role }) {
  const settings = useTeamSettings();
  const editable = can.manageTeam(role);
  return (
    <Card>
      <h2 className="mb-3 font-semibold text-ink">Recording equipment</h2>
      {settings.isPending ? <Loading /> : null}
      {settings.isError ? (
        <ErrorNotice error={settings.error} onRetry={() => settings.refetch()} />
      ) : null}
      {settings.data && editable ? <ChannelsForm settings={settings.data} /> : null}
      {settings.data && !editable ? (
        <div className="flex flex-col gap-1 text-sm">
          <p>
            Seismograph channels:{" "}
            <span className="font-mono font-medium text-ink-deep">
              {settings.data.seismographChannels}
            </span>
          </p>
          <p className="text-xs text-ink-soft">{EXPLAINED} Only an admin changes it.</p>
        </div>
      ) : null}
    </Card>
  );
}

function ChannelsForm({ settings }: { settings: TeamSettings }) {
  const update = useUpdateTeamSettings();
  const [saved, setSaved] = useState<number | null>(null);
  const form = useForm<z.infer<typeof formSchema>>({
    resolver: zodResolver(formSchema),
    defaultValues: { seismographChannels: settings.seismographChannels },
  });
  return (
    <form
      noValidate
      className="flex flex-col gap-3"
      onSubmit={form.handleSubmit((values) => {
        setSaved(null);
        update.mutate(values, {
          onSuccess: (answer) => {
            form.reset({ seismographChannels: answer.seismographChannels });
            setSaved(answer.seismographChannels);
          },
        });
      })}
    >
      <Field
        label="Seismograph channels"
        hint={EXPLAINED}
        error={form.formState.errors.seismographChannels?.message}
      >
        <input
          className="field-input w-28 font-mono"
          type="number"
          inputMode="numeric"
          min={MIN_SEISMOGRAPH_CHANNELS}
          max={MAX_SEISMOGRAPH_CHANNELS}
          step={1}
          {...form.register("seismographChannels", {
            valueAsNumber: true,
            onChange: () => setSaved(null),
          })}
        />
      </Field>
      {update.isError ? (
        <ErrorNotice error={update.error} title="Could not save the channel count" />
      ) : null}
      {saved !== null ? (
        <Notice tone="success">
          Saved: the team’s seismograph records {saved} channels. Every plan’s Apply choices use it
          from now on.
        </Notice>
      ) : null}
      <Button type="submit" disabled={update.isPending} className="self-start">
        Save channel count
      </Button>
    </form>
  );
}
