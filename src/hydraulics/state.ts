/**
 * Every geometric and hydraulic element of the flow at one depth and discharge, computed once.
 * Definitions: Chow 1959, ch. 2–3 (R = A/P, D = A/T, E = y + αV²/2g, M = Q²/(gA) + Aȳ with β = 1,
 * F = √(αQ²T/(gA³))); friction slope Sf = (Q/K)² from Q = K·√Sf.
 * At the crown of a full conduit T = 0: hydraulic depth is Infinity there and the Froude number 0.
 */
import { hydraulicDepth, hydraulicRadius } from '../geometry/section.js';
import { conveyanceAndAlpha, type HydraulicSection } from './hydraulicSection.js';
import { requireDepth, requireDischarge } from './depthSearch.js';

export interface FlowState {
  depth: number;
  area: number;
  wettedPerimeter: number;
  topWidth: number;
  hydraulicRadius: number;
  hydraulicDepth: number;
  conveyance: number;
  alpha: number;
  velocity: number;
  /** αV²/2g */
  velocityHead: number;
  /** y + αV²/2g */
  specificEnergy: number;
  /** Q²/(gA) + Aȳ (momentum coefficient 1) */
  specificForce: number;
  /** √(αQ²T/(gA³)) */
  froude: number;
  /** (Q/K)² */
  frictionSlope: number;
}

export function flowState(hs: HydraulicSection, depth: number, discharge: number): FlowState {
  requireDischarge(discharge, 'flow state');
  const y = requireDepth(hs.section, depth, 'flow state');
  const e = hs.section.elements(y);
  const { conveyance, alpha } = conveyanceAndAlpha(hs, y, discharge);
  const g = hs.units.g;
  const velocity = discharge / e.area;
  const velocityHead = (alpha * velocity * velocity) / (2 * g);
  return {
    depth: y,
    area: e.area,
    wettedPerimeter: e.wettedPerimeter,
    topWidth: e.topWidth,
    hydraulicRadius: hydraulicRadius(e),
    hydraulicDepth: hydraulicDepth(e),
    conveyance,
    alpha,
    velocity,
    velocityHead,
    specificEnergy: y + velocityHead,
    specificForce: (discharge * discharge) / (g * e.area) + e.firstMoment,
    froude: Math.sqrt((alpha * discharge * discharge * e.topWidth) / (g * e.area * e.area * e.area)),
    frictionSlope: (discharge / conveyance) ** 2,
  };
}
