/** The field feature's public surface: the Field check screen and the plan import button. */
export { FieldCheckPage } from "./components/field-check-page";
export { ImportPlanButton } from "./components/import-plan-button";
