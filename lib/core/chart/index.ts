// The colourwork chart core: model, exchange format, operations, lettering, motifs, counts, rendering.
export * from "./model";
export { chartV1Schema, ChartFormatError, parseChart, serializeChart, type ChartV1, type ChartFormatIssue } from "./format";
export * from "./ops";
export * from "./history";
export * from "./layered-design";
export * from "./counts";
export * from "./motifs";
export { FONTS, FONT_IDS, LetteringError, getFont, layoutText, letter, measureText, renderText, type TextMask } from "./lettering/letter";
export type { FontId, PixelFont } from "./lettering/pixel-font";
export { escapeXml, renderChartSvg, renderPreviewSvg, type ChartSvgOptions, type PreviewSvgOptions } from "./render-svg";
export { getRowPx, rasterizeChart, type RasterImage, type RasterOptions } from "./raster";
