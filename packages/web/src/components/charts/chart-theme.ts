/** Colours and base layout shared by every Loopyard chart (the palette of styles.css). */
export const CHART_COLORS = {
  ink: "#22262b",
  inkSoft: "#5a5f66",
  faint: "#8a8d90",
  cloud: "#b9b5a8",
  grid: "#e8e5dc",
  line: "#d9d6cc",
  moss: "#2f6b4f",
  slate: "#4f6f8f",
  rust: "#9b2c2c",
} as const;

export const CHART_FONT = { family: "Inter, ui-sans-serif, system-ui, sans-serif", size: 12, color: CHART_COLORS.ink };

/** Axis style: hairline grid, no zero line emphasis, monospace tick labels. */
export function axis(title: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    title: { text: title, font: { size: 12, color: CHART_COLORS.inkSoft } },
    gridcolor: CHART_COLORS.grid,
    linecolor: CHART_COLORS.line,
    zerolinecolor: CHART_COLORS.line,
    tickfont: { family: "JetBrains Mono, ui-monospace, monospace", size: 11, color: CHART_COLORS.inkSoft },
    automargin: true,
    ...extra,
  };
}

export function baseLayout(extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    autosize: true,
    paper_bgcolor: "rgba(0,0,0,0)",
    plot_bgcolor: "#ffffff",
    font: CHART_FONT,
    margin: { l: 56, r: 16, t: 12, b: 44 },
    hoverlabel: { font: { family: "JetBrains Mono, ui-monospace, monospace", size: 11, color: CHART_COLORS.ink }, bgcolor: "#ffffff", bordercolor: CHART_COLORS.line },
    legend: { orientation: "h", x: 0, y: 1.08, font: { size: 11 } },
    ...extra,
  };
}

/** Plotly options: no logo, no cloud links, a trimmed tool strip. */
export const CHART_CONFIG = {
  displaylogo: false,
  responsive: true,
  showLink: false,
  showSendToCloud: false,
  showEditInChartStudio: false,
  modeBarButtonsToRemove: ["select2d", "lasso2d", "autoScale2d", "toggleSpikelines"],
};
