/**
 * Palmgren–Miner linear damage summation.
 *
 * Each counted cycle i, occurring nᵢ times per pass through the load history, uses up the
 * fraction nᵢ/Nᵢ of the life, Nᵢ being the constant-amplitude life at its range and mean:
 *   D = Σ nᵢ/Nᵢ per pass; failure is expected when the summed damage reaches 1, i.e. after
 *   B = 1/D passes (Miner, "Cumulative damage in fatigue", J. Appl. Mech. 12 (1945) A159–A164;
 *   Dowling, Mechanical Behavior of Materials, ch. 9, Palmgren–Miner rule for repeated histories).
 * Validity: the rule ignores load sequence; real damage at failure scatters widely about 1.
 */
import { fmt, step, type Step } from "./step.ts";
import type { Cycle } from "./rainflow.ts";

export interface DamageContribution extends Cycle {
  /** Constant-amplitude life at this cycle's range and mean. */
  life_cycles: number;
  /** nᵢ/Nᵢ. */
  damage: number;
  /** This cycle's fraction of the damage per pass. */
  share: number;
}

export interface MinerResult {
  damagePerPass: number;
  /** 1/D; null when no cycle does damage. */
  passesToFailure: number | null;
  /** The most damaging cycles, largest first. */
  contributions: DamageContribution[];
  /** Cycle count whose life is unlimited (below the fatigue limit or cut-off). */
  cyclesWithoutDamage: number;
  steps: Step[];
}

const MINER = "Palmgren–Miner rule: Miner, J. Appl. Mech. 12 (1945) A159; Dowling, Mechanical Behavior of Materials, ch. 9";

/**
 * Sum the damage of counted cycles. `lifeOf(range, mean)` gives cycles to failure, or null
 * where the life is unlimited. `top` limits the contributions listed (default 10).
 */
export function minerDamage(cycles: Cycle[], lifeOf: (range: number, mean: number) => number | null, top = 10): MinerResult {
  const all: DamageContribution[] = [];
  let damagePerPass = 0;
  let cyclesWithoutDamage = 0;
  for (const c of cycles) {
    if (!(c.count >= 0)) throw new RangeError(`minerDamage: a cycle count must not be negative (got ${c.count})`);
    const life = lifeOf(c.range, c.mean);
    if (life === null) {
      cyclesWithoutDamage += c.count;
      continue;
    }
    if (!(life > 0)) throw new RangeError(`minerDamage: the life at range ${c.range} must be positive (got ${life})`);
    const damage = c.count / life;
    damagePerPass += damage;
    all.push({ ...c, life_cycles: life, damage, share: 0 });
  }
  all.sort((p, q) => q.damage - p.damage);
  const contributions = all.slice(0, top).map((c) => ({ ...c, share: damagePerPass > 0 ? c.damage / damagePerPass : 0 }));
  const passesToFailure = damagePerPass > 0 ? 1 / damagePerPass : null;

  const terms = contributions.slice(0, 4).map((c) => `${fmt(c.count)}/${fmt(c.life_cycles)}`);
  const more = all.length > 4 ? ` + … (${all.length} damaging cycles)` : "";
  const steps = [
    step(
      "miner-damage",
      "Fatigue damage per pass through the load history",
      "D = Σ nᵢ/Nᵢ",
      `D = ${terms.length ? terms.join(" + ") : "0"}${more}`,
      damagePerPass,
      "—",
      MINER,
    ),
    step(
      "miner-passes",
      "Passes to failure (damage sum reaching 1)",
      "B = 1/D",
      passesToFailure === null ? "B = 1/0 (no damaging cycle)" : `B = 1/${fmt(damagePerPass)}`,
      passesToFailure,
      "passes",
      MINER,
    ),
  ];
  return { damagePerPass, passesToFailure, contributions, cyclesWithoutDamage, steps };
}
