/** Every entity class, for the DataSource. Later features append theirs here. */
import { Attachment } from "./attachment";
import { AuditEvent } from "./audit-event";
import { Invitation } from "./invitation";
import { MailMessage } from "./mail-message";
import { MailOutboxRow } from "./mail-outbox";
import { Membership } from "./membership";
import { PlanComment } from "./comment";
import { PlanNotification } from "./notification";
import { NotificationSetting } from "./notification-setting";
import { PasswordReset } from "./password-reset";
import { PickSet } from "./pick-set";
import { Plan } from "./plan";
import { PlanRevision } from "./plan-revision";
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
  MailOutboxRow,
  Membership,
  PasswordReset,
  Session,
  Site,
  Team,
  User,
  UserPreference,
  Plan,
  PlanRevision,
  PlanComment,
  PlanNotification,
  NotificationSetting,
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
  MailOutboxRow,
  UserPreference,
  Plan,
  PlanRevision,
  PlanComment,
  PlanNotification,
  NotificationSetting,
  Attachment,
  PickSet,
];
