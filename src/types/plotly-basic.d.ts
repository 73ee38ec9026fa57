declare module 'plotly.js-basic-dist-min' {
  const Plotly: object;
  export default Plotly;
}
