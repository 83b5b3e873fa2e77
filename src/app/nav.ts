import type { Role } from "@/contracts/common";
import type { MeResponse } from "@/contracts/auth";
import { paths } from "./paths";

export interface NavItem {
  to: string;
  label: string;
  /** Whether the signed-in user sees this item. */
  visible: (me: MeResponse) => boolean;
}

const anyRole = () => true;
const roles =
  (...allowed: Role[]) =>
  (me: MeResponse) =>
    allowed.includes(me.role);

/** The main navigation, in display order. Features add their entries here. */
export const navItems: NavItem[] = [
  { to: paths.sites, label: "Sites", visible: anyRole },
  { to: paths.activity, label: "Activity", visible: roles("admin", "lead", "reviewer") },
  { to: paths.team, label: "Team", visible: roles("admin") },
  {
    to: paths.mailbox,
    label: "Mailbox",
    visible: (me) => me.role === "admin" && (me.mailbox ?? me.demo),
  },
  { to: paths.settings, label: "Settings", visible: anyRole },
];
