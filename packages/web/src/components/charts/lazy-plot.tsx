import { Component, Suspense, lazy, type ReactNode } from "react";
import type { PlotParams } from "react-plotly.js/factory";

let plotlyModule: Promise<typeof import("./plotly-plot.js")> | undefined;

/**
 * Starts loading the plotting bundle (once) without waiting for it. Pages that will draw call it on
 * mount, so the bundle downloads and compiles while their data is still being fetched.
 */
export function preloadPlot(): Promise<typeof import("./plotly-plot.js")> {
  plotlyModule ??= import("./plotly-plot.js");
  return plotlyModule;
}

const PlotlyPlot = lazy(preloadPlot);

class ChartBoundary extends Component<{ children: ReactNode }, { failed: Error | null }> {
  override state = { failed: null as Error | null };
  static getDerivedStateFromError(error: Error) {
    return { failed: error };
  }
  override render() {
    if (this.state.failed) {
      return (
        <p role="alert" className="py-6 text-sm text-rust">
          The chart could not be drawn ({this.state.failed.message}). Reload the page; the numbers in the table stay valid.
        </p>
      );
    }
    return this.props.children;
  }
}

/** A plotly figure, loaded on first use; shows a placeholder of the same height meanwhile. */
export function LazyPlot({ height, ...props }: PlotParams & { height: number }) {
  return (
    <ChartBoundary>
      <Suspense
        fallback={
          <div role="status" className="flex items-center justify-center text-sm text-ink-faint" style={{ height }}>
            Loading chart…
          </div>
        }
      >
        <PlotlyPlot useResizeHandler style={{ width: "100%", height }} {...props} />
      </Suspense>
    </ChartBoundary>
  );
}
