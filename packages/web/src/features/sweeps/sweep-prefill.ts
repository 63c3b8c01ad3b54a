import type { SweepDetailDto } from "@loopyard/core";
import { formatOverrides, fromAggregate, fromDesign } from "./sweep-design-values.js";
import { defaultSweepForm, type AntiWindupChoice, type SweepFormValues } from "./sweep-form-values.js";
import { parameterKey } from "./structure-choices.js";

/**
 * The sweep form filled from a stored sweep ("Run again with changes"): the definition's plant
 * revision and family, structure, ranges (fixed values as count-1 ranges), filter, sampling,
 * anti-windup, scenario, criteria and options, design and aggregate. The name gets " (again)".
 * The stored weight of ‖W·S‖∞ is kept as num/den only, so the form starts from its default preset.
 */
export function formFromSweep(sweep: Pick<SweepDetailDto, "name" | "definition" | "family">): SweepFormValues {
  const d = sweep.definition;
  const form = defaultSweepForm(d.plantRevisionId, d.scenario.horizon);
  form.name = `${sweep.name} (again)`.slice(0, 120);
  form.structure = d.structure;
  for (const [name, r] of Object.entries(d.ranges)) {
    form.ranges[parameterKey(name)] = { min: r.min, max: r.max, count: r.count ?? 1, scale: r.scale ?? "linear" };
  }
  for (const [name, value] of Object.entries(d.fixed ?? {})) {
    form.ranges[parameterKey(name)] = { min: value, max: value, count: 1, scale: "linear" };
  }
  if (d.filter) form.filter = d.filter.mode === "ratio" ? { ...form.filter, mode: "ratio", n: d.filter.n } : { ...form.filter, mode: "fixed", tf: d.filter.tf };
  if (d.sampleTime !== undefined) {
    form.sampled = true;
    form.sampleTime = d.sampleTime;
  }
  const aw = d.antiWindup;
  const kind: AntiWindupChoice = !aw ? "default" : aw.kind === "back-calculation" ? (aw.tt === undefined ? "default" : "back-calculation") : aw.kind;
  form.antiWindup = { kind, tt: aw?.kind === "back-calculation" && aw.tt !== undefined ? aw.tt : form.antiWindup.tt };
  const s = d.scenario;
  form.scenario = {
    kind: s.kind,
    horizon: s.horizon,
    dt: s.dt,
    setpoint: s.setpoint ?? 1,
    load: s.load ? { size: s.load.size, time: s.load.time } : form.scenario.load,
    noiseOn: s.noise !== undefined,
    noise: s.noise ? { sd: s.noise.sd, seed: s.noise.seed } : form.scenario.noise,
  };
  form.criteria = [...d.criteria];
  const o = d.criterionOptions;
  form.criterionOptions = {
    ...form.criterionOptions,
    q: o?.q ?? form.criterionOptions.q,
    r: o?.r ?? form.criterionOptions.r,
    settlingBand: o?.settlingBand ?? form.criterionOptions.settlingBand,
    infiniteHorizon: o?.horizon === "infinite",
    weight: performancePreset(o?.weight) ?? form.criterionOptions.weight,
  };
  const variants = d.family?.variants ?? [];
  if (variants.length > 0) {
    form.firstVariant = { label: variants[0]?.label ?? "", parameters: formatOverrides(variants[0]?.parameters) };
    form.variants = variants.slice(1).map((v, i) => ({
      plantId: sweep.family?.[i + 1]?.plantId ?? "",
      plantRevisionId: v.plantRevisionId,
      label: v.label ?? "",
      // A stored label other than the plant's name was typed; the plant's own name keeps following it.
      labelTyped: v.label !== undefined && v.label !== sweep.family?.[i + 1]?.plantName,
      parameters: formatOverrides(v.parameters),
    }));
  }
  form.design = fromDesign(d.design, d.criteria[0] ?? "ise");
  form.aggregate = fromAggregate(d.aggregate);
  return form;
}

/**
 * M, ωB, A of a stored weight that has the performance preset's form W = (s/M + ωB)/(s + ωB·A)
 * (num = [1/M, ωB], den = [1, ωB·A]; the schema stores the preset as num/den), or null for any other W.
 */
export function performancePreset(weight: { num: readonly number[]; den: readonly number[] } | undefined): { M: number; omegaB: number; A: number } | null {
  if (!weight || weight.num.length !== 2 || weight.den.length !== 2 || weight.den[0] !== 1) return null;
  const [a, omegaB] = weight.num as [number, number];
  if (!(a > 0) || !(omegaB > 0)) return null;
  return { M: 1 / a, omegaB, A: (weight.den[1] as number) / omegaB };
}
