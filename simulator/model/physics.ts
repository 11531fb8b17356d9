/**
 * Lumped thermal network of a refrigerator/freezer, integrated with an exact exponential
 * update per node (each node relaxes toward the conductance-weighted mean of its neighbours
 * and sources over the step, neighbours held for the step, Gauss–Seidel order). The update is
 * stable for any step, so a 20 s step can carry air nodes with time constants of minutes and
 * a coil of about a minute without blowing up; it allocates nothing.
 *
 * Nodes: fresh-food air (fa), fresh-food contents (fc), freezer air (za), freezer contents
 * (zc), evaporator coil (coil, with its frost). Heat paths:
 * - walls and gasket to the room: 25 % into the air node, 75 % into the contents node (the
 *   liner is part of the contents); the partition joins the two contents nodes;
 * - the fan stream (mass flow × cp) passes the coil with effectiveness 0.85 (less when frosted)
 *   and is split between the freezer and, through the damper, the fresh-food section;
 * - the compressor is a conductance to a −45 °C sink sized so that it lifts `capacity` watts at
 *   a −25 °C coil (capacity rises with coil temperature, falls with room temperature about
 *   1.2 %/K, common practice for small hermetic compressors, from memory);
 * - natural convection from the coil to its compartment and through the ducts when no fan runs;
 * - the defrost heater warms the coil (15 % straight into the freezer air by radiation), frost
 *   melts at 0 °C with 334 kJ/kg (latent heat of fusion of ice, standard physical constant).
 * Frost chokes the fresh-food duct first (from 0.8 kg, nearly shut at 2 kg), the freezer path
 * later (1.5–3.5 kg); the figures are chosen so a dead heater shows in 1–4 days (common practice).
 */
import type { ApplianceProfile } from './types';

const WALL_SHARE_TO_AIR = 0.25;
const COIL_METAL_J_PER_K = 1800;
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

/** 0 below `start`, 1 above `full`, smooth in between. */
function smoothStep(value: number, start: number, full: number): number {
  if (value <= start) return 0;
  if (value >= full) return 1;
  const x = (value - start) / (full - start);
  return x * x * (3 - 2 * x);
}

function relax(tempC: number, capacityJPerK: number, sumG: number, sumGTQ: number, dtS: number): number {
  const equilibriumC = sumGTQ / sumG;
  return equilibriumC + (tempC - equilibriumC) * Math.exp((-dtS * sumG) / capacityJPerK);
}

export class Cabinet {
  freshAirC: number;
  freshContentsC: number;
  freezerAirC: number;
  freezerContentsC: number;
  coilC: number;
  iceKg = 0;
  freshExtraJPerK = 0;
  freezerExtraJPerK = 0;
  private readonly hasFresh: boolean;
  private readonly hasFreezer: boolean;

  constructor(
    private readonly p: ApplianceProfile,
    hasFresh: boolean,
    hasFreezer: boolean,
  ) {
    this.hasFresh = hasFresh;
    this.hasFreezer = hasFreezer;
    this.freshAirC = this.freshContentsC = p.freshFoodSetpointC;
    this.freezerAirC = this.freezerContentsC = p.freezerSetpointC;
    this.coilC = (hasFreezer ? p.freezerSetpointC : p.freshFoodSetpointC) - 3;
  }

  /** Share of the fan stream reaching the fresh-food section, before frost. */
  private freshShare(s: StepInputs): number {
    if (!this.hasFresh) return 0;
    if (!this.hasFreezer) return 1;
    const open = s.damperOpen ? 1 - s.damperClosed : 0;
    return this.p.damperLeakShare + (this.p.freshFoodAirShare - this.p.damperLeakShare) * open;
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
    const freshBlock = 1 - 0.97 * smoothStep(this.iceKg, 0.8, 2.0);
    const freezerBlock = 1 - 0.85 * smoothStep(this.iceKg, 1.5, 3.5);
    const effectiveness = COIL_EFFECTIVENESS_CLEAN * (1 - 0.4 * smoothStep(this.iceKg, 0.5, 3.5));
    const fanG = p.hasEvaporatorFan && s.fanRunning ? p.evaporatorAirflowWPerK * s.fanAirflowFactor : 0;
    const toFreshG = fanG * this.freshShare(s) * freshBlock;
    const toFreezerG = this.hasFreezer ? fanG * (this.hasFresh ? 1 - p.freshFoodAirShare : 1) * freezerBlock : 0;
    const throughG = toFreshG + toFreezerG;
    const mixC = throughG > 0 ? (toFreshG * this.freshAirC + toFreezerG * this.freezerAirC) / throughG : 0;
    const coilAirC = this.hasFreezer ? this.freezerAirC : this.freshAirC;
    const ductG = this.hasFresh && this.hasFreezer ? p.ductNaturalWPerK * freshBlock * (1 - 0.9 * s.damperClosed) : 0;
    const supplyC = this.stepCoil(dtS, s, throughG, effectiveness, mixC, coilAirC);
    const leakFresh = s.sealLeak * p.freshFoodUaWPerK;
    const leakFreezer = s.sealLeak * p.freezerUaWPerK;
    const doorFactor = 1 + s.sealLeak;
    if (this.hasFresh) {
      const doorG = (p.freshFoodDoorExchangeWPerK * doorFactor * s.freshDoorOpenS) / dtS;
      const coilG = this.hasFreezer ? 0 : p.coilNaturalWPerK;
      this.stepFresh(dtS, s.roomC, doorG + leakFresh, toFreshG, supplyC, ductG, coilG);
    }
    if (this.hasFreezer) {
      const doorG = (p.freezerDoorExchangeWPerK * doorFactor * s.freezerDoorOpenS) / dtS;
      const heatW = (s.heaterOn ? HEATER_SHARE_TO_AIR * p.defrostHeaterW * s.heaterFactor : 0) + (fanG > 0 ? FAN_HEAT_W : 0);
      this.stepFreezer(dtS, s.roomC, doorG + leakFreezer, toFreezerG, supplyC, ductG, heatW);
    }
    this.growFrost(dtS, s);
    this.freshExtraJPerK *= 1 - dtS / GROCERY_EATEN_TAU_S;
    this.freezerExtraJPerK *= 1 - dtS / GROCERY_EATEN_TAU_S;
  }

  /** Updates the coil and its frost; returns the temperature of the air leaving the coil. */
  private stepCoil(dtS: number, s: StepInputs, throughG: number, effectiveness: number, mixC: number, coilAirC: number): number {
    const p = this.p;
    const airG = throughG * effectiveness;
    const compressorG = this.compressorConductance(s);
    const naturalG = p.coilNaturalWPerK;
    const heaterW = s.heaterOn ? (1 - HEATER_SHARE_TO_AIR) * p.defrostHeaterW * s.heaterFactor : 0;
    const capacityJPerK = COIL_METAL_J_PER_K + this.iceKg * ICE_J_PER_KG_K;
    const sumG = airG + compressorG + naturalG;
    const sumGTQ = airG * mixC + compressorG * COMPRESSOR_SINK_C + naturalG * coilAirC + heaterW;
    let coilC = relax(this.coilC, capacityJPerK, sumG, sumGTQ, dtS);
    if (coilC > 0 && this.iceKg > 0) {
      const meltKg = Math.min(this.iceKg, (coilC * capacityJPerK) / ICE_LATENT_J_PER_KG);
      this.iceKg -= meltKg;
      coilC -= (meltKg * ICE_LATENT_J_PER_KG) / capacityJPerK;
    }
    this.coilC = coilC;
    return mixC - effectiveness * (mixC - coilC);
  }

  private stepFresh(dtS: number, roomC: number, extraRoomG: number, supplyG: number, supplyC: number, ductG: number, coilG: number): void {
    const p = this.p;
    const wallAirG = WALL_SHARE_TO_AIR * p.freshFoodUaWPerK + extraRoomG;
    const contentsG = p.freshFoodAirToContentsWPerK;
    const sumG = wallAirG + contentsG + supplyG + ductG + coilG;
    const sumGT = wallAirG * roomC + contentsG * this.freshContentsC + supplyG * supplyC + ductG * this.freezerAirC + coilG * this.coilC;
    this.freshAirC = relax(this.freshAirC, p.freshFoodAirJPerK, sumG, sumGT, dtS);
    const wallG = (1 - WALL_SHARE_TO_AIR) * p.freshFoodUaWPerK;
    const partitionG = this.hasFreezer ? p.partitionUaWPerK : 0;
    const sumGc = wallG + contentsG + partitionG;
    const sumGTc = wallG * roomC + contentsG * this.freshAirC + partitionG * this.freezerContentsC;
    this.freshContentsC = relax(this.freshContentsC, p.freshFoodContentsJPerK + this.freshExtraJPerK, sumGc, sumGTc, dtS);
  }

  private stepFreezer(dtS: number, roomC: number, extraRoomG: number, supplyG: number, supplyC: number, ductG: number, heatW: number): void {
    const p = this.p;
    const wallAirG = WALL_SHARE_TO_AIR * p.freezerUaWPerK + extraRoomG;
    const contentsG = p.freezerAirToContentsWPerK;
    const coilG = p.coilNaturalWPerK;
    const sumG = wallAirG + contentsG + supplyG + ductG + coilG;
    const sumGT =
      wallAirG * roomC + contentsG * this.freezerContentsC + supplyG * supplyC + ductG * this.freshAirC + coilG * this.coilC + heatW;
    this.freezerAirC = relax(this.freezerAirC, p.freezerAirJPerK, sumG, sumGT, dtS);
    const wallG = (1 - WALL_SHARE_TO_AIR) * p.freezerUaWPerK;
    const partitionG = this.hasFresh ? p.partitionUaWPerK : 0;
    const sumGc = wallG + contentsG + partitionG;
    const sumGTc = wallG * roomC + contentsG * this.freezerAirC + partitionG * this.freshContentsC;
    this.freezerContentsC = relax(this.freezerContentsC, p.freezerContentsJPerK + this.freezerExtraJPerK, sumGc, sumGTc, dtS);
  }

  private growFrost(dtS: number, s: StepInputs): void {
    const perDayKg = this.p.iceGrowthKgPerDay + SEAL_FROST_KG_PER_DAY * s.sealLeak;
    const doorKg = DOOR_FROST_KG_PER_OPEN_S * (s.freshDoorOpenS + s.freezerDoorOpenS);
    // Frost only settles on a coil below freezing.
    if (this.coilC < 0) this.iceKg += (perDayKg * dtS) / 86_400 + doorKg;
  }

  /** Warm groceries mixed into a compartment's contents (energy-conserving). */
  addContents(toFreezer: boolean, capacityJPerK: number, tempC: number): void {
    if (toFreezer) {
      const total = this.p.freezerContentsJPerK + this.freezerExtraJPerK;
      this.freezerContentsC = (total * this.freezerContentsC + capacityJPerK * tempC) / (total + capacityJPerK);
      this.freezerExtraJPerK += capacityJPerK;
      return;
    }
    const total = this.p.freshFoodContentsJPerK + this.freshExtraJPerK;
    this.freshContentsC = (total * this.freshContentsC + capacityJPerK * tempC) / (total + capacityJPerK);
    this.freshExtraJPerK += capacityJPerK;
  }
}
