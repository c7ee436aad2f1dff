/** Lab logs: reading logger CSVs, measured against predicted, calibration and Monte Carlo confidence. */
export * from './parse-log';
export * from './overlay';
export * from './scenario';
export * from '../calibration/calibrations';
export * from './calibrate';
export * from './monte-carlo';
