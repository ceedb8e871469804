export { describeDiff, diffChart, diffProofCharts, type ChartDiff, type NamedChart } from "./diff";
