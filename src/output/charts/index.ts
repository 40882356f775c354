/** The chart builders: each returns a Vega-Lite spec (render it with ../render.js). */
export { profileChart, type ProfileChartOptions, type ProfileStructureMark } from './profileChart.js';
export { sectionChart, wettedStretches, type SectionChartInput, type SectionZone, type WettedStretch } from './sectionChart.js';
export { energyForceChart, type EnergyForceInput, type CurvePoint } from './energyForceChart.js';
export { ratingChart, ratingSeriesFromRun, type RatingChartInput, type RatingSeries, type RatingPoint } from './ratingChart.js';
