/** The drawings' colors and lettering sizes: one palette for the plan's and the run sheet's drawings. */
export const PALETTE = {
  ink: '#0f172a',
  muted: '#64748b',
  road: '#94a3b8',
  tractor: '#cbd5e1',
  /** Trailer frame and decks. */
  trailer: '#475569',
  deckTop: '#e2e8f0',
  wheel: '#1e293b',
  load: '#fbbf24',
  loadStroke: '#b45309',
  dunnage: '#92400e',
  dim: '#1d4ed8',
  flag: '#ea580c',
  sign: '#facc15',
  red: '#dc2626',
  amber: '#f59e0b',
  paper: '#fff',
  border: '#e2e8f0',
} as const;

/** Widest the side and top views are drawn, in screen pixels. */
export const SIDE_MAX_PX = 1000;

/** Font size in drawing units: about 1/55 of the span, never under 10 px on screen. */
export const fontFor = (spanUnits: number, px: number) => Math.max(14, spanUnits / 55, (10 * spanUnits) / px);
