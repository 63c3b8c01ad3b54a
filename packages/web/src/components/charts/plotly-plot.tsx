// The heavy plotting bundle: imported only through lazy-plot.tsx so that it loads on the pages that draw.
import createPlotlyComponent from "react-plotly.js/factory";
import Plotly from "plotly.js-dist-min";

const PlotlyPlot = createPlotlyComponent(Plotly);

export default PlotlyPlot;
