/**
 * One compartment as three lumped nodes, updated with the exact exponential step of
 * relax(): each node relaxes toward the conductance-weighted mean of its neighbours and
 * sources, neighbours held for the step (Gauss–Seidel order air → shell → contents). This is
 * stable for any step, so a 20 s step can carry an air node of well under a minute.
 * - air: the cabinet air, the probe and light fittings (1–3 kJ/K); the probe reads it;
 * - shell: liner, shelves and drawers (15–40 kJ/K), which take 90 % of the wall heat;
 * - contents: the food (tens to hundreds of kJ/K), reached only through the air;
 * - a fresh grocery load, while it lasts: its own node exchanging with the air.
 * A thermostat sensor in a plastic housing follows the air with a lag of several minutes
 * (common practice of control boards), which sets the length of the compressor cycles.
 * Food freezes and thaws between −2.5 and −0.5 °C: the latent heat of its water (334 kJ/kg;
 * 2 kJ/(kg·K) for frozen food, 40 % of the contents by mass being water that freezes, with
 * packaging and shelves the rest: common practice, from memory) is spread over that range as
 * extra heat capacity. That is what lets a full freezer hold for about two days without power
 * (USDA FSIS, "Keeping Food Safe During an Emergency": about 48 h full, 24 h half full; here a
 * full upright freezer starts to thaw after about 15 h and has thawed through after 3–4 days).
 */

export const WALL_SHARE_TO_AIR = 0.1;
const FREEZING_FROM_C = -2.5;
const FREEZING_TO_C = -0.5;
/** Latent heat per J/K of contents: (1 / 2000 J/(kg·K)) kg × 0.4 water × 334 kJ/kg. */
const LATENT_J_PER_CONTENTS_J_PER_K = (0.4 * 334_000) / 2000;
const LOAD_W_PER_K_PER_KG = 0.8;
const LOAD_MERGE_K = 0.3;
const LATENT_EXTRA_FACTOR = LATENT_J_PER_CONTENTS_J_PER_K / (FREEZING_TO_C - FREEZING_FROM_C);

export function relax(tempC: number, capacityJPerK: number, sumG: number, sumGTQ: number, dtS: number): number {
  return relaxWith(tempC, sumGTQ / sumG, Math.exp((-dtS * sumG) / capacityJPerK));
}

function relaxWith(tempC: number, equilibriumC: number, keep: number): number {
  return equilibriumC + (tempC - equilibriumC) * keep;
}

/** exp(−dt·G/C) remembered for the last (dt, G, C): shell and contents rarely change them. */
class DecayCache {
  private dtS = NaN;
  private sumG = NaN;
  private capacityJPerK = NaN;
  private keep = 1;

  factor(dtS: number, sumG: number, capacityJPerK: number): number {
    if (dtS !== this.dtS || sumG !== this.sumG || capacityJPerK !== this.capacityJPerK) {
      this.dtS = dtS;
      this.sumG = sumG;
      this.capacityJPerK = capacityJPerK;
      this.keep = Math.exp((-dtS * sumG) / capacityJPerK);
    }
    return this.keep;
  }
}

export interface CompartmentParams {
  airJPerK: number;
  shellJPerK: number;
  contentsJPerK: number;
  uaWPerK: number;
  airToShellWPerK: number;
  airToContentsWPerK: number;
  thermostatLagS: number;
}

/** Heat paths into the air node that change from step to step. */
export interface AirPaths {
  /** Extra conductance to the room (open door, torn gasket). */
  roomG: number;
  /** Fan stream arriving from the coil, and its temperature. */
  supplyG: number;
  supplyC: number;
  /** Natural convection to another body (coil or the other compartment's air). */
  otherG: number;
  otherC: number;
  /** Direct heat (fan motor, radiation from the defrost heater). */
  heatW: number;
}

export function newAirPaths(): AirPaths {
  return { roomG: 0, supplyG: 0, supplyC: 0, otherG: 0, otherC: 0, heatW: 0 };
}

export class Compartment {
  airC: number;
  shellC: number;
  contentsC: number;
  sensedC: number;
  extraContentsJPerK = 0;
  /** A fresh grocery load: its own node until it has cooled to the contents, then merged in. */
  loadC = 0;
  loadJPerK = 0;
  loadWPerK = 0;
  private readonly shellDecay = new DecayCache();
  private readonly contentsDecay = new DecayCache();
  private readonly lagDecay = new DecayCache();

  constructor(
    readonly params: CompartmentParams,
    startC: number,
  ) {
    this.airC = this.shellC = this.contentsC = this.sensedC = startC;
  }

  step(dtS: number, roomC: number, air: AirPaths, partitionG: number, partitionC: number): void {
    const p = this.params;
    const roomAirG = WALL_SHARE_TO_AIR * p.uaWPerK + air.roomG;
    const sumAirG = roomAirG + p.airToShellWPerK + p.airToContentsWPerK + air.supplyG + air.otherG + this.loadWPerK;
    const sumAirGT = roomAirG * roomC + p.airToShellWPerK * this.shellC + p.airToContentsWPerK * this.contentsC
      + air.supplyG * air.supplyC + air.otherG * air.otherC + air.heatW + this.loadWPerK * this.loadC;
    this.airC = relax(this.airC, p.airJPerK, sumAirG, sumAirGT, dtS);
    const wallG = (1 - WALL_SHARE_TO_AIR) * p.uaWPerK;
    const sumShellG = wallG + p.airToShellWPerK + partitionG;
    const sumShellGT = wallG * roomC + p.airToShellWPerK * this.airC + partitionG * partitionC;
    this.shellC = relaxWith(this.shellC, sumShellGT / sumShellG, this.shellDecay.factor(dtS, sumShellG, p.shellJPerK));
    let contentsJPerK = p.contentsJPerK + this.extraContentsJPerK;
    if (this.contentsC > FREEZING_FROM_C && this.contentsC < FREEZING_TO_C) contentsJPerK *= 1 + LATENT_EXTRA_FACTOR;
    if (this.loadJPerK > 0) this.stepLoad(dtS);
    const contentsKeep = this.contentsDecay.factor(dtS, p.airToContentsWPerK, contentsJPerK);
    this.contentsC = relaxWith(this.contentsC, this.airC, contentsKeep);
    this.sensedC = relaxWith(this.sensedC, this.airC, this.lagDecay.factor(dtS, 1, p.thermostatLagS));
  }

  /** Temperature of all the food, a fresh grocery load included (capacity-weighted). */
  get foodC(): number {
    if (this.loadJPerK === 0) return this.contentsC;
    const contentsJPerK = this.params.contentsJPerK + this.extraContentsJPerK;
    return (contentsJPerK * this.contentsC + this.loadJPerK * this.loadC) / (contentsJPerK + this.loadJPerK);
  }

  private stepLoad(dtS: number): void {
    this.loadC = relax(this.loadC, this.loadJPerK, this.loadWPerK, this.loadWPerK * this.airC, dtS);
    if (Math.abs(this.loadC - this.contentsC) > LOAD_MERGE_K) return;
    this.mergeIntoContents(this.loadJPerK, this.loadC);
    this.loadJPerK = this.loadWPerK = 0;
  }

  /** Groceries taken out at the contents' temperature: capacity shrinks, temperature stays. */
  eatGroceries(share: number): void {
    if (this.extraContentsJPerK === 0) return;
    this.extraContentsJPerK *= 1 - share;
    if (this.extraContentsJPerK < 1) this.extraContentsJPerK = 0;
  }

  /**
   * Warm groceries: a node of their own that exchanges with the air (bags and packs have much
   * surface: about 0.8 W/K per kg, common practice from memory) until it reaches the contents.
   */
  addLoad(kg: number, capacityJPerK: number, tempC: number): void {
    if (this.loadJPerK > 0) this.mergeIntoContents(this.loadJPerK, this.loadC);
    this.loadJPerK = capacityJPerK;
    this.loadWPerK = LOAD_W_PER_K_PER_KG * kg;
    this.loadC = tempC;
  }

  /** Mixes heat capacity at a temperature into the contents (energy-conserving). */
  private mergeIntoContents(capacityJPerK: number, tempC: number): void {
    const total = this.params.contentsJPerK + this.extraContentsJPerK;
    this.contentsC = (total * this.contentsC + capacityJPerK * tempC) / (total + capacityJPerK);
    this.extraContentsJPerK += capacityJPerK;
  }
}
