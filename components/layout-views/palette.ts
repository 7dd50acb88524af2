/** The drawing palette: graphite ink, the deep teal accent, a brick red for conflict, and the service layers. */
export const palette = {
  ink: "#2b2d2f",
  inkSoft: "#55595d",
  paper: "#fdfbf6",
  accent: "#0f5b5c",
  conflict: "#a3271f",
  flexure: "#3f5f7a",
  flexureFill: "#dfe7ee",
  thermal: "#8a5a12",
  repeatability: "#6b3f8a",
  outline: "#8d8a80",
  outlineFill: "rgba(60, 58, 52, 0.04)",
} as const;
