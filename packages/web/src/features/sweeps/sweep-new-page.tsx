import { useEffect, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { useNavigate, useSearchParams } from "react-router";
import { CRITERION_IDS, MAX_SIMULATION_SAMPLES, MAX_SWEEP_CANDIDATES, type SweepInput } from "@loopyard/core";
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
import { criterionDescription, criterionShortLabel } from "../fronts/criterion-label.js";
import { roleSentence, useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { candidateCount, isWithinCandidateCap } from "./candidate-count.js";
import { SWEEP_FORM_FIELDS, defaultSweepForm, defaultTimeStep, sweepFormResolver, type SweepFormValues } from "./sweep-form-values.js";

const GAINS = [
  { key: "kp", label: "kp", unit: "proportional gain" },
  { key: "ki", label: "ki", unit: "integral gain [1/s]" },
  { key: "kd", label: "kd", unit: "derivative gain [s]" },
] as const;

/** /w/:slug/sweeps/new — a PID grid on one plant revision. */
export function SweepNewPage() {
  const { slug, workspace, role, canEdit } = useWorkspaceRole();
  const [params] = useSearchParams();
  const plants = usePlants(slug);
  const [plantId, setPlantId] = useState<string | undefined>(params.get("plant") ?? undefined);
  const plant = usePlant(slug, plantId);
  const create = useCreateSweep(slug);
  const navigate = useNavigate();
  const [failure, setFailure] = useState<unknown>(null);
  const refusal = workspace.data && !canEdit ? roleSentence("Running sweeps", "engineer", workspace.data.workspace.name, role) : null;

  const form = useForm<SweepFormValues, unknown, SweepInput>({ defaultValues: defaultSweepForm(params.get("revision") ?? ""), resolver: sweepFormResolver });
  const { register, handleSubmit, formState, setError, setValue, getValues, control } = form;
  const errors = formState.errors;
  const ranges = useWatch({ control, name: "ranges" });
  const filterMode = useWatch({ control, name: "filter.mode" });
  const scenario = useWatch({ control, name: "scenario" });
  const count = candidateCount(ranges);

  // Pick the first plant when none was asked for.
  useEffect(() => {
    if (!plantId && plants.data && plants.data.length > 0) setPlantId(plants.data[0].id);
  }, [plantId, plants.data]);

  // When a plant loads: choose its latest revision (unless a listed one is chosen), a horizon from its step response, and a name.
  useEffect(() => {
    if (!plant.data) return;
    const { revisions, plant: summary, step } = plant.data;
    if (!revisions.some((r) => r.id === getValues("plantRevisionId"))) setValue("plantRevisionId", summary.latestRevision.id);
    const horizon = step.t.length > 0 ? Number(step.t[step.t.length - 1].toPrecision(3)) : 60;
    if (!formState.dirtyFields.scenario?.horizon) setValue("scenario.horizon", horizon);
    if (!formState.dirtyFields.scenario?.dt) setValue("scenario.dt", defaultTimeStep(horizon));
    if (!formState.dirtyFields.name) setValue("name", `${summary.name} PID grid`);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plant.data]);

  const submit = handleSubmit(async (input) => {
    setFailure(null);
    try {
      const created = await create.mutateAsync(input);
      navigate(`/w/${slug}/sweeps/${created.id}`);
    } catch (error) {
      if (!applyServerErrors(error, SWEEP_FORM_FIELDS, setError)) setFailure(error);
    }
  });

  const back = { to: `/w/${slug}/sweeps`, label: "Sweeps" };
  if (plants.isPending) return <Loading label="Loading the library…" />;
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

  return (
    <div data-testid="sweep-new-page">
      <PageHeader title="New sweep" subtitle="A grid of PID gains on one plant revision; every candidate is simulated under a unit setpoint step and scored." back={back} />
      <form onSubmit={submit} noValidate className="grid grid-cols-1 gap-6 lg:grid-cols-3" data-testid="sweep-form">
        <div className="space-y-6 lg:col-span-2">
          {refusal ? <RoleNote sentence={refusal} /> : null}
          {failure ? <ErrorNote error={failure} title="The sweep was not started" /> : null}
          {errors.root?.server ? (
            <p role="alert" data-testid="form-error" className="rounded-md border border-rust/40 bg-rust-wash px-4 py-2.5 text-sm text-rust">
              {errors.root.server.message}
            </p>
          ) : null}

          <Section title="What to sweep">
            <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
              <Field label="Name" htmlFor="sweep-name" name="name" error={errors.name?.message} className="sm:col-span-2">
                <input id="sweep-name" className={inputClass} aria-invalid={Boolean(errors.name)} {...register("name")} />
              </Field>
              <Field label="Plant" htmlFor="sweep-plant" name="plant">
                <select id="sweep-plant" className={inputClass} value={plantId ?? ""} onChange={(e) => setPlantId(e.target.value)} data-testid="sweep-plant">
                  {plants.data.map((p) => (
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
            {plant.isError ? <div className="mt-3"><ErrorNote error={plant.error} title="Could not load the plant" /></div> : null}
          </Section>

          <Section title="Gains" aside="C(s) = kp + ki/s + kd·s/(tf·s + 1); count values spaced evenly from min to max">
            <div className="grid grid-cols-[4rem_1fr_1fr_1fr] items-start gap-x-3 gap-y-3">
              <span />
              <span className="text-xs font-medium uppercase tracking-wide text-ink-soft">min</span>
              <span className="text-xs font-medium uppercase tracking-wide text-ink-soft">max</span>
              <span className="text-xs font-medium uppercase tracking-wide text-ink-soft">count</span>
              {GAINS.map((g) => (
                <GainRow key={g.key} gain={g} register={register} errors={errors.ranges?.[g.key]} />
              ))}
            </div>
          </Section>

          <Section title="Derivative filter" aside="first-order filter on the derivative term">
            <div className="flex flex-wrap items-start gap-6">
              <label className="flex items-center gap-2 pt-1.5 text-sm">
                <input type="radio" value="ratio" className="accent-moss" {...register("filter.mode")} />
                tf = Td / n, with Td = kd/kp
              </label>
              <Field label="n" htmlFor="filter-n" name="filter.n" error={errors.filter?.n?.message} className="w-28">
                <input id="filter-n" type="number" step="any" disabled={filterMode !== "ratio"} className={`${inputClass} font-mono`} {...register("filter.n", { valueAsNumber: true })} />
              </Field>
              <label className="flex items-center gap-2 pt-1.5 text-sm">
                <input type="radio" value="fixed" className="accent-moss" {...register("filter.mode")} />
                fixed tf
              </label>
              <Field label="tf [s]" htmlFor="filter-tf" name="filter.tf" error={errors.filter?.tf?.message} className="w-28">
                <input id="filter-tf" type="number" step="any" disabled={filterMode !== "fixed"} className={`${inputClass} font-mono`} {...register("filter.tf", { valueAsNumber: true })} />
              </Field>
            </div>
          </Section>

          <Section title="Scenario" aside="unit setpoint step at t = 0, plant at rest">
            <div className="grid grid-cols-2 gap-4 sm:grid-cols-3">
              <Field label="Horizon [s]" htmlFor="horizon" name="scenario.horizon" error={errors.scenario?.horizon?.message}>
                <input id="horizon" type="number" step="any" className={`${inputClass} font-mono`} {...register("scenario.horizon", { valueAsNumber: true })} />
              </Field>
              <Field
                label="Time step dt [s]"
                htmlFor="dt"
                name="scenario.dt"
                error={errors.scenario?.dt?.message}
                hint={samples !== null && Number.isFinite(samples) ? `${samples} samples per simulation (at most ${MAX_SIMULATION_SAMPLES})` : undefined}
              >
                <input id="dt" type="number" step="any" className={`${inputClass} font-mono`} {...register("scenario.dt", { valueAsNumber: true })} />
              </Field>
            </div>
          </Section>

          <Section title="Criteria" aside="every chosen criterion is scored for every stable candidate">
            <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
              {CRITERION_IDS.map((c) => (
                <label key={c} className="flex items-start gap-2 text-sm">
                  <input type="checkbox" value={c} className="mt-0.5 accent-moss" {...register("criteria")} />
                  <span>
                    <span className="font-medium">{criterionShortLabel(c)}</span>
                    <span className="block text-xs text-ink-soft">{criterionDescription(c)}</span>
                  </span>
                </label>
              ))}
            </div>
            {errors.criteria?.message ? <p role="alert" data-testid="field-error-criteria" className="mt-2 text-xs text-rust">{errors.criteria.message}</p> : null}
          </Section>
        </div>

        <aside>
          <div className="sticky top-20 space-y-4 rounded-lg border border-line bg-sheet p-5">
            <div>
              <div className="text-xs font-medium uppercase tracking-wide text-ink-soft">Candidates</div>
              <div className={`font-mono text-3xl tabular ${overCap ? "text-rust" : "text-ink"}`} data-testid="candidate-count">
                {count ?? "—"}
              </div>
              <div className="font-mono text-xs text-ink-soft">
                {ranges.kp.count || "?"} × {ranges.ki.count || "?"} × {ranges.kd.count || "?"}
              </div>
            </div>
            <p className={`text-xs ${overCap ? "text-rust" : "text-ink-soft"}`} data-testid="candidate-cap">
              {overCap
                ? `${count} is more than the ${MAX_SWEEP_CANDIDATES} candidates one sweep may hold; lower a count.`
                : `One sweep holds at most ${MAX_SWEEP_CANDIDATES} candidates, so that it runs in about a minute on the shared server without holding up others.`}
            </p>
            {!overCap && (errors.ranges?.message || errors.ranges?.root?.message) ? (
              <p role="alert" data-testid="field-error-ranges" className="text-xs text-rust">
                {errors.ranges?.message ?? errors.ranges?.root?.message}
              </p>
            ) : null}
            <Button type="submit" tone="primary" className="w-full" disabled={formState.isSubmitting || Boolean(refusal) || !plant.data} data-testid="sweep-submit">
              {formState.isSubmitting ? "Starting…" : count !== null ? `Run ${count} candidates` : "Run sweep"}
            </Button>
          </div>
        </aside>
      </form>
    </div>
  );
}

function GainRow({
  gain,
  register,
  errors,
}: {
  gain: (typeof GAINS)[number];
  register: ReturnType<typeof useForm<SweepFormValues, unknown, SweepInput>>["register"];
  errors: { min?: { message?: string }; max?: { message?: string }; count?: { message?: string }; message?: string; root?: { message?: string } } | undefined;
}) {
  const key = gain.key;
  const cell = (part: "min" | "max" | "count") => {
    const message = errors?.[part]?.message;
    return (
      <div>
        <input
          id={`${key}-${part}`}
          aria-label={`${gain.label} ${part}`}
          type="number"
          step={part === "count" ? 1 : "any"}
          min={part === "count" ? 1 : 0}
          className={`${inputClass} font-mono`}
          aria-invalid={Boolean(message)}
          data-testid={`${key}-${part}`}
          {...register(`ranges.${key}.${part}`, { valueAsNumber: true })}
        />
        {message ? (
          <p role="alert" data-testid={`field-error-ranges.${key}.${part}`} className="mt-1 text-xs text-rust">
            {message}
          </p>
        ) : null}
      </div>
    );
  };
  return (
    <>
      <div className="pt-1.5">
        <div className="font-mono text-sm">{gain.label}</div>
        <div className="text-[11px] leading-tight text-ink-faint">{gain.unit}</div>
      </div>
      {cell("min")}
      {cell("max")}
      {cell("count")}
    </>
  );
}
