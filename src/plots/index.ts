/** Server-rendered SVG plots for the web page and the printed check sheet. */
export { haighDiagram, type HaighData } from "./haigh.ts";
export type { MeanStressCriterion } from "../engine/constantLife.ts";
export type { PlotOptions, StressUnit, LengthUnit } from "./units.ts";
export { escapeXml } from "./svgText.ts";
export { snCurve, type SnData } from "./sn.ts";
export { lifeThicknessPlot, type LifeThicknessData } from "./lifeThickness.ts";
export { crackGrowthPlot, type CrackGrowthData } from "./crackGrowth.ts";
export { spectrumPlot, type SpectrumData } from "./spectrum.ts";
export { edgeStressPlot, openingPicture, type OpeningPictureData } from "./opening.ts";
export { fleetPlot, type FleetPlotData } from "./fleet.ts";
export { shellPicture, type ShellPictureData } from "./shell.ts";
export { weldedSnCurve, type WeldedSnData } from "./weldedSn.ts";
export { weldDetailSketch } from "./weldDetail.ts";
