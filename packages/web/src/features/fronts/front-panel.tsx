import { useMemo, useState } from "react";
import { useSearchParams } from "react-router";
import type { CriterionId, SweepDetailDto } from "@loopyard/core";
import { useCandidate, useCandidateResponse, useFront, usePoints } from "../../api/use-fronts.js";
import { useCandidateFrequency, useReferences } from "../../api/use-references.js";
import { EmptyState } from "../../components/empty-state.js";
import { ErrorNote } from "../../components/error-note.js";
import { inputClass } from "../../components/field.js";
import { formatNumber } from "../../components/format-number.js";
import { Loading } from "../../components/loading.js";
import { Section } from "../../components/section.js";
import { criterionAxisTitle, criterionDescription, criterionShortLabel, frontSenseNote } from "./criterion-label.js";
import { edgeMarks, fitFrontAxes } from "./axis-fit.js";
import { FrontChart } from "./front-chart.js";
import { cloudPoints, defaultAxes, pointDescriber, positionFinder, type PlotCloud } from "./front-points.js";
import { FrontTable } from "./front-table.js";
import { ReferenceLegend } from "./reference-legend.js";
import { baselinePoints, boundTrace } from "./reference-points.js";
import { ResponseChart } from "./response-chart.js";
import { SensitivityChart } from "./sensitivity-chart.js";
import { Button } from "../../components/button.js";
import { ProposeDialog, type ProposeTarget } from "../decisions/propose-dialog.js";
import { baselineTarget, candidateTarget, initialCandidate } from "../decisions/propose-targets.js";
import { useWorkspaceRole } from "../workspace/use-workspace-role.js";
import { VariantScoresTable, aggregateName } from "./variant-scores-table.js";
import { formatCount } from "../sweeps/sweep-progress.js";
import { Link } from "react-router";

const NO_POINTS: PlotCloud = { indices: [], xs: [], ys: [] };

/** The results of a finished sweep: two criteria chosen, every candidate plotted, the front drawn and listed, one candidate's response. */
/** Structures a deployment sheet covers (PID types; core buildDeploymentSheet). */
const DEPLOYABLE = new Set<string>(["p", "pi", "pid", "pid2dof"]);

export function FrontPanel({ slug, sweep }: { slug: string; sweep: SweepDetailDto }) {
  const [chosenX, setX] = useState<CriterionId | null>(null);
  const [chosenY, setY] = useState<CriterionId | null>(null);
  const [logAxes, setLogAxes] = useState(false);
  // A link may name the candidate to open with (?candidate=N, e.g. from a decision's page).
  const [searchParams] = useSearchParams();
  const [selected, setSelected] = useState<number | null>(() => initialCandidate(searchParams.get("candidate"), sweep.total));
  // Proposing a design (engineers and up): the front's rows, the clicked candidate and the baselines.
  const { canEdit: canPropose } = useWorkspaceRole();
  const [proposing, setProposing] = useState<ProposeTarget | null>(null);
  // Show every candidate (plotly's autorange) instead of axes fitted to the front and most of the cloud.
  const [showAll, setShowAll] = useState(false);
  // The variant of the family whose response and |S|, |T| are drawn (0, the first, until the user picks).
  const [variant, setVariant] = useState(0);

  const family = sweep.family ?? [];
  // Until the user picks, plot two criteria that have finite scores in this sweep (PointsDto.plottable;
  // before the first points arrive, ISE against effort or the first two).
  const [plottableSeen, setPlottableSeen] = useState<CriterionId[] | null>(null);
  const auto = useMemo(() => defaultAxes(sweep.criteria, plottableSeen ?? undefined), [sweep.criteria, plottableSeen]);
  const x = chosenX ?? auto.x;
  const y = chosenY ?? auto.y;
  // The cloud (compact columns), the front (with its candidates) and the references load side by side.
  const cloud = usePoints(slug, sweep.id, x, y, true);
  const front = useFront(slug, sweep.id, x, y, true);
  const plottable = cloud.data?.plottable ?? plottableSeen ?? [...sweep.criteria];
  if (cloud.data && !cloud.isPlaceholderData && plottableSeen === null) setPlottableSeen(cloud.data.plottable);
  const points: PlotCloud = cloud.data ?? NO_POINTS;
  const references = useReferences(slug, sweep.id, true);
  const baselines = useMemo(() => baselinePoints(references.data?.baselines, sweep.criteria, x, y), [references.data, sweep.criteria, x, y]);
  const bound = useMemo(() => boundTrace(references.data?.bound, x, y, points), [references.data, x, y, points]);
  const frontRows = front.data?.candidates ?? [];
  // Axes fitted to the front and most of the cloud; far-out candidates are drawn at the edge (axis-fit.ts).
  const frontIndices = front.data?.indices;
  const frontPoints = useMemo(() => (frontIndices ? cloudPoints(points, positionFinder(points.indices), frontIndices) : null), [points, frontIndices]);
  const fit = useMemo(() => (frontPoints ? fitFrontAxes(points, frontPoints, baselines, logAxes) : null), [points, frontPoints, baselines, logAxes]);
  const edges = useMemo(() => (fit ? edgeMarks(points, fit.x, fit.y, logAxes) : null), [points, fit, logAxes]);
  // "Show every candidate": the padded extent of the cloud, the front and the baselines.
  const everything = useMemo(() => (showAll && frontPoints ? fitFrontAxes(points, frontPoints, baselines, logAxes, true) : null), [showAll, points, frontPoints, baselines, logAxes]);
  const shownFit = showAll ? everything : fit;
  const farOut = edges?.indices.length ?? 0;
  // Hover text: the swept parameters of a candidate (fixed ones are the same for all); the cloud's by plotly on hover.
  const describe = useMemo(() => (cloud.data ? pointDescriber(cloud.data, sweep.swept, formatNumber) : undefined), [cloud.data, sweep.swept]);
  const cloudParams = useMemo(() => (cloud.data ? { names: sweep.swept, columns: cloud.data.params } : undefined), [cloud.data, sweep.swept]);
  // The clicked candidate in full (per-variant scores), only for a family of variants.
  const chosen = useCandidate(slug, sweep.id, selected, family.length > 1);
  const chosenCandidate = selected !== null && chosen.data?.index === selected ? chosen.data : undefined;

  const select = (label: string, value: CriterionId, onChange: (c: CriterionId) => void, testId: string) => (
    <label className="flex items-center gap-2 whitespace-nowrap text-sm">
      <span className="text-ink-soft">{label}</span>
      <select value={value} onChange={(e) => onChange(e.target.value as CriterionId)} className={`${inputClass} w-auto py-1`} data-testid={testId}>
        {sweep.criteria.map((c) => (
          <option key={c} value={c}>
            {criterionShortLabel(c)}
            {plottable.includes(c) ? "" : " (no finite values)"}
          </option>
        ))}
      </select>
    </label>
  );

  if (cloud.isPending) return <Loading label="Loading candidates…" />;
  if (cloud.isError) return <ErrorNote error={cloud.error} title="Could not load the candidates" />;

  const { sampled, total } = cloud.data;
  const divergedCount = sweep.divergedCount ?? 0;
  const stableCount = Math.max(0, total - sweep.unstableCount - divergedCount);
  if (stableCount === 0) {
    return (
      <EmptyState title="No stable candidate in this grid" testId="front-empty">
        Of {sweep.total} candidates, {sweep.unstableCount} give an unstable closed loop and {divergedCount} diverged in simulation, so there is no front
        to draw. Start a new sweep with smaller gains (lower maxima), or check the plant model and its actuator limits.
      </EmptyState>
    );
  }

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-4 rounded-lg border border-line bg-sheet px-4 py-2.5">
        {select("x", x, setX, "criterion-x")}
        {select("against y", y, setY, "criterion-y")}
        <label className="flex items-center gap-2 text-sm text-ink-soft">
          <input type="checkbox" checked={logAxes} onChange={(e) => setLogAxes(e.target.checked)} className="accent-moss" data-testid="log-axes" />
          log axes
        </label>
        <span className="ml-auto text-xs text-ink-soft" data-testid="unstable-note">
          {formatCount(stableCount)} stable of {formatCount(total)}
          {sweep.unstableCount > 0 ? ` · ${formatCount(sweep.unstableCount)} unstable` : ""}
          {divergedCount > 0 ? ` · ${formatCount(divergedCount)} diverged` : ""}
          {sweep.unstableCount + divergedCount > 0 ? ", not drawn" : ""}
          {!sampled && !cloud.isPlaceholderData && points.xs.length < stableCount ? ` · ${stableCount - points.xs.length} without a finite score on these axes` : ""}
          {front.data ? ` · ${formatCount(front.data.indices.length)} on the front` : ""}
        </span>
      </div>

      {sampled ? (
        <p className="-mt-3 text-xs text-ink-soft" data-testid="sample-note">
          Showing a sample of {formatCount(points.xs.length)} stable candidates of {formatCount(total)}, so
          the page stays quick; the front is exact, computed on the server over all of them.
        </p>
      ) : null}

      <div className="grid grid-cols-1 gap-6 xl:grid-cols-5">
        <div className="xl:col-span-3">
          <Section title={`${criterionShortLabel(y)} against ${criterionShortLabel(x)}`} aside={frontSenseNote(x, y)}>
            {front.isError ? (
              <ErrorNote error={front.error} title="Could not compute the front" />
            ) : front.isPending || cloud.isPlaceholderData ? (
              // Draw once, with the front: a large cloud drawn twice costs a second WebGL pass.
              <Loading label="Computing the front…" />
            ) : points.xs.length === 0 ? (
              <p className="py-16 text-center text-sm text-ink-soft" data-testid="front-no-points">
                No stable candidate has a finite {[x, y].filter((c) => !plottable.includes(c)).map(criterionShortLabel).join(" or ") || "score"} here:
                it does not apply to this scenario or was never reached. Choose another criterion above.
              </p>
            ) : (
              <FrontChart
                cloud={points}
                front={front.data?.indices ?? []}
                selected={selected}
                xTitle={criterionAxisTitle(x)}
                yTitle={criterionAxisTitle(y)}
                logAxes={logAxes}
                onSelect={setSelected}
                describe={describe}
                cloudParams={cloudParams}
                bound={bound}
                baselines={baselines}
                fit={shownFit}
                edges={showAll ? null : edges}
              />
            )}
            {farOut > 0 ? (
              <p className="mt-1 flex flex-wrap items-center gap-x-2 text-xs text-ink-soft" data-testid="far-out-note">
                {showAll ? (
                  <span>Showing every candidate; the front may be squeezed by far-out ones.</span>
                ) : (
                  <span>
                    <span className="text-ink-soft" aria-hidden="true">
                      ▸{" "}
                    </span>
                    {farOut === 1 ? "1 far-out candidate lies" : `${formatCount(farOut)} far-out candidates lie`} beyond the axes, which fit the front and
                    most of the cloud; {farOut === 1 ? "it is" : "they are"} drawn at the edge, pointing where {farOut === 1 ? "it lies" : "they lie"}.
                  </span>
                )}
                <button type="button" className="text-moss underline-offset-2 hover:underline" onClick={() => setShowAll(!showAll)} data-testid="far-out-toggle">
                  {showAll ? "Fit the axes to the front" : "Show every candidate"}
                </button>
              </p>
            ) : null}
            <ReferenceLegend
              references={references.data}
              error={references.error}
              bound={bound}
              baselines={baselines}
              ranges={{ x: shownFit?.x?.range ?? null, y: shownFit?.y?.range ?? null }}
              logAxes={logAxes}
              x={x}
              y={y}
            />
            {canPropose && references.data && references.data.baselines.some((b) => b.status === "stable") ? (
              <div className="mt-2 flex flex-wrap items-center gap-1.5 text-xs text-ink-soft" data-testid="propose-baselines">
                <span>Propose a baseline:</span>
                {references.data.baselines
                  .filter((b) => b.status === "stable" && baselineTarget(sweep, b) !== null)
                  .map((b) => (
                    <Button key={`${b.rule}-${b.variant}`} className="px-2 py-0.5 text-xs" onClick={() => setProposing(baselineTarget(sweep, b))} data-testid="propose-baseline">
                      {b.label}
                    </Button>
                  ))}
              </div>
            ) : null}
            <p className="mt-2 text-xs text-ink-faint">
              {criterionShortLabel(x)}: {criterionDescription(x)} {x !== y ? `${criterionShortLabel(y)}: ${criterionDescription(y)}` : ""}
            </p>
            {infiniteHorizonNote(sweep, x, y) ? (
              <p className="mt-1 text-xs text-ink-soft" data-testid="infinite-horizon-note">
                {infiniteHorizonNote(sweep, x, y)}
              </p>
            ) : null}
          </Section>
        </div>
        <div className="space-y-6 xl:col-span-2">
          {family.length > 1 && chosenCandidate ? (
            <Section title={`Candidate #${chosenCandidate.index} on each variant`} aside={`the front uses the ${aggregateName(sweep.definition.aggregate)}`} testId="variant-section">
              <VariantScoresTable
                candidate={chosenCandidate}
                family={family}
                criteria={sweep.criteria}
                aggregate={sweep.definition.aggregate}
                shown={variant}
                onShow={setVariant}
              />
            </Section>
          ) : null}
          {canPropose && selected !== null ? (
            <div className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-sheet px-4 py-2.5 text-sm" data-testid="chosen-candidate-bar">
              <span>
                Candidate <span className="font-mono">#{selected}</span> is chosen.
              </span>
              <Button tone="primary" onClick={() => setProposing(candidateTarget(sweep, selected))} data-testid="propose-chosen">
                Propose candidate #{selected}
              </Button>
            </div>
          ) : null}
          <CandidateResponse slug={slug} sweep={sweep} index={selected} variant={variant} onVariant={setVariant} />
          {selected !== null && DEPLOYABLE.has(sweep.definition.structure) ? (
            <p className="-mt-3 text-right text-sm">
              <Link to={`/w/${slug}/sweeps/${sweep.id}/candidates/${selected}/sheet`} className="text-moss hover:underline" data-testid="sheet-link">
                Deployment sheet of candidate #{selected} →
              </Link>
            </p>
          ) : null}
          {sweep.plant.kind !== "nonlinear" ? <CandidateSensitivity slug={slug} sweep={sweep} index={selected} variant={variant} /> : null}
        </div>
      </div>

      <Section title="Front" aside={`${frontRows.length} non-dominated candidates, by ${criterionShortLabel(x)}`} testId="front-section">
        {front.isPending ? (
          <Loading label="Computing the front…" />
        ) : front.isError ? (
          <ErrorNote error={front.error} title="Could not compute the front" />
        ) : (
          <FrontTable
            rows={frontRows}
            parameters={sweep.parameters}
            criteria={sweep.criteria}
            x={x}
            y={y}
            selected={selected}
            onSelect={setSelected}
            onPropose={canPropose ? (index) => setProposing(candidateTarget(sweep, index)) : undefined}
          />
        )}
      </Section>
      <ProposeDialog slug={slug} target={proposing} onClose={() => setProposing(null)} />
    </div>
  );
}

/**
 * When the sweep scored ise, effort or quadratic over an infinite horizon and one of them is on an axis:
 * a sentence saying so (the descriptions speak of "the horizon"); otherwise null.
 */
export function infiniteHorizonNote(sweep: Pick<SweepDetailDto, "definition">, x: CriterionId, y: CriterionId): string | null {
  if (sweep.definition.criterionOptions?.horizon !== "infinite") return null;
  const shown = [x, y].filter((c, i, all) => (c === "ise" || c === "effort" || c === "quadratic") && all.indexOf(c) === i);
  if (shown.length === 0) return null;
  return `${shown.map(criterionShortLabel).join(" and ")} here ${shown.length > 1 ? "are" : "is"} exact over an infinite horizon (Lyapunov equation, no time grid), not over the ${formatNumber(sweep.definition.scenario.horizon)} s simulated; candidates they do not apply to are left out.`;
}

/** What the scenario of a sweep does, in a few words, e.g. "load step of 1 at t = 10 s". */
export function scenarioSummary(scenario: SweepDetailDto["definition"]["scenario"]): string {
  const setpoint = `setpoint step of ${formatNumber(scenario.setpoint ?? 1)}`;
  const load = scenario.load ?? { size: 1, time: 0 };
  const loadText = `load step of ${formatNumber(load.size)} at t = ${formatNumber(load.time)} s`;
  const main = scenario.kind === "load-step" ? loadText : scenario.kind === "combined" ? `${setpoint}, ${loadText}` : setpoint;
  return scenario.noise ? `${main}, noise sd ${formatNumber(scenario.noise.sd)}` : main;
}

/**
 * Which variant a response is drawn on, in words: "" for a single plant, else e.g. "on Ember 400
 * (variant 2 of 3)".
 */
export function variantCaption(family: SweepDetailDto["family"], variant: number): string {
  if (family.length <= 1) return "";
  const label = family[variant]?.label ?? `variant ${variant + 1}`;
  return `on ${label} (variant ${variant + 1} of ${family.length})`;
}

/** A choice of the family's variant for the response and |S|, |T| (only for a family). */
function VariantChoice({ family, variant, onVariant }: { family: SweepDetailDto["family"]; variant: number; onVariant: (v: number) => void }) {
  return (
    <label className="mb-2 flex items-center gap-2 whitespace-nowrap text-sm">
      <span className="text-ink-soft">Simulated on</span>
      <select value={variant} onChange={(e) => onVariant(Number(e.target.value))} className={`${inputClass} w-auto max-w-56 py-1`} data-testid="response-variant">
        {family.map((v, i) => (
          <option key={`${v.revisionId}-${i}`} value={i}>
            {v.label}
          </option>
        ))}
      </select>
      <span className="text-xs text-ink-faint">
        variant {variant + 1} of {family.length}
      </span>
    </label>
  );
}

function CandidateResponse({
  slug,
  sweep,
  index,
  variant,
  onVariant,
}: {
  slug: string;
  sweep: SweepDetailDto;
  index: number | null;
  variant: number;
  onVariant: (v: number) => void;
}) {
  const family = sweep.family ?? [];
  const response = useCandidateResponse(slug, sweep.id, index, variant);
  const scenario = sweep.definition.scenario;
  const loadTime = scenario.kind === "setpoint-step" ? null : (scenario.load?.time ?? 0);
  const on = family.length > 1 ? ` on ${family[variant]?.label ?? `variant ${variant + 1}`}` : "";
  return (
    <Section title={index === null ? "Response" : `Response of candidate #${index}${on}`} aside={scenarioSummary(scenario)} testId="response-section">
      {index === null ? (
        <p className="py-10 text-center text-sm text-ink-soft" data-testid="response-empty">
          Click a point of the front, or a row of the table below, to see that candidate's closed-loop output y(t) against the setpoint r(t) and
          its controller output u(t) in this sweep's scenario{family.length > 1 ? ", on the variant of the family you choose" : ""}.
        </p>
      ) : (
        <>
          {family.length > 1 ? <VariantChoice family={family} variant={variant} onVariant={onVariant} /> : null}
          {response.isPending ? (
            <Loading label="Simulating the loop…" />
          ) : response.isError ? (
            <ErrorNote error={response.error} title="Could not simulate this candidate" />
          ) : (
            <>
              <dl className="mb-2 flex flex-wrap gap-x-5 gap-y-1 font-mono text-xs text-ink-soft">
                {Object.entries(response.data.params).map(([name, value]) => (
                  <div key={name}>
                    <dt className="inline">{name} = </dt>
                    <dd className="inline text-ink">{formatNumber(value)}</dd>
                  </div>
                ))}
              </dl>
              {response.data.status !== "stable" ? (
                <p className="mb-2 text-xs text-rust" data-testid="response-status">
                  {family.length > 1
                    ? `This candidate is ${response.data.status} on at least one variant; the trace shows how it behaves on this one.`
                    : `This candidate is ${response.data.status}; the trace shows how it fails.`}
                </p>
              ) : null}
              <ResponseChart t={response.data.t} r={response.data.r} y={response.data.y} u={response.data.u} loadTime={loadTime} />
            </>
          )}
        </>
      )}
    </Section>
  );
}

function CandidateSensitivity({ slug, sweep, index, variant }: { slug: string; sweep: SweepDetailDto; index: number | null; variant: number }) {
  const frequency = useCandidateFrequency(slug, sweep.id, index, true, variant);
  if (index === null) return null;
  const on = variantCaption(sweep.family ?? [], variant);
  return (
    <div>
      <Section title="Sensitivity |S| and complementary sensitivity |T|" aside={`candidate #${index}${on ? ` ${on}` : ""}, log–log`} testId="sensitivity-section">
        {frequency.isPending ? (
          <Loading label="Computing the frequency response…" />
        ) : frequency.isError ? (
          <ErrorNote error={frequency.error} title="Could not compute the frequency response" />
        ) : (
          <>
            {frequency.data.status !== "stable" ? (
              <p className="mb-2 text-xs text-rust">This candidate is {frequency.data.status}; its |S| and |T| mean nothing as robustness figures.</p>
            ) : null}
            <SensitivityChart omega={frequency.data.omega} S={frequency.data.S} T={frequency.data.T} invW={frequency.data.invW} />
            <p className="mt-2 text-xs text-ink-faint">
              |S| = |1/(1 + L)| is how much of a disturbance is left in the output at each frequency; its peak Ms is a robustness figure (smaller is
              more robust). |T| = |L/(1 + L)| is how the output follows the setpoint and how much sensor noise passes.
              {frequency.data.invW ? " The dashed 1/|W| is the bound the sweep's weight sets on |S|." : ""}
            </p>
          </>
        )}
      </Section>
    </div>
  );
}
