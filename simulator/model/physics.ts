/**
 * Lumped thermal network of a refrigerator/freezer: two compartments (compartment.ts: air,
 * shell, contents) and the evaporator coil with its frost, integrated with the same exact
 * exponential node update; nothing is allocated per step.
 *
 * Heat paths besides those inside a compartment:
 * - the partition joins the two shells;
 * - the fan stream (mass flow × cp) passes the coil with effectiveness 0.85 (less when
 *   frosted) and is split between the freezer and, through the damper, the fresh-food section;
 * - the compressor is a conductance to a −45 °C sink sized so that it lifts `capacity` watts at
 *   a −25 °C coil: capacity rises with coil temperature and falls about 1.2 %/K of room
 *   temperature above 25 °C (common practice for small hermetic compressors, from memory);
 * - natural convection from the coil to its compartment's air, and through the ducts from the
 *   coil chamber (half coil, half freezer air) to the fresh-food air while no fan stream flows;
 * - the defrost heater warms the coil (15 % straight into the freezer air by radiation); frost
 *   melts at 0 °C taking 334 kJ/kg (latent heat of fusion of ice, a physical constant).
 * Frost chokes the fresh-food duct first (from 0.5 kg, nearly shut at 1.6 kg), the freezer path
 * later (1.2–3.5 kg) and cuts the coil's effectiveness by up to 60 %; the figures are chosen so
 * a dead heater shows in the fresh-food section 1–4 days later (common practice).
 */
import type { ApplianceProfile } from './types';
import { AirPaths, Compartment, newAirPaths, relax } from './compartment';

const COIL_METAL_J_PER_K = 2500;
const ICE_J_PER_KG_K = 2100;
const ICE_LATENT_J_PER_KG = 334_000;
const COIL_EFFECTIVENESS_CLEAN = 0.85;
const COMPRESSOR_REF_COIL_C = -25;
const COMPRESSOR_SINK_C = -45;
const CAPACITY_LOSS_PER_ROOM_K = 0.012;
const HEATER_SHARE_TO_AIR = 0.15;
const FAN_HEAT_W = 3;
const DOOR_FROST_KG_PER_OPEN_S = 0.00008;
const SEAL_FROST_KG_PER_DAY = 0.4;
const GROCERY_EATEN_TAU_S = 4 * 86_400;
const CLOSED_DUCT_NATURAL_SHARE = 0.3;

/** What the controls and faults set for one step. */
export interface StepInputs {
  roomC: number;
  freshDoorOpenS: number;
  freezerDoorOpenS: number;
  compressorRunning: boolean;
  fanRunning: boolean;
  heaterOn: boolean;
  damperOpen: boolean;
  fanAirflowFactor: number;
  capacityFactor: number;
  condenserHotLossPerK: number;
  heaterFactor: number;
  damperClosed: number;
  sealLeak: number;
}

export function newStepInputs(): StepInputs {
  return {
    roomC: 22,
    freshDoorOpenS: 0,
    freezerDoorOpenS: 0,
    compressorRunning: false,
    fanRunning: false,
    heaterOn: false,
    damperOpen: false,
    fanAirflowFactor: 1,
    capacityFactor: 1,
    condenserHotLossPerK: 0,
    heaterFactor: 1,
    damperClosed: 0,
    sealLeak: 0,
  };
}

/** 1 = damper fully open, 0 = closed (by the controls or stuck by a fault). */
function damperOpening(s: StepInputs): number {
  return s.damperOpen ? 1 - s.damperClosed : 0;
}

/** 0 below `start`, 1 above `full`, smooth in between. */
function smoothStep(value: number, start: number, full: number): number {
  if (value <= start) return 0;
  if (value >= full) return 1;
  const x = (value - start) / (full - start);
  return x * x * (3 - 2 * x);
}

export class Cabinet {
  readonly fresh: Compartment;
  readonly freezer: Compartment;
  coilC: number;
  iceKg = 0;
  private readonly freshPaths: AirPaths = newAirPaths();
  private readonly freezerPaths: AirPaths = newAirPaths();

  constructor(
    private readonly p: ApplianceProfile,
    private readonly hasFresh: boolean,
    private readonly hasFreezer: boolean,
  ) {
    this.fresh = new Compartment(
      {
        airJPerK: p.freshFoodAirJPerK,
        shellJPerK: p.freshFoodShellJPerK,
        contentsJPerK: p.freshFoodContentsJPerK,
        uaWPerK: p.freshFoodUaWPerK,
        airToShellWPerK: p.freshFoodAirToShellWPerK,
        airToContentsWPerK: p.freshFoodAirToContentsWPerK,
        thermostatLagS: p.freshFoodThermostatLagS,
      },
      p.freshFoodSetpointC,
    );
    this.freezer = new Compartment(
      {
        airJPerK: p.freezerAirJPerK,
        shellJPerK: p.freezerShellJPerK,
        contentsJPerK: p.freezerContentsJPerK,
        uaWPerK: p.freezerUaWPerK,
        airToShellWPerK: p.freezerAirToShellWPerK,
        airToContentsWPerK: p.freezerAirToContentsWPerK,
        thermostatLagS: p.freezerThermostatLagS,
      },
      p.freezerSetpointC,
    );
    this.coilC = (hasFreezer ? p.freezerSetpointC : p.freshFoodSetpointC) - 3;
  }

  /** Share of the fan stream reaching the fresh-food section, before frost. */
  private freshShare(s: StepInputs): number {
    if (!this.hasFresh) return 0;
    if (!this.hasFreezer) return 1;
    return this.p.damperLeakShare + (this.p.freshFoodAirShare - this.p.damperLeakShare) * damperOpening(s);
  }

  private compressorConductance(s: StepInputs): number {
    if (!s.compressorRunning) return 0;
    const hotK = Math.max(0, s.roomC - 24);
    const roomFactor = 1 - CAPACITY_LOSS_PER_ROOM_K * (s.roomC - 25) - s.condenserHotLossPerK * hotK;
    const capacityW = this.p.compressorCapacityW * s.capacityFactor * Math.min(1.3, Math.max(0.1, roomFactor));
    return capacityW / (COMPRESSOR_REF_COIL_C - COMPRESSOR_SINK_C);
  }

  step(dtS: number, s: StepInputs): void {
    const p = this.p;
    const freshBlock = 1 - 0.97 * smoothStep(this.iceKg, 0.5, 1.6);
    const freezerBlock = 1 - 0.95 * smoothStep(this.iceKg, 1.2, 3.5);
    const effectiveness = COIL_EFFECTIVENESS_CLEAN * (1 - 0.6 * smoothStep(this.iceKg, 0.5, 3.5));
    const fanG = p.hasEvaporatorFan && s.fanRunning ? p.evaporatorAirflowWPerK * s.fanAirflowFactor : 0;
    const toFreshG = fanG * this.freshShare(s) * freshBlock;
    const toFreezerG = this.hasFreezer ? fanG * (this.hasFresh ? 1 - p.freshFoodAirShare : 1) * freezerBlock : 0;
    const throughG = toFreshG + toFreezerG;
    const mixC = throughG > 0 ? (toFreshG * this.fresh.airC + toFreezerG * this.freezer.airC) / throughG : 0;
    const coilAir = this.hasFreezer ? this.freezer : this.fresh;
    const both = this.hasFresh && this.hasFreezer;
    // A closed damper also blocks most of the natural flow through the duct.
    const ductOpening = CLOSED_DUCT_NATURAL_SHARE + (1 - CLOSED_DUCT_NATURAL_SHARE) * damperOpening(s);
    const ductG = both && throughG === 0 ? p.ductNaturalWPerK * freshBlock * ductOpening : 0;
    const supplyC = this.stepCoil(dtS, s, throughG, effectiveness, mixC, coilAir.airC, ductG / 2);
    const doorFactor = 1 + 3 * s.sealLeak;
    if (this.hasFresh) {
      const a = this.freshPaths;
      a.roomG = (p.freshFoodDoorExchangeWPerK * doorFactor * s.freshDoorOpenS) / dtS + s.sealLeak * p.freshFoodUaWPerK;
      a.supplyG = toFreshG;
      a.supplyC = supplyC;
      a.otherG = both ? ductG : p.coilNaturalWPerK;
      // Cold air sinks from the coil chamber through the duct: half coil, half freezer air.
      a.otherC = both ? 0.5 * (this.coilC + this.freezer.airC) : this.coilC;
      a.heatW = !this.hasFreezer && fanG > 0 ? FAN_HEAT_W : 0;
      this.fresh.step(dtS, s.roomC, a, both ? p.partitionUaWPerK : 0, this.freezer.shellC);
    }
    if (this.hasFreezer) {
      const a = this.freezerPaths;
      a.roomG = (p.freezerDoorExchangeWPerK * doorFactor * s.freezerDoorOpenS) / dtS + s.sealLeak * p.freezerUaWPerK;
      a.supplyG = toFreezerG;
      a.supplyC = supplyC;
      a.otherG = p.coilNaturalWPerK + ductG / 2;
      a.otherC = (p.coilNaturalWPerK * this.coilC + (ductG / 2) * this.fresh.airC) / a.otherG;
      a.heatW = (s.heaterOn ? HEATER_SHARE_TO_AIR * p.defrostHeaterW * s.heaterFactor : 0) + (fanG > 0 ? FAN_HEAT_W : 0);
      this.freezer.step(dtS, s.roomC, a, both ? p.partitionUaWPerK : 0, this.fresh.shellC);
    }
    this.growFrost(dtS, s);
    this.fresh.eatGroceries(dtS / GROCERY_EATEN_TAU_S);
    this.freezer.eatGroceries(dtS / GROCERY_EATEN_TAU_S);
  }

  /** Updates the coil and its frost; returns the temperature of the air leaving the coil. */
  private stepCoil(
    dtS: number,
    s: StepInputs,
    throughG: number,
    effectiveness: number,
    mixC: number,
    coilAirC: number,
    ductHalfG: number,
  ): number {
    const p = this.p;
    const airG = throughG * effectiveness;
    const compressorG = this.compressorConductance(s);
    const naturalG = p.coilNaturalWPerK;
    const heaterW = s.heaterOn ? (1 - HEATER_SHARE_TO_AIR) * p.defrostHeaterW * s.heaterFactor : 0;
    const capacityJPerK = COIL_METAL_J_PER_K + this.iceKg * ICE_J_PER_KG_K;
    const sumG = airG + compressorG + naturalG + ductHalfG;
    const sumGTQ = airG * mixC + compressorG * COMPRESSOR_SINK_C + naturalG * coilAirC + ductHalfG * this.fresh.airC + heaterW;
    let coilC = relax(this.coilC, capacityJPerK, sumG, sumGTQ, dtS);
    if (coilC > 0 && this.iceKg > 0) {
      const meltKg = Math.min(this.iceKg, (coilC * capacityJPerK) / ICE_LATENT_J_PER_KG);
      this.iceKg -= meltKg;
      coilC -= (meltKg * ICE_LATENT_J_PER_KG) / capacityJPerK;
    }
    this.coilC = coilC;
    return mixC - effectiveness * (mixC - coilC);
  }

  private growFrost(dtS: number, s: StepInputs): void {
    const perDayKg = this.p.iceGrowthKgPerDay + SEAL_FROST_KG_PER_DAY * s.sealLeak;
    const doorKg = DOOR_FROST_KG_PER_OPEN_S * (s.freshDoorOpenS + s.freezerDoorOpenS);
    // Frost only settles on a coil below freezing.
    if (this.coilC < 0) this.iceKg += (perDayKg * dtS) / 86_400 + doorKg;
  }
}
