// The heavy plotting bundle: imported only through lazy-plot.tsx so that it loads on the pages that draw.
// plotly's strict bundle: its WebGL traces (the sweep page's scattergl cloud) come with their draw
// calls compiled ahead of time, so the pages need no 'unsafe-eval' in their Content-Security-Policy.
import createPlotlyComponent from "react-plotly.js/factory";
import Plotly from "plotly.js-strict-dist-min";

const PlotlyPlot = createPlotlyComponent(Plotly);

export default PlotlyPlot;
