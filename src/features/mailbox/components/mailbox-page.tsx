import { useState } from "react";
import { Card, EmptyState, ErrorNotice, Loading, Notice, PageHeader } from "@/components/feedback";
import { useMailbox } from "../api/mailbox";

const timeFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** Splits plain text into text and links so the demo mailbox's links can be followed. */
export function linkify(text: string): Array<{ kind: "text" | "link"; value: string }> {
  const parts: Array<{ kind: "text" | "link"; value: string }> = [];
  const pattern = /https?:\/\/[^\s<>"]+/g;
  let last = 0;
  for (const match of text.matchAll(pattern)) {
    const index = match.index ?? 0;
    if (index > last) parts.push({ kind: "text", value: text.slice(last, index) });
    parts.push({ kind: "link", value: match[0] });
    last = index + match[0].length;
  }
  if (last < text.length) parts.push({ kind: "text", value: text.slice(last) });
  return parts;
}

export function MailboxPage() {
  const mailbox = useMailbox();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const selected = mailbox.data?.find((m) => m.id === selectedId) ?? mailbox.data?.[0] ?? null;

  return (
    <div>
      <PageHeader
        title="Mailbox"
        subtitle="Demo mode: every e-mail the app sends is caught here instead of leaving the machine."
      />
      <Notice>
        Configure SMTP_URL to deliver real e-mail; this page is only there while the built-in
        catcher runs.
      </Notice>
      <div className="mt-6 grid gap-6 lg:grid-cols-[1fr_2fr]">
        <Card>
          {mailbox.isPending ? <Loading /> : null}
          {mailbox.isError ? (
            <ErrorNotice error={mailbox.error} onRetry={() => mailbox.refetch()} />
          ) : null}
          {mailbox.data && mailbox.data.length === 0 ? (
            <EmptyState title="No messages yet" />
          ) : null}
          <ul aria-label="Messages" className="flex flex-col divide-y divide-rule/60">
            {mailbox.data?.map((message) => (
              <li key={message.id}>
                <button
                  type="button"
                  onClick={() => setSelectedId(message.id)}
                  aria-current={selected?.id === message.id}
                  className={`w-full px-2 py-2 text-left text-sm ${selected?.id === message.id ? "bg-paper-deep" : "hover:bg-paper"}`}
                >
                  <span className="block font-medium text-ink-deep">{message.subject}</span>
                  <span className="block font-mono text-xs text-ink-soft">
                    to {message.to.join(", ")} · {timeFormat.format(new Date(message.receivedAt))}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        </Card>
        <Card>
          {selected ? (
            <article aria-label="Message">
              <h2 className="text-lg font-semibold text-ink-deep">{selected.subject}</h2>
              <p className="mt-1 font-mono text-xs text-ink-soft">
                From {selected.from} to {selected.to.join(", ")}
              </p>
              <div className="mt-4 text-sm leading-relaxed whitespace-pre-wrap">
                {linkify(selected.text).map((part, i) =>
                  part.kind === "link" ? (
                    <a key={i} href={part.value} className="break-all text-ink underline">
                      {part.value}
                    </a>
                  ) : (
                    <span key={i}>{part.value}</span>
                  ),
                )}
              </div>
            </article>
          ) : (
            <p className="text-sm text-ink-soft">Select a message to read it.</p>
          )}
        </Card>
      </div>
    </div>
  );
}
