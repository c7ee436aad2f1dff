/** Applied lab calibrations and the model's adjustable parameters, as the evaluation core reads them. */
export * from './calibrations';
