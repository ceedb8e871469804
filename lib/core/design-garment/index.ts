// A design's charts read on its commission's garment (see read-design.ts), and the shape of an
// area's chart (which cells are real stitches).
export { areaSlug, chartDarn, matchArea, piecesOf, readDesignOnGarment, type ChartProblem, type DesignChartOnGarment, type DesignOnGarment, type ReadDesignOptions } from "./read-design";
export { areaShapeMask, findPaintOutsideShape, hasOutsideCells, outsideMessage, rowShape, type AreaShape } from "./shape";
export { roundRuns, type RoundRun } from "./rounds";
export { checkPins, pinParts, storedPins, type PinContext, type PinProblem } from "./pins";
