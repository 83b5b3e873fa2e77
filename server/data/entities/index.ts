/** Every entity class, for the DataSource. Later features append theirs here. */
import { Attachment } from "./attachment";
import { AuditEvent } from "./audit-event";
import { Invitation } from "./invitation";
import { MailMessage } from "./mail-message";
import { Membership } from "./membership";
import { PasswordReset } from "./password-reset";
import { PickSet } from "./pick-set";
import { Session } from "./session";
import { Site } from "./site";
import { Team } from "./team";
import { User } from "./user";
import { UserPreference } from "./user-preference";

export {
  Attachment,
  PickSet,
  AuditEvent,
  Invitation,
  MailMessage,
  Membership,
  PasswordReset,
  Session,
  Site,
  Team,
  User,
  UserPreference,
};

export const entities = [
  Team,
  User,
  Membership,
  Session,
  Site,
  AuditEvent,
  Invitation,
  PasswordReset,
  MailMessage,
  UserPreference,
  Attachment,
  PickSet,
];
