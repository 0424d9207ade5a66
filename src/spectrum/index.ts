// Public face of the spectrum module: exact masses and isotope patterns, the mass-axis fit, measured scans and
// the verdict fit of one peak against the engine's ideal peak.
export { parseFormula, formatFormula, monoisotopicMass, ionMz, massToMz, ELECTRON_MASS_U, KNOWN_ELEMENTS, MAX_ATOMS } from './formula';
export { isotopePattern, isotopeRatioM1, type IsotopePeak } from './isotopes';
export { fitMassAxis, type MassAxisFit, type MassAxisPoint } from './massAxis';
export { readScan, findPeaks, baselineAndNoise, smoothScan, type Scan, type ScanPeak, type FindPeaksOptions } from './scan';
export {
  fitPeak,
  PEAK_SHAPE_TREE_ID,
  type PeakFitRequest,
  type PeakFitResult,
  type PeakFitInstrument,
  type PeakVerdict,
  type FittedValue,
  type Finding,
} from './peakFit';
export { DEMO_SCAN_TEXT, DEMO_SCAN_INFO } from './demoScan';
