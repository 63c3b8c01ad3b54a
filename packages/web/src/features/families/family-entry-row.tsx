import type { PlantSummaryDto } from "@loopyard/core";
import { useEffect } from "react";
import { usePlant } from "../../api/use-plants.js";
import { Button } from "../../components/button.js";
import { Field, inputClass } from "../../components/field.js";
import type { FamilyEntryValues } from "./family-form-values.js";

/** One entry of the family form: plant, revision, label, fixed parameter values and, for a nonlinear plant, a spread. */
export function FamilyEntryRow({
  index,
  slug,
  plants,
  value,
  problems,
  onChange,
  onRemove,
}: {
  index: number;
  slug: string;
  plants: readonly PlantSummaryDto[];
  value: FamilyEntryValues;
  problems: string[];
  onChange: (next: FamilyEntryValues) => void;
  onRemove: (() => void) | null;
}) {
  const plant = usePlant(slug, value.plantId || undefined);
  const nonlinear = plant.data?.revision.model.kind === "nonlinear";
  const parameterNames = plant.data?.revision.model.kind === "nonlinear" ? Object.keys(plant.data.revision.model.parameters) : [];
  // A newly chosen plant starts at its latest revision.
  useEffect(() => {
    if (plant.data && !plant.data.revisions.some((r) => r.id === value.plantRevisionId)) {
      onChange({ ...value, plantRevisionId: plant.data.plant.latestRevision.id });
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plant.data]);
  const set = (patch: Partial<FamilyEntryValues>) => onChange({ ...value, ...patch });
  const setSpread = (patch: Partial<FamilyEntryValues["spread"]>) => set({ spread: { ...value.spread, ...patch } });
  const id = `family-entry-${index}`;
  return (
    <div className="rounded-md border border-line-soft bg-white/60 p-3" data-testid="family-entry">
      <div className="grid grid-cols-1 items-start gap-3 sm:grid-cols-[1fr_7rem_1fr_auto]">
        <Field label={`Entry ${index + 1}: plant`} htmlFor={`${id}-plant`} name={`${id}-plant`}>
          <select id={`${id}-plant`} className={inputClass} value={value.plantId} onChange={(e) => set({ plantId: e.target.value, label: plants.find((p) => p.id === e.target.value)?.name ?? value.label })} data-testid={`${id}-plant`}>
            {plants.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
        </Field>
        <Field label="Revision" htmlFor={`${id}-revision`} name={`${id}-revision`}>
          <select id={`${id}-revision`} className={inputClass} value={value.plantRevisionId} onChange={(e) => set({ plantRevisionId: e.target.value })}>
            {plant.data ? (
              [...plant.data.revisions]
                .sort((a, b) => b.number - a.number)
                .map((r) => (
                  <option key={r.id} value={r.id}>
                    rev {r.number}
                  </option>
                ))
            ) : (
              <option value={value.plantRevisionId}>…</option>
            )}
          </select>
        </Field>
        <Field label="Label" htmlFor={`${id}-label`} name={`${id}-label`} hint="how the variant is named in results">
          <input id={`${id}-label`} className={inputClass} value={value.label} onChange={(e) => set({ label: e.target.value })} data-testid={`${id}-label`} />
        </Field>
        {onRemove ? (
          <Button tone="plain" className="mt-5" onClick={onRemove} aria-label={`Remove entry ${index + 1}`}>
            Remove
          </Button>
        ) : (
          <span />
        )}
      </div>
      {nonlinear ? (
        <div className="mt-3 space-y-3">
          <Field label="Fixed parameter values" htmlFor={`${id}-parameters`} name={`${id}-parameters`} hint={`name = value, separated by commas; the plant has ${parameterNames.join(", ")}`}>
            <input id={`${id}-parameters`} className={`${inputClass} font-mono`} value={value.parameters} onChange={(e) => set({ parameters: e.target.value })} placeholder="e.g. Ta = 303" />
          </Field>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" className="accent-moss" checked={value.spreadOn} onChange={(e) => set({ spreadOn: e.target.checked })} data-testid={`${id}-spread-on`} />
            Manufacturing spread: generate variants from ranges of its parameters
          </label>
          {value.spreadOn ? (
            <div className="space-y-2 rounded border border-line-soft p-3" data-testid={`${id}-spread`}>
              <div className="flex flex-wrap items-end gap-3">
                <Field label="Design" htmlFor={`${id}-design`} name={`${id}-design`}>
                  <select id={`${id}-design`} className={inputClass} value={value.spread.design} onChange={(e) => setSpread({ design: e.target.value as FamilyEntryValues["spread"]["design"] })}>
                    <option value="grid">grid (every combination of the counts)</option>
                    <option value="latin-hypercube">Latin hypercube (seeded sample)</option>
                    <option value="random">random (seeded sample)</option>
                  </select>
                </Field>
                {value.spread.design !== "grid" ? (
                  <>
                    <Field label="Variants" htmlFor={`${id}-count`} name={`${id}-count`}>
                      <input id={`${id}-count`} className={`${inputClass} w-20 font-mono`} value={value.spread.count} onChange={(e) => setSpread({ count: e.target.value })} />
                    </Field>
                    <Field label="Seed" htmlFor={`${id}-seed`} name={`${id}-seed`}>
                      <input id={`${id}-seed`} className={`${inputClass} w-24 font-mono`} value={value.spread.seed} onChange={(e) => setSpread({ seed: e.target.value })} />
                    </Field>
                  </>
                ) : null}
              </div>
              {value.spread.rows.map((row, r) => (
                <div key={r} className="grid grid-cols-[1fr_1fr_1fr_5rem_auto] items-end gap-2">
                  {(["name", "min", "max", "count"] as const).map((key) =>
                    key === "count" && value.spread.design !== "grid" ? (
                      <span key={key} />
                    ) : (
                      <Field key={key} label={r === 0 ? key : ""} htmlFor={`${id}-row-${r}-${key}`} name={`${id}-row-${r}-${key}`}>
                        {key === "name" ? (
                          <select
                            id={`${id}-row-${r}-${key}`}
                            className={`${inputClass} font-mono`}
                            value={row.name}
                            onChange={(e) => setSpread({ rows: value.spread.rows.map((x, j) => (j === r ? { ...x, name: e.target.value } : x)) })}
                          >
                            <option value="">choose…</option>
                            {parameterNames.map((n) => (
                              <option key={n} value={n}>
                                {n}
                              </option>
                            ))}
                          </select>
                        ) : (
                          <input
                            id={`${id}-row-${r}-${key}`}
                            className={`${inputClass} font-mono`}
                            value={row[key]}
                            onChange={(e) => setSpread({ rows: value.spread.rows.map((x, j) => (j === r ? { ...x, [key]: e.target.value } : x)) })}
                          />
                        )}
                      </Field>
                    ),
                  )}
                  <Button tone="plain" onClick={() => setSpread({ rows: value.spread.rows.filter((_, j) => j !== r) })} disabled={value.spread.rows.length === 1} aria-label={`Remove spread parameter ${r + 1}`}>
                    ×
                  </Button>
                </div>
              ))}
              <Button tone="quiet" onClick={() => setSpread({ rows: [...value.spread.rows, { name: "", min: "", max: "", count: "2" }] })}>
                Spread another parameter
              </Button>
            </div>
          ) : null}
        </div>
      ) : null}
      {problems.length > 0 ? (
        <ul role="alert" className="mt-2 space-y-0.5 text-xs text-rust" data-testid={`${id}-problems`}>
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
