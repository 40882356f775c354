/**
 * The quantities the integrators evaluate at every depth, computed once per depth and lean (no
 * allocation beyond one object): specific energy with α, friction slope, specific force, and the
 * slope of the specific-energy curve dE/dy, which is the denominator of the gradually varied flow equation.
 *
 * The equation in its energy form dE/dx = S0 − Sf (Chow 1959, §9-1, eq. 9-8; Henderson 1966, §4.2) gives
 *   dy/dx = (S0 − Sf) / (dE/dy),   dE/dy = 1 − αQ²T/(gA³) + (Q²/2gA²)·dα/dy.
 * With α constant the last term vanishes and dE/dy = 1 − F². Where α varies with depth (a compound
 * section whose α comes from its subsection conveyances, Chow 1959 §6-4), dα/dy is kept: the standard
 * and direct steps balance E including α(y), so the ODE must use the same E.
 */
import { alphaDerivativeStep } from '../core/tolerances.js';
import { conveyanceAndAlpha, conveyanceSlopesInto, type HydraulicSection, SlopeSlot } from '../hydraulics/hydraulicSection.js';

const slopeScratch = new Float64Array(6);

export interface PointState {
  readonly depth: number;
  readonly area: number;
  readonly topWidth: number;
  readonly conveyance: number;
  readonly alpha: number;
  /** αV²/2g */
  readonly velocityHead: number;
  /** y + αV²/2g */
  readonly energy: number;
  /** (Q/K)² */
  readonly frictionSlope: number;
  /** Q²/(gA) + Aȳ */
  readonly force: number;
  /** dE/dy: positive on the subcritical branch, negative on the supercritical branch, 0 at critical depth */
  readonly dEdy: number;
  /** dK/dy from the subsections' perimeter rates; NaN where the section has no analytic form for it */
  readonly conveyanceSlope: number;
}

/** True when α varies with depth in this section (compound section, α from subsections). */
export function alphaVaries(hs: HydraulicSection): boolean {
  return hs.alpha === undefined && hs.section.compound;
}

function alphaAt(hs: HydraulicSection, y: number, discharge: number): number {
  return conveyanceAndAlpha(hs, y, discharge).alpha;
}

/**
 * A state as the integrators use it. dE/dy is worked out on first read: with α varying it costs two more
 * conveyance evaluations (the numerical dα/dy), and the root finders of the standard step, which evaluate
 * most states, never read it.
 */
class State implements PointState {
  #dEdy = NaN;
  /** dK/dy, NaN until worked out (with dα/dy, in one evaluation where the section reports perimeter rates) */
  #conveyanceSlope = NaN;
  #slopesTried = false;
  constructor(
    private readonly hs: HydraulicSection,
    private readonly discharge: number,
    readonly depth: number,
    readonly area: number,
    readonly topWidth: number,
    readonly conveyance: number,
    readonly alpha: number,
    readonly velocityHead: number,
    readonly energy: number,
    readonly frictionSlope: number,
    readonly force: number,
  ) {}
  get dEdy(): number {
    if (Number.isNaN(this.#dEdy)) {
      const g = this.hs.units.g;
      const q2 = this.discharge * this.discharge;
      const a = this.area;
      let dEdy = 1 - (this.alpha * q2 * this.topWidth) / (g * a * a * a);
      if (alphaVaries(this.hs)) {
        // dα/dy from the perimeter rates (dK/dy comes with it), else by differencing
        const alphaSlope = this.#slopes() ? slopeScratch[SlopeSlot.alphaSlope]! : alphaSlopeByDifference(this.hs, this.depth, this.discharge);
        dEdy += (q2 / (2 * g * a * a)) * alphaSlope;
      }
      this.#dEdy = dEdy;
    }
    return this.#dEdy;
  }
  get conveyanceSlope(): number {
    if (!this.#slopesTried) this.#slopes();
    return this.#conveyanceSlope;
  }
  /** the analytic slopes at this depth into slopeScratch, keeping dK/dy; false where there are none */
  #slopes(): boolean {
    this.#slopesTried = true;
    if (!conveyanceSlopesInto(this.hs, this.depth, slopeScratch)) return false;
    this.#conveyanceSlope = slopeScratch[SlopeSlot.conveyanceSlope]!;
    return true;
  }
}

/**
 * dα/dy at depth y by a central difference kept inside the section, where the perimeter rates give no analytic form
 * (Darcy–Weisbach, whose α depends on the discharge, or a section that reports no rates; State.dEdy tries those first).
 */
function alphaSlopeByDifference(hs: HydraulicSection, y: number, discharge: number): number {
  const h = alphaDerivativeStep * Math.max(y, hs.section.lengthScale);
  const up = Math.min(y + h, hs.section.maxDepth);
  const down = Math.max(y - h, 0.5 * y);
  return (alphaAt(hs, up, discharge) - alphaAt(hs, down, discharge)) / (up - down);
}

/**
 * A state to be evaluated again and again in place, for the trial depths of a root search: the same values as
 * pointState, without a new object (and its boxed numbers) per trial; `fixed()` turns the one kept into a state.
 * Its dE/dy is that of the state it would become (worked out on each read).
 */
export class TrialState implements PointState {
  depth = NaN;
  area = NaN;
  topWidth = NaN;
  conveyance = NaN;
  alpha = NaN;
  velocityHead = NaN;
  energy = NaN;
  frictionSlope = NaN;
  force = NaN;
  constructor(
    private hs: HydraulicSection,
    private discharge: number,
  ) {}
  /** the same object, for another section or discharge */
  use(hs: HydraulicSection, discharge: number): this {
    this.hs = hs;
    this.discharge = discharge;
    return this;
  }
  /** the state at depth y, as pointState gives it (0 < y ≤ maxDepth) */
  at(y: number): this {
    const hs = this.hs;
    const e = hs.section.elements(y);
    const k = conveyanceAndAlpha(hs, y, this.discharge);
    const g = hs.units.g;
    const q2 = this.discharge * this.discharge;
    const a = e.area;
    this.depth = y;
    this.area = a;
    this.topWidth = e.topWidth;
    this.conveyance = k.conveyance;
    this.alpha = k.alpha;
    this.velocityHead = (k.alpha * q2) / (2 * g * a * a);
    this.energy = y + this.velocityHead;
    this.frictionSlope = k.conveyance > 0 ? q2 / (k.conveyance * k.conveyance) : Infinity;
    this.force = q2 / (g * a) + e.firstMoment;
    return this;
  }
  /** the current trial as a state of its own (no evaluation) */
  fixed(): PointState {
    return new State(this.hs, this.discharge, this.depth, this.area, this.topWidth, this.conveyance, this.alpha, this.velocityHead, this.energy, this.frictionSlope, this.force);
  }
  get dEdy(): number {
    return this.fixed().dEdy;
  }
  get conveyanceSlope(): number {
    return this.fixed().conveyanceSlope;
  }
}

/** pointState's working object (the values are worked out in it, then fixed into a state of their own) */
let shared: TrialState | undefined;

/** The state at depth y (0 < y ≤ maxDepth; the caller keeps y inside the section). */
export function pointState(hs: HydraulicSection, y: number, discharge: number): PointState {
  shared ??= new TrialState(hs, discharge);
  return shared.use(hs, discharge).at(y).fixed();
}

/** dy/dx of the gradually varied flow equation at a state, with dE/dy floored in magnitude (keeps it finite). */
export function depthGradient(state: PointState, slope: number, floor = 0): number {
  let d = state.dEdy;
  if (Math.abs(d) < floor) d = d < 0 ? -floor : floor;
  return (slope - state.frictionSlope) / d;
}
