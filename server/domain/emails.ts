/** The text of the e-mails Spreadsight sends. Plain text first; a small HTML twin. */
import { ROLE_LABELS, type Role } from "@/contracts/common";
import type { OutgoingMail } from "../mail/mailer";

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function invitationMail(args: {
  to: string;
  teamId: string;
  teamName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
}): OutgoingMail {
  const role = ROLE_LABELS[args.role];
  const until = args.expiresAt.toISOString().slice(0, 16).replace("T", " ");
  const text = [
    `${args.inviterName} has invited you to join ${args.teamName} on Spreadsight as ${role}.`,
    "",
    "Open this link to choose your name and password (it works once):",
    args.link,
    "",
    `The link expires on ${until} UTC. If you did not expect this, ignore this message.`,
  ].join("\n");
  const html =
    `<p>${escapeHtml(args.inviterName)} has invited you to join <strong>${escapeHtml(args.teamName)}</strong> ` +
    `on Spreadsight as ${escapeHtml(role)}.</p>` +
    `<p><a href="${escapeHtml(args.link)}">Accept the invitation</a> (the link works once and ` +
    `expires on ${until} UTC).</p><p>If you did not expect this, ignore this message.</p>`;
  return {
    to: args.to,
    subject: `Join ${args.teamName} on Spreadsight`,
    text,
    html,
    teamId: args.teamId,
  };
}

export function passwordResetMail(args: {
  to: string;
  teamId: string | null;
  name: string;
  link: string;
}): OutgoingMail {
  const text = [
    `Hello ${args.name},`,
    "",
    "Someone asked to reset your Spreadsight password. Open this link within one hour to",
    "choose a new one (it works once):",
    args.link,
    "",
    "If it was not you, ignore this message: your password stays as it is.",
  ].join("\n");
  const html =
    `<p>Hello ${escapeHtml(args.name)},</p><p>Someone asked to reset your Spreadsight password. ` +
    `<a href="${escapeHtml(args.link)}">Choose a new password</a> within one hour (the link works once).</p>` +
    `<p>If it was not you, ignore this message: your password stays as it is.</p>`;
  return {
    to: args.to,
    subject: "Reset your Spreadsight password",
    text,
    html,
    teamId: args.teamId,
  };
}
