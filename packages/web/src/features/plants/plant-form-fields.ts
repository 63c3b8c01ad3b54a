import type { FieldErrors, UseFormRegister } from "react-hook-form";
import type { PlantFormValues } from "./plant-form-values.js";

/** What each kind's field group receives from the plant form. */
export interface PlantFieldsProps {
  register: UseFormRegister<PlantFormValues>;
  errors: FieldErrors<PlantFormValues>;
}
