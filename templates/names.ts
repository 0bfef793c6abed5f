/** Criterion names as the engine words them, so page, sheet and results read alike. */
export { CRITERION_LABEL as CRITERION_NAMES } from "../src/engine/meanStress.ts";

export const CUTOUT_NAMES = {
  none: "none: plain skin, Kt = 1",
  "circular-hole": "circular hole",
  "elliptical-hole": "elliptical opening",
  "rounded-rectangle": "rectangular opening with rounded corners",
  outline: "opening of a given outline",
  given: "Kt given by the user",
} as const;

export const CRACK_NAMES = {
  "center-through": "through crack in the open skin (centre crack)",
  "edge-through": "through crack from a free edge",
  "hole-through": "through crack from the edge of a hole",
} as const;
