// Public surface of @loopyard/core. Every export is named here; types are kept apart.

export { MAX_PLANT_ORDER, transferFunctionSchema } from "./plants/transfer-function.js";
export { plantModelSchema } from "./plants/plant.js";
export { plantInputSchema } from "./schemas/plant-input.js";
export { CRITERION_IDS } from "./criteria/criterion-id.js";
export {
  MAX_SWEEP_CANDIDATES,
  MAX_SIMULATION_SAMPLES,
  parameterRangeSchema,
  derivativeFilterSchema,
  sweepInputSchema,
} from "./sweeps/sweep-input.js";
export { ROLES, hasRole } from "./api/roles.js";

export type { TransferFunctionPlant } from "./plants/transfer-function.js";
export type { Plant, PlantKind } from "./plants/plant.js";
export type { PlantInput, PlantInputParsed } from "./schemas/plant-input.js";
export type { PidController } from "./controllers/pid.js";
export type { CriterionId } from "./criteria/criterion-id.js";
export type { ParameterRange, DerivativeFilter, SweepInput, SweepInputParsed } from "./sweeps/sweep-input.js";
export type { Role } from "./api/roles.js";
export type { Complex } from "./linear-algebra/complex.js";
export type * from "./api/dto.js";
