// plotly.js-strict-dist-min ships no types; the app only hands the module to react-plotly.js/factory.
declare module "plotly.js-strict-dist-min" {
  const Plotly: object;
  export default Plotly;
}
