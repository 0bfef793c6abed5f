import { fmt, step, type Step } from "./step.ts";

/**
 * ICAO Standard Atmosphere (ICAO Doc 7488; ISO 2533:1975), geopotential altitude:
 * troposphere to 11 000 m with lapse rate 0.0065 K/m, isothermal layer at 216.65 K from 11 000 to 20 000 m.
 * p = p0·(T/T0)^(g0/(R·L)) below 11 km; p = p11·exp(−g0·(h − 11 000)/(R·T11)) above.
 */
const P0_PA = 101325;
const T0_K = 288.15;
const LAPSE_K_PER_M = 0.0065;
const G0 = 9.80665;
const R_AIR = 287.05287;
const H_TROPOPAUSE_M = 11000;
const T11_K = T0_K - LAPSE_K_PER_M * H_TROPOPAUSE_M;
const EXPONENT = G0 / (R_AIR * LAPSE_K_PER_M);
const P11_PA = P0_PA * (T11_K / T0_K) ** EXPONENT;

export function isaPressure_Pa(altitude_m: number): number {
  if (altitude_m <= H_TROPOPAUSE_M) return P0_PA * ((T0_K - LAPSE_K_PER_M * altitude_m) / T0_K) ** EXPONENT;
  return P11_PA * Math.exp((-G0 * (altitude_m - H_TROPOPAUSE_M)) / (R_AIR * T11_K));
}

const ISA = "ICAO Standard Atmosphere (ICAO Doc 7488 / ISO 2533), geopotential altitude";

function pressureStep(id: string, what: string, h: number): Step {
  const p = isaPressure_Pa(h);
  return h <= H_TROPOPAUSE_M
    ? step(
        id,
        `Standard-atmosphere pressure at ${what}`,
        "p = p₀·(1 − L·h/T₀)^(g₀/(R·L))",
        `p = 101325 × (1 − 0.0065 × ${fmt(h)}/288.15)^5.2559`,
        p,
        "Pa",
        ISA,
      )
    : step(
        id,
        `Standard-atmosphere pressure at ${what}`,
        "p = p₁₁·exp(−g₀·(h − 11000)/(R·T₁₁))",
        `p = ${fmt(P11_PA, 6)} × exp(−9.80665 × (${fmt(h)} − 11000)/(287.05 × 216.65))`,
        p,
        "Pa",
        ISA,
      );
}

/** Cabin-minus-outside differential (MPa) with its steps. */
export function cabinDifferential(flight_m: number, cabin_m: number): { differential_MPa: number; steps: Step[] } {
  const outside = isaPressure_Pa(flight_m);
  const cabin = isaPressure_Pa(cabin_m);
  const differential_MPa = (cabin - outside) / 1e6;
  return {
    differential_MPa,
    steps: [
      pressureStep("isa-flight", `the flight altitude (${fmt(flight_m)} m)`, flight_m),
      pressureStep("isa-cabin", `the cabin altitude (${fmt(cabin_m)} m)`, cabin_m),
      step(
        "differential",
        "Cabin pressure differential",
        "Δp = p_cabin − p_outside",
        `Δp = (${fmt(cabin, 6)} − ${fmt(outside, 6)}) / 10⁶`,
        differential_MPa,
        "MPa",
        ISA,
      ),
    ],
  };
}
