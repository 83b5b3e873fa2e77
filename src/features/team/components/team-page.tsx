import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { inviteSchema, type InviteInput } from "@/contracts/auth";
import { ROLES, ROLE_LABELS, type Role } from "@/contracts/common";
import { useMe } from "@/features/auth/api/me";
import { Field } from "@/components/field";
import { Button } from "@/components/button";
import { Card, EmptyState, ErrorNotice, Loading, Notice, PageHeader } from "@/components/feedback";
import {
  useChangeRole,
  useInvitations,
  useInvite,
  useMembers,
  useRemoveMember,
  useRevokeInvitation,
} from "../api/team";
import { TeamSettingsCard } from "./team-settings-card";

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium" });

const ROLE_DUTIES: Record<Role, string> = {
  admin: "everything a lead may, plus the team",
  lead: "creates sites and plans, submits for review",
  reviewer: "reads, writes review notes, signs plans off or returns them with notes",
  trainee: "reads team plans, works in a personal sandbox",
};

/** What a member of each role does, as a sentence's predicate after their name. */
const ROLE_DOES: Record<Role, string> = {
  admin: "does everything a survey lead may and runs the team",
  lead: "creates sites and plans and submits them for review",
  reviewer: "reads plans, writes review notes, and signs plans off or returns them with notes",
  trainee: "reads team plans and works in a personal sandbox",
};

export function TeamPage() {
  const { data: me } = useMe();
  const members = useMembers();
  const invitations = useInvitations();
  const changeRole = useChangeRole();
  const removeMember = useRemoveMember();
  const revoke = useRevokeInvitation();
  const [confirmRemove, setConfirmRemove] = useState<string | null>(null);
  // A role change waits for confirmation, then says what happened (issue 14, item 9).
  const [pendingRole, setPendingRole] = useState<{ userId: string; role: Role } | null>(null);
  const [roleChanged, setRoleChanged] = useState<string | null>(null);
  const pendingMember = members.data?.find((m) => m.userId === pendingRole?.userId);
  const confirmRole = () => {
    if (!pendingRole || !pendingMember) return;
    const { role } = pendingRole;
    const name = pendingMember.name;
    changeRole.mutate(pendingRole, {
      onSuccess: () =>
        setRoleChanged(
          `${name} is now ${ROLE_LABELS[role].toLowerCase()}: ${ROLE_DUTIES[role]}. The change applies from their next page load.`,
        ),
      onSettled: () => setPendingRole(null),
    });
  };

  return (
    <div>
      <PageHeader
        title="Team"
        subtitle={me ? `Members of ${me.team.name} and the invitations still open.` : undefined}
      />
      <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
        <Card>
          <h2 className="mb-3 font-semibold text-ink">Members</h2>
          {members.isPending ? <Loading /> : null}
          {members.isError ? (
            <ErrorNotice error={members.error} onRetry={() => members.refetch()} />
          ) : null}
          {changeRole.isError ? (
            <ErrorNotice error={changeRole.error} title="Could not change the role" />
          ) : null}
          {roleChanged && !pendingRole ? <Notice tone="success">{roleChanged}</Notice> : null}
          {pendingRole && pendingMember ? (
            <div
              role="group"
              aria-label="Confirm the role change"
              className="mb-3 flex flex-col gap-2 rounded-md border border-ochre/60 bg-ochre-soft/60 px-3 py-2 text-sm text-ink-deep"
            >
              <p>
                Change {pendingMember.name}’s role from {ROLE_LABELS[pendingMember.role]} to{" "}
                {ROLE_LABELS[pendingRole.role]}? As {ROLE_LABELS[pendingRole.role].toLowerCase()},{" "}
                {pendingMember.name} {ROLE_DOES[pendingRole.role]}.
              </p>
              <span className="flex flex-wrap gap-2">
                <Button disabled={changeRole.isPending} onClick={confirmRole}>
                  Change role
                </Button>
                <Button variant="quiet" onClick={() => setPendingRole(null)}>
                  Keep {ROLE_LABELS[pendingMember.role]}
                </Button>
              </span>
            </div>
          ) : null}
          {removeMember.isError ? (
            <ErrorNotice error={removeMember.error} title="Could not remove the member" />
          ) : null}
          {members.data ? (
            <table className="w-full text-left text-sm">
              <thead className="border-b border-rule text-xs tracking-wide text-ink-soft uppercase">
                <tr>
                  <th className="py-2 font-medium">Name</th>
                  <th className="hidden py-2 font-medium sm:table-cell">E-mail</th>
                  <th className="py-2 font-medium">Role</th>
                  <th className="hidden py-2 font-medium sm:table-cell">Joined</th>
                  <th className="py-2 font-medium">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {members.data.map((member) => {
                  const isSelf = member.userId === me?.user.id;
                  return (
                    <tr key={member.userId} className="border-b border-rule/60">
                      <td className="py-2 font-medium text-ink-deep">
                        {member.name}
                        {isSelf ? <span className="ml-1 text-xs text-ink-soft">(you)</span> : null}
                        <span className="block font-mono text-xs font-normal break-all text-ink-soft sm:hidden">
                          {member.email}
                        </span>
                      </td>
                      <td className="hidden py-2 font-mono text-xs sm:table-cell">
                        {member.email}
                      </td>
                      <td className="py-2">
                        <select
                          aria-label={`Role of ${member.name}`}
                          className="field-input min-w-32 py-1"
                          value={
                            pendingRole?.userId === member.userId ? pendingRole.role : member.role
                          }
                          disabled={changeRole.isPending}
                          onChange={(e) => {
                            const role = e.target.value as Role;
                            setRoleChanged(null);
                            changeRole.reset();
                            setPendingRole(
                              role === member.role ? null : { userId: member.userId, role },
                            );
                          }}
                        >
                          {ROLES.map((role) => (
                            <option key={role} value={role}>
                              {ROLE_LABELS[role]}
                            </option>
                          ))}
                        </select>
                      </td>
                      <td className="hidden py-2 text-ink-soft sm:table-cell">
                        {dateFormat.format(new Date(member.joinedAt))}
                      </td>
                      <td className="py-2 text-right">
                        {isSelf ? null : confirmRemove === member.userId ? (
                          <span className="flex flex-wrap justify-end gap-1">
                            <Button
                              variant="danger"
                              onClick={() =>
                                removeMember.mutate(member.userId, {
                                  onSettled: () => setConfirmRemove(null),
                                })
                              }
                            >
                              Confirm removal
                            </Button>
                            <Button variant="quiet" onClick={() => setConfirmRemove(null)}>
                              Keep
                            </Button>
                          </span>
                        ) : (
                          <Button
                            variant="quiet"
                            onClick={() => setConfirmRemove(member.userId)}
                            aria-label={`Remove ${member.name}`}
                          >
                            Remove
                          </Button>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          ) : null}
        </Card>
        <div className="flex flex-col gap-6">
          {me ? <TeamSettingsCard role={me.role} /> : null}
          <InviteCard />
          <Card>
            <h2 className="mb-3 font-semibold text-ink">Open invitations</h2>
            {invitations.isPending ? <Loading /> : null}
            {invitations.isError ? <ErrorNotice error={invitations.error} /> : null}
            {invitations.data && invitations.data.length === 0 ? (
              <EmptyState title="No open invitations" />
            ) : null}
            <ul className="flex flex-col gap-2">
              {invitations.data?.map((inv) => (
                <li key={inv.id} className="flex items-center justify-between gap-2 text-sm">
                  <span>
                    <span className="font-mono text-xs">{inv.email}</span>
                    <span className="block text-xs text-ink-soft">
                      {ROLE_LABELS[inv.role]} · expires {dateFormat.format(new Date(inv.expiresAt))}
                    </span>
                  </span>
                  <Button
                    variant="quiet"
                    onClick={() => revoke.mutate(inv.id)}
                    aria-label={`Withdraw invitation for ${inv.email}`}
                  >
                    Withdraw
                  </Button>
                </li>
              ))}
            </ul>
          </Card>
        </div>
      </div>
    </div>
  );
}

function InviteCard() {
  const invite = useInvite();
  const form = useForm<InviteInput>({
    resolver: zodResolver(inviteSchema),
    defaultValues: { email: "", role: "lead" },
  });
  const role = form.watch("role");
  return (
    <Card>
      <h2 className="mb-3 font-semibold text-ink">Invite a member</h2>
      <form
        noValidate
        className="flex flex-col gap-3"
        onSubmit={form.handleSubmit((values) =>
          invite.mutate(values, { onSuccess: () => form.reset({ email: "", role: values.role }) }),
        )}
      >
        <Field label="E-mail" error={form.formState.errors.email?.message}>
          <input className="field-input" type="email" {...form.register("email")} />
        </Field>
        <Field
          label="Role"
          hint={ROLE_DUTIES[role as Role]}
          error={form.formState.errors.role?.message}
        >
          <select className="field-input" {...form.register("role")}>
            {ROLES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </Field>
        {invite.isError ? (
          <ErrorNotice error={invite.error} title="Could not send the invitation" />
        ) : null}
        {invite.isSuccess ? (
          <Notice tone="success">Invitation sent to {invite.data.email}.</Notice>
        ) : null}
        <Button type="submit" disabled={invite.isPending}>
          Send invitation
        </Button>
      </form>
    </Card>
  );
}
