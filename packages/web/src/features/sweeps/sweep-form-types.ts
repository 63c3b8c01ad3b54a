import type { FieldErrors, UseFormRegister } from "react-hook-form";
import type { SweepFormValues } from "./sweep-form-values.js";

/** What each section of the sweep form receives. */
export interface SweepSectionProps {
  register: UseFormRegister<SweepFormValues>;
  errors: FieldErrors<SweepFormValues>;
}
