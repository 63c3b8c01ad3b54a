import { Component, Suspense, lazy, type ReactNode } from "react";
import type { PlotParams } from "react-plotly.js/factory";

const PlotlyPlot = lazy(() => import("./plotly-plot.js"));

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
