/**
 * Every migration, oldest first. Migrations are hand-written; the app never synchronizes.
 * A later feature adds its file beside these and appends its class here.
 */
import { Foundation1733097600000 } from "./1733097600000-foundation";
import { PlansReview1733184000000 } from "./1733184000000-plans-review";
import { Field1733270400000 } from "./1733270400000-field";
import { RateLimits1796169600000 } from "./1796169600000-rate-limits";
import { ObjectStorage1796256000000 } from "./1796256000000-object-storage";
import { MailOutbox1796428800000 } from "./1796428800000-mail-outbox";
import { TeamSettings1796342400000 } from "./1796342400000-team-settings";
import { InterpretationChoices1796515200000 } from "./1796515200000-interpretation-choices";

export const migrations = [
  Foundation1733097600000,
  PlansReview1733184000000,
  Field1733270400000,
  RateLimits1796169600000,
  ObjectStorage1796256000000,
  TeamSettings1796342400000,
  MailOutbox1796428800000,
  InterpretationChoices1796515200000,
];
