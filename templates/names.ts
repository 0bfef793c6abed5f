import type { MeanStressCriterion } from "../src/schema/index.ts";

/** Names as the sheet prints them. */
export const CRITERION_NAMES: Record<MeanStressCriterion, string> = {
  goodman: "Goodman (modified)",
  gerber: "Gerber",
  soderberg: "Soderberg",
  "asme-elliptic": "ASME elliptic",
  swt: "Smith–Watson–Topper",
  morrow: "Morrow",
  walker: "Walker",
};

export const CUTOUT_NAMES = {
  none: "none: plain skin, Kt = 1",
  "circular-hole": "circular hole",
  "elliptical-hole": "elliptical opening",
  given: "Kt given by the user",
} as const;

export const CRACK_NAMES = {
  "center-through": "through crack in the open skin (centre crack)",
  "edge-through": "through crack from a free edge",
  "hole-through": "through crack from the edge of a hole",
} as const;
