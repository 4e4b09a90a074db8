/**
 * Wiring diagrams drawn from circuit files: ladder layout, symbols, a standalone SVG renderer.
 * Pure: no framework, no DOM. The Svelte component `$lib/components/WiringDiagram.svelte` draws the
 * same `Drawing`.
 */
export * from './model';
export { GRID, buildSymbol, legendSymbol, escapeXml } from './symbols';
export type { SymbolShape, SymbolPin, SymbolOptions } from './symbols';
export { layoutCircuit, DiagramLayoutError } from './layout';
export type { Drawing, DrawnPart, DrawnWire, DrawnFlag, DrawnLabel, LayoutOptions, LegendEntry, Box, Point } from './layout';
export {
	renderSvg,
	overlayMarkup,
	partMarkup,
	labelMarkup,
	legendMarkup,
	flagMarkup,
	pointsAttr,
	DIAGRAM_CSS,
	PALETTE,
	OVERLAY_STYLES
} from './render-svg';
export type { OverlaySet, RenderOptions } from './render-svg';
export { readDiagramCircuit, readLayoutHints, toDiagramCircuit, LayoutHintError } from './from-circuit';
export type { GalleryCircuit, GalleryState } from './gallery';
export { checkDrawing } from './geometry';
export { nearestTarget, distanceToBox, distanceToPolyline } from './hit';
export type { HitCandidates } from './hit';
