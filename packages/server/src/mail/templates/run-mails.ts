import { renderMail, type RenderedMail } from "./mail-layout.js";

export interface RunFinishedData {
  workspaceName: string;
  /** The sweep's or comparison's name. */
  name: string;
  link: string;
  /** Facts worth a glance, e.g. [["Candidates", "1,200"], ["Plant", "Ember 200"]]. */
  facts?: [string, string][];
}

export interface RunFailedData extends RunFinishedData {
  /** What went wrong, as stored with the run. */
  error: string;
}

/** To a sweep's author: it has finished. */
export function sweepFinishedMail(data: RunFinishedData): RenderedMail {
  return renderMail(`Sweep finished: ${data.name}`, {
    heading: `Your sweep “${data.name}” in ${data.workspaceName} has finished.`,
    blocks: [...(data.facts?.length ? [{ facts: data.facts }] : []), { paragraph: "Its front and every candidate are ready on the sweep's page." }],
    action: { label: "Open the sweep", href: data.link },
  });
}

/** To a sweep's author: it has failed. */
export function sweepFailedMail(data: RunFailedData): RenderedMail {
  return renderMail(`Sweep failed: ${data.name}`, {
    heading: `Your sweep “${data.name}” in ${data.workspaceName} has failed.`,
    blocks: [...(data.facts?.length ? [{ facts: data.facts }] : []), { quote: data.error }, { paragraph: "The sweep's page shows what was stored before it stopped." }],
    action: { label: "Open the sweep", href: data.link },
  });
}

/** To a comparison's author: it has finished. */
export function comparisonFinishedMail(data: RunFinishedData): RenderedMail {
  return renderMail(`Comparison finished: ${data.name}`, {
    heading: `Your comparison “${data.name}” in ${data.workspaceName} has finished.`,
    blocks: [...(data.facts?.length ? [{ facts: data.facts }] : []), { paragraph: "The picks, their cross-score and the summary are ready on the comparison's page." }],
    action: { label: "Open the comparison", href: data.link },
  });
}

/** To a comparison's author: it has failed. */
export function comparisonFailedMail(data: RunFailedData): RenderedMail {
  return renderMail(`Comparison failed: ${data.name}`, {
    heading: `Your comparison “${data.name}” in ${data.workspaceName} has failed.`,
    blocks: [...(data.facts?.length ? [{ facts: data.facts }] : []), { quote: data.error }],
    action: { label: "Open the comparison", href: data.link },
  });
}
