export { createFloatColumn, type FloatColumn, type FloatColumnView } from "./float-column.js";
export { quantileSorted, medianSorted, sortedCopy } from "./quantile.js";
export { tukeyFences, tukeyFencesSorted, outsideFences, type TukeyFences } from "./tukey.js";
export { madScores, MAD_CONSTANT, MEAN_AD_CONSTANT, type MadScale, type MadBasis } from "./mad.js";
export {
  findOutliers,
  DEFAULT_TUKEY_K,
  DEFAULT_MAD_THRESHOLD,
  type OutlierMethod,
  type Outlier,
  type OutlierReport,
} from "./outliers.js";
