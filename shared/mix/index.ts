/**
 * The mix engine: pure computations for mixing, coverage, VOC, candy coats, colour difference and
 * layer timing. Other code imports only from here.
 */
export { MixError } from "./errors";
export {
  VOLUME_UNIT_IDS,
  MASS_UNIT_IDS,
  VOLUME_UNITS,
  MASS_UNITS,
  ML_PER_GALLON,
  G_PER_LB,
  UM_PER_MIL,
  M2_PER_FT2,
  isVolumeUnit,
  isMassUnit,
  convertVolume,
  convertMass,
} from "./units";
export type { VolumeUnit, MassUnit, UnitOption } from "./units";
export { resolveShares, mixForTotal, mixFromComponent } from "./mix";
export type { MixComponent, PartsComponent, PercentComponent, ComponentShare, MixLine } from "./mix";
export { weighingPlan, DEFAULT_SCALE_STEP_G } from "./weighing";
export type { ScaleTarget, WeighingPlan } from "./weighing";
export { roundForMeasuring, DEFAULT_RATIO_TOLERANCE_PCT } from "./rounding";
export type { MeasuringUnit, RoundedLine, MeasuringResult, RoundingOptions } from "./rounding";
export {
  M2_PER_L_AT_1_UM,
  FT2_PER_GAL_AT_1_MIL,
  spreadingRate,
  wetFilmFromDry,
  dryFilmFromWet,
  mixVolumeSolids,
  volumeNeeded,
} from "./coverage";
export type { FilmUnit, AreaUnit, SpreadingRateUnit, SpreadingRateInput, VolumeNeededInput } from "./coverage";
export {
  G_PER_L_PER_LB_PER_GAL,
  lbPerGalToGPerL,
  gPerLToLbPerGal,
  mixVoc,
  mixVocActual,
  regulatoryVoc,
  actualVoc,
  multiStageVoc,
} from "./voc";
export type { VocItem, CoatingContent } from "./voc";
export { tonerFraction, equivalentCoats, equivalentCoatsByFraction, tonerFractionOfMix } from "./candy";
export type { LetDown } from "./candy";
export { deltaE2000, deltaE76 } from "./color-difference";
export type { Lab, DeltaE2000Weights } from "./color-difference";
export { potLifeEnds, layerTimeline } from "./timeline";
export type { LayerPlan, CoatSlot, LayerTimeline } from "./timeline";
export { computeMix } from "./compute";
export type { MixRequest, MixResult } from "./compute";
