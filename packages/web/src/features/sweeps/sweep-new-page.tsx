import { useEffect, useMemo, useRef, useState } from "react";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { useNavigate, useSearchParams } from "react-router";
import { MAX_SWEEP_CANDIDATES, type FamilyRevisionDto, type SweepInput } from "@loopyard/core";
import { useFamilies } from "../../api/use-families.js";
import { useSweep } from "../../api/use-sweeps.js";
import { usePlant, usePlants } from "../../api/use-plants.js";
import { useCreateSweep } from "../../api/use-sweeps.js";
import { Button, ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { RoleNote } from "../../components/role-note.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { Section } from "../../components/section.js";
import { applyServerErrors } from "../../forms/apply-server-errors.js";
import { plantKindShort } from "../plants/plant-kind.js";
import { hasLimits, plantStateNames } from "../plants/plant-summary.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { candidateCount, isWithinCandidateCap } from "./candidate-count.js";
import { DesignSection } from "./design-section.js";
import { FamilyVariants, OVERRIDES_HINT } from "./family-variants.js";
import { DESIGNS, designCandidateCount, drawsOwnCount, toAggregate, toFamily } from "./sweep-design-values.js";
import { SavedFamilyPicker } from "./saved-family-picker.js";
import { SaveAsFamily } from "./save-as-family.js";
import { formatCount } from "./sweep-progress.js";
import { formFromSweep } from "./sweep-prefill.js";
import { CriteriaSection } from "./criteria-section.js";
import { ScenarioSection } from "./scenario-section.js";
import { StructureSection } from "./structure-section.js";
import { STRUCTURES, parameterRows } from "./structure-choices.js";
import {
  SWEEP_FORM_FIELDS,
  defaultSweepForm,
  defaultTimeStep,
  formFieldOf,
  structureCounts,
  sweepFormResolver,
  type SweepFormValues,
} from "./sweep-form-values.js";

/** /w/:slug/sweeps/new — a grid over one controller structure's parameters on one plant revision. */
export function SweepNewPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const [params] = useSearchParams();
  const plants = usePlants(slug);
  const families = useFamilies(slug);
  // A saved family chosen instead of variants built here (null: build them here).
  const [savedFamily, setSavedFamily] = useState<FamilyRevisionDto | null>(null);
  const [plantId, setPlantId] = useState<string | undefined>(params.get("plant") ?? undefined);
  const plant = usePlant(slug, plantId);
  const create = useCreateSweep(slug);
  const navigate = useNavigate();
  const [failure, setFailure] = useState<unknown>(null);
  // "Run again with changes": ?from=<sweepId> fills the form from that sweep's definition.
  const fromId = params.get("from") ?? "";
  const source = useSweep(slug, fromId, fromId !== "");
  const prefilled = useRef(false);
  // Whether the user typed a name (dirtyFields is recomputed for the whole form when variants are added, so it cannot tell).
  const nameTyped = useRef(false);
  const refusal = workspace.data && !canEdit ? roleSentence("Running sweeps", "engineer", workspace.data.workspace.name, role) : null;

  // The resolver reads the plant's state names when it runs (state feedback has one gain per state).
  const stateNamesRef = useRef<readonly string[]>([]);
  const resolver = useMemo<Resolver<SweepFormValues, unknown, SweepInput>>(
    () => (values, _context, options) => sweepFormResolver(values, { stateNames: stateNamesRef.current }, options),
    [],
  );
  const form = useForm<SweepFormValues, unknown, SweepInput>({ defaultValues: defaultSweepForm(params.get("revision") ?? ""), resolver });
  const { register, handleSubmit, formState, setError, setValue, getValues, control } = form;
  const errors = formState.errors;

  // The plant's model (its latest revision; the server checks an earlier revision's state count itself).
  const revisionModel = plant.data?.revision.model ?? null;
  const stateNames = useMemo(() => (revisionModel ? plantStateNames(revisionModel) : []), [revisionModel]);
  stateNamesRef.current = stateNames;

  const structure = useWatch({ control, name: "structure" });
  const ranges = useWatch({ control, name: "ranges" });
  const filterMode = useWatch({ control, name: "filter.mode" });
  const sampled = useWatch({ control, name: "sampled" });
  const antiWindup = useWatch({ control, name: "antiWindup.kind" });
  const scenario = useWatch({ control, name: "scenario" });
  const criteria = useWatch({ control, name: "criteria" });
  const counts = structureCounts({ structure, ranges }, { stateNames });
  const gridCount = candidateCount(counts);
  const design = useWatch({ control, name: "design" });
  const aggregateKind = useWatch({ control, name: "aggregate.kind" });
  const variants = useWatch({ control, name: "variants" });
  const variantCount = savedFamily ? savedFamily.variants.length : 1 + (variants?.length ?? 0);
  const count = design ? designCandidateCount(design, gridCount) : gridCount;
  const ownCount = design ? drawsOwnCount(design.kind) : false;

  // Fill the form once from the sweep to run again (its plant first, so the revision list is there).
  useEffect(() => {
    if (!source.data || prefilled.current) return;
    prefilled.current = true;
    form.reset(formFromSweep(source.data));
    setPlantId(source.data.plant.id);
    const fromFamily = source.data.definition.family?.source;
    const saved = fromFamily ? families.data?.find((f) => f.id === fromFamily.familyId) : undefined;
    if (saved && saved.latestRevision.id === fromFamily?.familyRevisionId) setSavedFamily(saved.latestRevision);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [source.data]);

  // Pick the first plant when none was asked for (archived plants are not offered).
  const offeredPlants = useMemo(() => (plants.data ?? []).filter((p) => p.archivedAt === null || p.id === plantId), [plants.data, plantId]);
  useEffect(() => {
    if (!plantId && !fromId && offeredPlants.length > 0) setPlantId(offeredPlants[0].id);
  }, [plantId, fromId, offeredPlants]);

  // ?family=<family revision id> ("Sweep this family"): choose it once the families are in.
  const familyParam = params.get("family");
  const familyChosen = useRef(false);
  useEffect(() => {
    if (!familyParam || familyChosen.current || !families.data) return;
    familyChosen.current = true;
    const found = families.data.find((f) => f.latestRevision.id === familyParam)?.latestRevision;
    if (found) chooseFamily(found);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [familyParam, families.data]);

  /** A saved family chosen (or "build one here"): its first variant's plant and revision stand above, for the horizon and the state count. */
  const chooseFamily = (revision: FamilyRevisionDto | null) => {
    setSavedFamily(revision);
    const first = revision?.variants[0];
    if (first) {
      setPlantId(first.plantId);
      setValue("plantRevisionId", first.plantRevisionId);
      setValue("variants", []);
    }
  };

  // When a plant loads: choose its latest revision (unless a listed one is chosen), a horizon from its step response.
  useEffect(() => {
    if (!plant.data) return;
    const { revisions, plant: summary, step } = plant.data;
    if (!revisions.some((r) => r.id === getValues("plantRevisionId"))) setValue("plantRevisionId", summary.latestRevision.id);
    const horizon = step.t.length > 0 ? Number(step.t[step.t.length - 1].toPrecision(3)) : 60;
    if (prefilled.current) return; // a copied definition keeps its scenario
    if (!formState.dirtyFields.scenario?.horizon) setValue("scenario.horizon", horizon);
    if (!formState.dirtyFields.scenario?.dt) setValue("scenario.dt", defaultTimeStep(horizon));
    if (getValues("structure") === "state-feedback" && plantStateNames(plant.data.revision.model).length === 0) setValue("structure", "pid");
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plant.data]);

  // A name from the plant and the structure, until the user types one.
  useEffect(() => {
    if (!plant.data || nameTyped.current || prefilled.current) return;
    const how = !design || design.kind === "grid" ? "grid" : design.kind === "nelder-mead" || design.kind === "nsga2" ? "search" : DESIGNS[design.kind].label.toLowerCase().replace("latin", "Latin").replace("sobol", "Sobol");
    const what = savedFamily ? `${savedFamily.name} rev ${savedFamily.number}` : `${plant.data.plant.name}${variantCount > 1 ? ` family (${variantCount})` : ""}`;
    setValue("name", `${what} ${STRUCTURES[structure].label} ${how}`);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plant.data, structure, design?.kind, variantCount, savedFamily]);

  const submit = handleSubmit(async (typed) => {
    setFailure(null);
    let input: SweepInput = typed;
    if (savedFamily) {
      // The server expands the saved revision into the variants (and keeps which revision it used).
      const { family: _adHoc, ...rest } = typed;
      input = { ...rest, familyRevisionId: savedFamily.id, plantRevisionId: savedFamily.variants[0]?.plantRevisionId ?? typed.plantRevisionId };
      const aggregate = getValues("aggregate");
      if (aggregate && savedFamily.variants.length > 1) input.aggregate = toAggregate(aggregate);
    }
    try {
      const created = await create.mutateAsync(input);
      navigate(`/w/${slug}/sweeps/${created.id}`);
    } catch (error) {
      if (!applyServerErrors(error, SWEEP_FORM_FIELDS, setError, formFieldOf)) setFailure(error);
    }
  });

  const back = { to: `/w/${slug}/sweeps`, label: "Sweeps" };
  if (plants.isPending || (fromId && source.isPending)) return <Loading label={fromId ? "Copying the sweep's definition…" : "Loading the library…"} />;
  if (plants.isError)
    return (
      <>
        <PageHeader title="New sweep" back={back} />
        <ErrorNote error={plants.error} title="Could not load the library" />
      </>
    );
  if (plants.data.length === 0) {
    return (
      <>
        <PageHeader title="New sweep" back={back} />
        <EmptyState
          title="No plant to sweep yet"
          action={canEdit ? <ButtonLink to={`/w/${slug}/plants/new`} tone="primary">Add a plant</ButtonLink> : null}
        >
          A sweep runs on one plant revision. Add a plant to the library first.
        </EmptyState>
      </>
    );
  }

  const samples = scenario.dt > 0 ? Math.ceil(scenario.horizon / scenario.dt) : null;
  const overCap = count !== null && !isWithinCandidateCap(count);
  const evaluations = count !== null ? count * variantCount : null;
  const rows = parameterRows(structure, stateNames);
  const rangesErrors = errors.ranges as { message?: string; root?: { message?: string } } | undefined;
  const rangesMessage = rangesErrors?.message ?? rangesErrors?.root?.message;

  return (
    <div data-testid="sweep-new-page">
      <PageHeader
        title={source.data ? "Run again with changes" : "New sweep"}
        subtitle={
          source.data
            ? `A copy of “${source.data.name}”; change what you like. The original sweep stays as it was.`
            : "Candidates over the parameters of one controller structure, on one plant or a family of variants; every candidate is simulated in the chosen scenario and scored."
        }
        back={back}
      />
      <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-6 lg:grid-cols-3" data-testid="sweep-form">
        <div className="space-y-6 lg:col-span-2">
          {refusal ? <RoleNote sentence={refusal} /> : null}
          {failure ? <ErrorNote error={failure} title="The sweep was not started" /> : null}
          {fromId && source.isError ? <ErrorNote error={source.error} title="Could not copy that sweep; the form starts empty" /> : null}
          {errors.root?.server || errors.root?.message ? (
            <p role="alert" data-testid="form-error" className="rounded-md border border-rust/40 bg-rust-wash px-4 py-2.5 text-sm text-rust">
              {errors.root?.server?.message ?? errors.root?.message}
            </p>
          ) : null}

          <Section title="What to sweep">
            <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
              <Field label="Name" htmlFor="sweep-name" name="name" error={errors.name?.message} className="sm:col-span-2">
                <input id="sweep-name" className={inputClass} aria-invalid={Boolean(errors.name)} {...register("name", { onChange: () => (nameTyped.current = true) })} />
              </Field>
            </div>
            <div className="mt-4">
              <SavedFamilyPicker slug={slug} families={families.data ?? []} chosen={savedFamily} onChoose={chooseFamily} />
            </div>
            <div className={`mt-4 grid grid-cols-1 gap-4 sm:grid-cols-2 ${savedFamily ? "hidden" : ""}`}>
              <Field label="Plant" htmlFor="sweep-plant" name="plant" hint={plant.data ? `${plantKindShort(plant.data.revision.model.kind)}${hasLimits(plant.data.revision.model) ? ", with actuator limits" : ""}` : undefined}>
                <select id="sweep-plant" className={inputClass} value={plantId ?? ""} onChange={(e) => setPlantId(e.target.value)} data-testid="sweep-plant">
                  {offeredPlants.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
                </select>
              </Field>
              <Field label="Revision" htmlFor="sweep-revision" name="plantRevisionId" error={errors.plantRevisionId?.message}>
                <select id="sweep-revision" className={inputClass} disabled={!plant.data} aria-invalid={Boolean(errors.plantRevisionId)} {...register("plantRevisionId")}>
                  {plant.data
                    ? [...plant.data.revisions]
                        .sort((a, b) => b.number - a.number)
                        .map((r) => (
                          <option key={r.id} value={r.id}>
                            rev {r.number}
                            {r.number === plant.data.plant.latestRevision.number ? " (latest)" : ""}
                          </option>
                        ))
                    : <option value="">Loading…</option>}
                </select>
              </Field>
            </div>
            <div className={`mt-4 grid grid-cols-1 gap-4 sm:grid-cols-2 ${savedFamily ? "hidden" : ""}`}>
              <Field label="Variant label" htmlFor="first-variant-label" name="firstVariant.label" error={errors.firstVariant?.label?.message} hint={variantCount > 1 ? "how this variant is named in the results" : "optional with one plant"}>
                <input id="first-variant-label" className={inputClass} data-testid="first-variant-label" {...register("firstVariant.label")} />
              </Field>
              {revisionModel?.kind === "nonlinear" ? (
                <Field label="Parameter overrides" htmlFor="first-variant-parameters" name="firstVariant.parameters" error={errors.firstVariant?.parameters?.message} hint={OVERRIDES_HINT}>
                  <input id="first-variant-parameters" className={`${inputClass} font-mono`} {...register("firstVariant.parameters")} />
                </Field>
              ) : null}
            </div>
            {plant.isError ? <div className="mt-3"><ErrorNote error={plant.error} title="Could not load the plant" /></div> : null}
            {savedFamily ? null : (
              <>
                <FamilyVariants slug={slug} plants={offeredPlants} control={control} register={register} setValue={setValue} errors={errors} />
                {(variants?.length ?? 0) > 0 ? (
                  <SaveAsFamily
                    slug={slug}
                    refusal={refusal}
                    family={() => toFamily({ plantRevisionId: getValues("plantRevisionId"), ...(getValues("firstVariant") ?? { label: "", parameters: "" }) }, getValues("variants") ?? [])}
                    onSaved={(detail) => chooseFamily(detail.revision)}
                  />
                ) : null}
              </>
            )}
          </Section>

          <StructureSection
            register={register}
            errors={errors}
            structure={structure}
            stateNames={stateNames}
            filterMode={filterMode}
            sampled={sampled}
            antiWindup={antiWindup}
            hasLimits={revisionModel ? hasLimits(revisionModel) : null}
            ownCount={ownCount}
          />
          <DesignSection
            register={register}
            errors={errors}
            design={design?.kind ?? "grid"}
            aggregate={aggregateKind ?? "worst"}
            criteria={Array.isArray(criteria) ? criteria : []}
            variantCount={variantCount}
          />
          <ScenarioSection register={register} errors={errors} kind={scenario.kind} noiseOn={scenario.noiseOn} samples={samples} />
          <CriteriaSection register={register} errors={errors} chosen={Array.isArray(criteria) ? criteria : []} scenarioKind={scenario.kind} nonlinearPlant={revisionModel?.kind === "nonlinear"} />
        </div>

        <aside>
          <div className="sticky top-20 space-y-4 rounded-lg border border-line bg-sheet p-5">
            <div>
              <div className="text-xs font-medium uppercase tracking-wide text-ink-soft">Candidates</div>
              <div className={`font-mono text-3xl tabular ${overCap ? "text-rust" : "text-ink"}`} data-testid="candidate-count">
                {count !== null ? formatCount(count) : "—"}
              </div>
              <div className="font-mono text-xs text-ink-soft" data-testid="candidate-product">
                {ownCount
                  ? DESIGNS[design.kind].label
                  : rows.map((row, i) => `${row.name} ${Number.isFinite(counts[i]) ? counts[i] : "?"}`).join(" × ")}
              </div>
              {variantCount > 1 ? (
                <div className="mt-1 font-mono text-xs text-ink" data-testid="evaluation-count">
                  × {variantCount} variants = {evaluations !== null ? formatCount(evaluations) : "—"} simulations
                </div>
              ) : null}
            </div>
            <p className={`text-xs ${overCap ? "text-rust" : "text-ink-soft"}`} data-testid="candidate-cap">
              {overCap
                ? `${formatCount(count)} is more than the ${formatCount(MAX_SWEEP_CANDIDATES)} candidates one sweep may hold; ${ownCount ? "lower the design's count" : "lower a count"}.`
                : `One sweep holds at most ${formatCount(MAX_SWEEP_CANDIDATES)} candidates (your workspace may set less), and a workspace runs a few sweeps at a time; the server says so if this one is over. Large sweeps run as chunks on every worker and can be cancelled.`}
            </p>
            {formState.submitCount > 0 && Object.keys(errors).length > 0 && !formState.isSubmitting ? (
              <p role="alert" data-testid="form-problems" className="text-xs text-rust">
                The sweep was not started: fix what is marked in red under {problemSections(Object.keys(errors))}.
              </p>
            ) : null}
            {!overCap && rangesMessage ? (
              <p role="alert" data-testid="field-error-ranges" className="text-xs text-rust">
                {rangesMessage}
              </p>
            ) : null}
            <Button type="submit" tone="primary" className="w-full" disabled={formState.isSubmitting || Boolean(refusal) || !plant.data} data-testid="sweep-submit">
              {formState.isSubmitting ? "Starting…" : count !== null ? `Run ${formatCount(count)} candidates` : "Run sweep"}
            </Button>
          </div>
        </aside>
      </form>
    </div>
  );
}

/** Where the form's problems are, by section title, e.g. "Design and Scenario". */
function problemSections(keys: readonly string[]): string {
  const SECTION: Record<string, string> = {
    name: "What to sweep",
    plantRevisionId: "What to sweep",
    firstVariant: "What to sweep",
    variants: "What to sweep",
    structure: "Controller",
    ranges: "Controller",
    filter: "Controller",
    sampleTime: "Controller",
    antiWindup: "Controller",
    design: "Design",
    aggregate: "Design",
    scenario: "Scenario",
    criteria: "Criteria",
    criterionOptions: "Criteria",
  };
  const names = [...new Set(keys.map((k) => SECTION[k]).filter((n): n is string => n !== undefined))];
  if (names.length === 0) return "the form";
  return names.length === 1 ? names[0] : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}
