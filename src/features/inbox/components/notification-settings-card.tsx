import type { NotificationKind, NotificationSettings } from "@/contracts/plans";
import { Card, ErrorNotice, Loading, Notice } from "@/components/feedback";
import { useNotificationSettings, useSaveNotificationSettings } from "../api/notification-settings";

const CHOICES: Array<{ kind: NotificationKind; label: string; detail: string }> = [
  {
    kind: "submitted",
    label: "A plan is submitted for review",
    detail: "reviewers and admins get these",
  },
  {
    kind: "decision",
    label: "A decision on my plan",
    detail: "signed off for mobilisation, or returned to the lead with notes",
  },
  { kind: "mention", label: "Someone mentions me", detail: "@your name in a comment" },
  {
    kind: "reply",
    label: "Someone replies to a note I took part in",
    detail: "review notes on plans",
  },
];

/** Which review events also arrive by e-mail (the inbox always shows them). */
export function NotificationSettingsCard() {
  const settings = useNotificationSettings();
  const save = useSaveNotificationSettings();
  const current: NotificationSettings | undefined = save.isPending ? save.variables : settings.data;
  return (
    <Card className="max-w-xl">
      <fieldset>
        <legend className="font-semibold text-ink">E-mail notifications</legend>
        <p className="mt-1 text-sm text-ink-soft">
          Your inbox in Spreadsight always lists these events; choose which ones also come by
          e-mail.
        </p>
        {settings.isPending ? <Loading /> : null}
        {settings.isError ? (
          <ErrorNotice
            error={settings.error}
            title="Cannot load your notification settings"
            onRetry={() => settings.refetch()}
          />
        ) : null}
        {current ? (
          <div className="mt-3 flex flex-col gap-2">
            {CHOICES.map((choice) => (
              <label key={choice.kind} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  checked={current[choice.kind]}
                  disabled={save.isPending}
                  onChange={(e) => save.mutate({ ...current, [choice.kind]: e.target.checked })}
                />
                <span className="font-medium">{choice.label}</span>
                <span className="text-xs text-ink-soft">{choice.detail}</span>
              </label>
            ))}
          </div>
        ) : null}
      </fieldset>
      <div className="mt-3">
        {save.isError ? (
          <ErrorNotice error={save.error} title="Could not save the notification settings" />
        ) : null}
        {save.isSuccess ? <Notice tone="success">Saved.</Notice> : null}
      </div>
    </Card>
  );
}
