import { Component, Suspense, lazy, type ReactNode } from "react";
import type { PlotParams } from "react-plotly.js/factory";

type PlotModule = typeof import("./plotly-plot.js");

let plotlyModule: Promise<PlotModule> | undefined;
/** The plotting component once its bundle has loaded. */
let loadedPlot: PlotModule["default"] | undefined;

/**
 * Starts loading the plotting bundle (once) without waiting for it. Pages that will draw call it on
 * mount, so the bundle downloads and compiles while their data is still being fetched.
 */
export function preloadPlot(): Promise<PlotModule> {
  plotlyModule ??= import("./plotly-plot.js").then((module) => {
    loadedPlot = module.default;
    return module;
  });
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

/**
 * A plotly figure, loaded on first use; shows a placeholder of the same height meanwhile. Once the
 * bundle is in, the figure renders straight away: a lazy component suspends on its first render even
 * when its module has loaded, and React holds a revealed Suspense boundary back for up to 300 ms.
 */
export function LazyPlot({ height, ...props }: PlotParams & { height: number }) {
  if (loadedPlot) {
    const Loaded = loadedPlot;
    return (
      <ChartBoundary>
        <Loaded useResizeHandler style={{ width: "100%", height }} {...props} />
      </ChartBoundary>
    );
  }
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
