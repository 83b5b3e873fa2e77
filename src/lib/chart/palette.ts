/**
 * Spreadsight's colours for charts, as plain values (the same as the `@theme` block in
 * src/index.css). Charts set them as SVG attributes so that an exported SVG or PNG looks
 * the same outside the page.
 */
export const palette = {
  paper: "#f4eee2",
  paperDeep: "#e9e0cd",
  card: "#fbf8f1",
  rule: "#d6cab2",
  ink: "#12484a",
  inkSoft: "#3f6b6c",
  inkFaint: "#7c9697",
  inkDeep: "#0b2f30",
  ochre: "#b8862b",
  ochreSoft: "#f3e3bf",
  brick: "#9c3b2c",
  brickSoft: "#f2d6cf",
  moss: "#4f7a3a",
  mossSoft: "#dce9cf",
} as const;

export const chartFont = "'IBM Plex Sans', ui-sans-serif, system-ui, sans-serif";
export const chartMono = "'IBM Plex Mono', ui-monospace, monospace";

/**
 * One colour per arrival: index 0 the direct wave, then the head wave along the top of
 * layer 2, 3, … Our own sequence, chosen to stay apart on warm paper.
 */
const ARRIVAL_COLOURS = [
  palette.inkDeep,
  palette.ochre,
  palette.moss,
  "#6a4c7d",
  "#2f7d8c",
  "#8a5a2b",
  "#51612a",
  "#a04e6a",
  "#3a5f8f",
  "#7d7a2e",
  "#5b3f2f",
  "#2e6b55",
];

/** Colour of an arrival by layer number: 1 = direct wave, L ≥ 2 = head wave of layer L. */
export function arrivalColour(layer: number): string {
  return ARRIVAL_COLOURS[(Math.max(1, layer) - 1) % ARRIVAL_COLOURS.length];
}

/** Colours for up to four scenarios overlaid in Side by side. */
export const SCENARIO_COLOURS = [palette.inkDeep, palette.ochre, "#2f7d8c", palette.brick];
