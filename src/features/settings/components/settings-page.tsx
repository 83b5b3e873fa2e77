import { useMe } from "@/features/auth/api/me";
import { useUpdatePreferences } from "@/features/auth/api/preferences";
import { Card, ErrorNotice, Notice, PageHeader } from "@/components/feedback";
import type { Preferences } from "@/contracts/auth";
import { NotificationSettingsCard } from "@/features/inbox";
import { TeamSettingsCard } from "@/features/team/components/team-settings-card";
import { paths } from "@/app/paths";
import { Link } from "react-router-dom";

const UNIT_CHOICES: Array<{ value: Preferences["units"]; label: string; detail: string }> = [
  { value: "metric", label: "Metres", detail: "m, m/s, ms" },
  { value: "imperial", label: "Feet", detail: "ft, ft/s, ms" },
];

export function SettingsPage() {
  const { data: me } = useMe();
  const update = useUpdatePreferences();
  if (!me) return null;
  return (
    <div>
      <PageHeader title="Settings" subtitle="Preferences that follow you on every device." />
      <Card className="max-w-xl">
        <fieldset>
          <legend className="font-semibold text-ink">Units on screen</legend>
          <p className="mt-1 text-sm text-ink-soft">
            Plans are stored in SI units; this only changes how lengths and velocities are shown and
            typed.
          </p>
          <div className="mt-3 flex flex-col gap-2">
            {UNIT_CHOICES.map((choice) => (
              <label key={choice.value} className="flex items-center gap-2 text-sm">
                <input
                  type="radio"
                  name="units"
                  value={choice.value}
                  checked={me.preferences.units === choice.value}
                  disabled={update.isPending}
                  onChange={() => update.mutate({ units: choice.value })}
                />
                <span className="font-medium">{choice.label}</span>
                <span className="font-mono text-xs text-ink-soft">{choice.detail}</span>
              </label>
            ))}
          </div>
        </fieldset>
        <div className="mt-3">
          {update.isError ? (
            <ErrorNotice error={update.error} title="Could not save the preference" />
          ) : null}
          {update.isSuccess ? <Notice tone="success">Saved.</Notice> : null}
        </div>
      </Card>
      <div className="mt-6">
        <NotificationSettingsCard />
      </div>
      {/* The team's recording equipment: everyone may read it here (the Team page is the
          admin's, where it is edited). */}
      <div className="mt-6 max-w-xl">
        {me.role === "admin" ? (
          <Card>
            <h2 className="mb-1 font-semibold text-ink">Recording equipment</h2>
            <p className="text-sm text-ink-soft">
              The team’s seismograph channel count is set on the{" "}
              <Link to={paths.team} className="text-ink underline">
                Team page
              </Link>
              .
            </p>
          </Card>
        ) : (
          <TeamSettingsCard role={me.role} />
        )}
      </div>
    </div>
  );
}
