/** Surveyed reaches: survey files → engine nodes, interpolation by step halving, the user's stationing. */
export { loadChannelSurvey, computeChannelFlow, type ChannelSurvey, type ChannelFlow, type SurveyOptions } from './channel.js';
export { readSurveyFiles, fileLabel, type SurveyFiles, type SurveyFileOptions } from './files.js';
export { surveySites, type SurveySite } from './sites.js';
export { refineSurvey, densify, type Refinement } from './interpolate.js';
export { toUserStation, toEngineStation, mapFlowStations, mapStationText, type StationMap } from './stationing.js';
