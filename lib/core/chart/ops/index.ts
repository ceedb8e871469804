// Every chart operation is pure: it returns a new Chart and leaves its input untouched, so undo is
// keeping the previous value (see ../history.ts).
export { paintCell, paintCells, replaceColour } from "./paint";
export { floodFill } from "./flood-fill";
export { drawLine, getLinePoints } from "./line";
export { drawRect } from "./rect";
export { copyRegion, cropChart, moveRegion, stampChart } from "./region";
export { flipHorizontal, flipVertical } from "./flip";
export { ANCHORS, resizeChart, type Anchor } from "./resize";
export { tileRepeat } from "./tile";
export { motifToChart, placeMotif, tileMotif, type MotifColours } from "./place-motif";
export { placeLettering, type LetteringPlacement } from "./place-lettering";
