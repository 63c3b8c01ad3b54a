import { useEffect, useMemo, useRef, useState } from "react";
import { useForm, useWatch, type Control, type FieldErrors, type Resolver, type UseFormRegister, type UseFormSetValue } from "react-hook-form";
import { useNavigate, useSearchParams } from "react-router";
import { useComparison, useCreateComparison } from "../../api/use-comparisons.js";
import { usePlant, usePlants } from "../../api/use-plants.js";
import { useFamilies } from "../../api/use-families.js";
import type { FamilyRevisionDto } from "@loopyard/core";
import { SavedFamilyPicker } from "../sweeps/saved-family-picker.js";
import { useSweep } from "../../api/use-sweeps.js";
import { Button, ButtonLink } from "../../components/button.js";
import { EmptyState } from "../../components/empty-state.js";
import { ErrorNote } from "../../components/error-note.js";
import { Field, inputClass } from "../../components/field.js";
import { Loading } from "../../components/loading.js";
import { PageHeader } from "../../components/page-header.js";
import { RoleNote } from "../../components/role-note.js";
import { Section } from "../../components/section.js";
import { applyServerErrors } from "../../forms/apply-server-errors.js";
import { plantStateNames, hasLimits } from "../plants/plant-summary.js";
import { FamilyVariants } from "../sweeps/family-variants.js";
import { ScenarioSection } from "../sweeps/scenario-section.js";
import { StructureSection } from "../sweeps/structure-section.js";
import type { SweepFormValues } from "../sweeps/sweep-form-values.js";
import { defaultTimeStep } from "../sweeps/sweep-form-values.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { BudgetSection } from "./budget-section.js";
import {
  COMPARISON_FORM_FIELDS,
  comparisonFieldOf,
  comparisonFormResolver,
  defaultComparisonForm,
  formFromComparison,
  formFromSweepDetail,
  parseWeights,
  type ComparisonFormValues,
} from "./comparison-form-values.js";
import { ContendersSection } from "./contenders-section.js";

/**
 * /w/:slug/comparisons/new — a comparison: the family, structure and box, scenario and aggregate
 * (the sweep form's sections), then contenders, judges, constraints and budget. ?sweep=<id> fills
 * it from a sweep; ?from=<id> from an earlier comparison.
 */
export function ComparisonNewPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const [params] = useSearchParams();
  const plants = usePlants(slug);
  const families = useFamilies(slug);
  // A saved family chosen instead of variants built here (null: build them here).
  const [savedFamily, setSavedFamily] = useState<FamilyRevisionDto | null>(null);
  const [plantId, setPlantId] = useState<string | undefined>(params.get("plant") ?? undefined);
  const plant = usePlant(slug, plantId);
  const create = useCreateComparison(slug);
  const navigate = useNavigate();
  const [failure, setFailure] = useState<unknown>(null);
  const sweepId = params.get("sweep") ?? "";
  const fromId = params.get("from") ?? "";
  const sweep = useSweep(slug, sweepId, sweepId !== "");
  const source = useComparison(slug, fromId);
  const prefilled = useRef(false);
  const nameTyped = useRef(false);
  const refusal = workspace.data && !canEdit ? roleSentence("Starting comparisons", "engineer", workspace.data.workspace.name, role) : null;

  const stateNamesRef = useRef<readonly string[]>([]);
  const resolver = useMemo<Resolver<ComparisonFormValues, unknown, Record<string, unknown>>>(
    () => (values, _context, options) => comparisonFormResolver(values, { stateNames: stateNamesRef.current }, options),
    [],
  );
  const form = useForm<ComparisonFormValues, unknown, Record<string, unknown>>({ defaultValues: defaultComparisonForm(params.get("revision") ?? ""), resolver });
  const { register, handleSubmit, formState, setError, setValue, getValues, control } = form;
  const errors = formState.errors;
  // The sweep form's sections read the shared fields through the sweep form's types.
  const sweepRegister = register as unknown as UseFormRegister<SweepFormValues>;
  const sweepErrors = errors as unknown as FieldErrors<SweepFormValues>;
  const sweepControl = control as unknown as Control<SweepFormValues, unknown, unknown>;
  const sweepSetValue = setValue as unknown as UseFormSetValue<SweepFormValues>;

  const revisionModel = plant.data?.revision.model ?? null;
  const stateNames = useMemo(() => (revisionModel ? plantStateNames(revisionModel) : []), [revisionModel]);
  stateNamesRef.current = stateNames;

  const structure = useWatch({ control, name: "structure" });
  const filterMode = useWatch({ control, name: "filter.mode" });
  const sampled = useWatch({ control, name: "sampled" });
  const antiWindup = useWatch({ control, name: "antiWindup.kind" });
  const scenario = useWatch({ control, name: "scenario" });
  const aggregateKind = useWatch({ control, name: "aggregate.kind" });
  const variants = useWatch({ control, name: "variants" });
  const contenders = useWatch({ control, name: "contenders" });
  const weightsText = useWatch({ control, name: "quadraticWeights" });
  const judges = useWatch({ control, name: "judges" });
  const budget = useWatch({ control, name: "budget" });
  const variantCount = savedFamily ? savedFamily.variants.length : 1 + (variants?.length ?? 0);
  const weights = parseWeights(weightsText ?? "");
  const contenderCount = (Array.isArray(contenders) ? contenders.length : 0) + (weights.ok ? weights.values.length : 0);

  // Fill the form once from the sweep or the comparison it starts from.
  useEffect(() => {
    if (prefilled.current) return;
    if (sweep.data) {
      prefilled.current = true;
      form.reset(formFromSweepDetail(sweep.data));
      setPlantId(sweep.data.plant.id);
    } else if (source.data) {
      prefilled.current = true;
      form.reset(formFromComparison(source.data));
      setPlantId(source.data.family[0]?.plantId);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [sweep.data, source.data]);

  // Archived plants are not offered (a copied definition keeps its own).
  const offeredPlants = useMemo(() => (plants.data ?? []).filter((p) => p.archivedAt === null || p.id === plantId), [plants.data, plantId]);
  useEffect(() => {
    if (!plantId && !sweepId && !fromId && offeredPlants.length > 0) setPlantId(offeredPlants[0].id);
  }, [plantId, sweepId, fromId, offeredPlants]);

  /** A saved family chosen (or "build one here"): its first variant stands above, for the horizon and the state count. */
  const chooseFamily = (revision: FamilyRevisionDto | null) => {
    setSavedFamily(revision);
    const first = revision?.variants[0];
    if (first) {
      setPlantId(first.plantId);
      setValue("plantRevisionId", first.plantRevisionId);
      setValue("variants", []);
    }
  };

  useEffect(() => {
    if (!plant.data) return;
    const { revisions, plant: summary, step } = plant.data;
    if (!revisions.some((r) => r.id === getValues("plantRevisionId"))) setValue("plantRevisionId", summary.latestRevision.id);
    if (prefilled.current) return;
    const horizon = step.t.length > 0 ? Number(step.t[step.t.length - 1].toPrecision(3)) : 60;
    if (!formState.dirtyFields.scenario?.horizon) setValue("scenario.horizon", horizon);
    if (!formState.dirtyFields.scenario?.dt) setValue("scenario.dt", defaultTimeStep(horizon));
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plant.data]);

  useEffect(() => {
    if (!plant.data || nameTyped.current || prefilled.current) return;
    const what = savedFamily ? `${savedFamily.name} rev ${savedFamily.number}` : `${plant.data.plant.name}${variantCount > 1 ? ` family (${variantCount})` : ""}`;
    setValue("name", `${what}: which criterion?`);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plant.data, variantCount, savedFamily]);

  const submit = handleSubmit(async (typed) => {
    setFailure(null);
    // With a saved family the server expands its revision into the variants (and keeps which revision it used).
    let input = typed;
    if (savedFamily) {
      const { family: _adHoc, ...rest } = typed;
      input = { ...rest, familyRevisionId: savedFamily.id };
    }
    try {
      const created = await create.mutateAsync(input);
      navigate(`/w/${slug}/comparisons/${created.id}`);
    } catch (error) {
      if (!applyServerErrors(error, COMPARISON_FORM_FIELDS, setError, comparisonFieldOf)) setFailure(error);
    }
  });

  const back = { to: `/w/${slug}/comparisons`, label: "Compare criteria" };
  if (plants.isPending || (sweepId && sweep.isPending) || (fromId && source.isPending)) return <Loading label="Loading the library…" />;
  if (plants.isError)
    return (
      <>
        <PageHeader title="New comparison" back={back} />
        <ErrorNote error={plants.error} title="Could not load the library" />
      </>
    );
  if (plants.data.length === 0) {
    return (
      <>
        <PageHeader title="New comparison" back={back} />
        <EmptyState title="No plant to compare on yet" action={canEdit ? <ButtonLink to={`/w/${slug}/plants/new`} tone="primary">Add a plant</ButtonLink> : null}>
          A comparison runs on a family of plant revisions. Add the plants of your product line to the library first.
        </EmptyState>
      </>
    );
  }
  const samples = scenario.dt > 0 ? Math.ceil(scenario.horizon / scenario.dt) : null;
  const judgeCount = Array.isArray(judges) ? judges.length : 0;

  return (
    <div data-testid="comparison-new-page">
      <PageHeader
        title={source.data ? "Run the comparison again with changes" : "New comparison"}
        subtitle="Which criterion should the team tune by? Each contender picks its best design in the box, on every variant; every pick is then judged on every criterion."
        back={back}
      />
      <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-6 lg:grid-cols-3" data-testid="comparison-form">
        <div className="space-y-6 lg:col-span-2">
          {refusal ? <RoleNote sentence={refusal} /> : null}
          {failure ? <ErrorNote error={failure} title="The comparison was not started" /> : null}
          {sweepId && sweep.isError ? <ErrorNote error={sweep.error} title="Could not read that sweep; the form starts empty" /> : null}
          {errors.root?.server || errors.root?.message ? (
            <p role="alert" data-testid="form-error" className="rounded-md border border-rust/40 bg-rust-wash px-4 py-2.5 text-sm text-rust">
              {errors.root?.server?.message ?? errors.root?.message}
            </p>
          ) : null}
          <Section title="Family">
            <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
              <Field label="Name" htmlFor="comparison-name" name="name" error={errors.name?.message} className="sm:col-span-2">
                <input id="comparison-name" className={inputClass} {...register("name", { onChange: () => (nameTyped.current = true) })} data-testid="comparison-name" />
              </Field>
              <div className="sm:col-span-2">
                <SavedFamilyPicker slug={slug} families={families.data ?? []} chosen={savedFamily} onChoose={chooseFamily} />
              </div>
            </div>
            <div className={`mt-4 grid grid-cols-1 gap-4 sm:grid-cols-2 ${savedFamily ? "hidden" : ""}`}>
              <Field label="Plant" htmlFor="comparison-plant" name="plant">
                <select id="comparison-plant" className={inputClass} value={plantId ?? ""} onChange={(e) => setPlantId(e.target.value)} data-testid="comparison-plant">
                  {offeredPlants.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
                </select>
              </Field>
              <Field label="Revision" htmlFor="comparison-revision" name="plantRevisionId" error={errors.plantRevisionId?.message}>
                <select id="comparison-revision" className={inputClass} disabled={!plant.data} {...register("plantRevisionId")}>
                  {plant.data ? (
                    [...plant.data.revisions]
                      .sort((a, b) => b.number - a.number)
                      .map((r) => (
                        <option key={r.id} value={r.id}>
                          rev {r.number}
                        </option>
                      ))
                  ) : (
                    <option value="">Loading…</option>
                  )}
                </select>
              </Field>
              <Field label="Variant label" htmlFor="first-variant-label" name="firstVariant.label" error={errors.firstVariant?.label?.message} hint="how this variant is named in the results">
                <input id="first-variant-label" className={inputClass} {...register("firstVariant.label")} />
              </Field>
            </div>
            {savedFamily ? null : (
              <FamilyVariants slug={slug} plants={offeredPlants} control={sweepControl} register={sweepRegister} setValue={sweepSetValue} errors={sweepErrors} />
            )}
          </Section>
          <StructureSection
            register={sweepRegister}
            errors={sweepErrors}
            structure={structure}
            stateNames={stateNames}
            filterMode={filterMode}
            sampled={sampled}
            antiWindup={antiWindup}
            hasLimits={revisionModel ? hasLimits(revisionModel) : null}
            ownCount
          />
          <ScenarioSection register={sweepRegister} errors={sweepErrors} kind={scenario.kind} noiseOn={scenario.noiseOn} samples={samples} />
          <ContendersSection register={register} control={control} errors={errors} contenders={Array.isArray(contenders) ? contenders : []} />
          <BudgetSection register={register} errors={errors} aggregate={aggregateKind ?? "worst"} variantCount={variantCount} />
        </div>
        <aside>
          <div className="sticky top-20 space-y-4 rounded-lg border border-line bg-sheet p-5">
            <div>
              <div className="text-xs font-medium uppercase tracking-wide text-ink-soft">This comparison</div>
              <div className="mt-1 font-mono text-2xl tabular text-ink" data-testid="contender-count">
                {contenderCount} contender{contenderCount === 1 ? "" : "s"}
              </div>
              <div className="font-mono text-xs text-ink-soft">
                {judgeCount} judge{judgeCount === 1 ? "" : "s"} · {variantCount} variant{variantCount === 1 ? "" : "s"} · pre-scan {budget?.prescan ?? "—"} points
              </div>
            </div>
            <p className="text-xs text-ink-soft">
              The range rows above set the box: each parameter searched from its min to its max (equal min and max: a fixed value). A pick on a face of the box is flagged — then the box, not the criterion, chose it.
            </p>
            {formState.submitCount > 0 && Object.keys(errors).length > 0 && !formState.isSubmitting ? (
              <p role="alert" data-testid="form-problems" className="text-xs text-rust">
                The comparison was not started: fix what is marked in red.
              </p>
            ) : null}
            <Button type="submit" tone="primary" className="w-full" disabled={formState.isSubmitting || Boolean(refusal) || !plant.data} data-testid="comparison-submit">
              {formState.isSubmitting ? "Starting…" : `Compare ${contenderCount} criteria`}
            </Button>
          </div>
        </aside>
      </form>
    </div>
  );
}
