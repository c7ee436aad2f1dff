/** An input the thermal model cannot work with; the message says what was expected and what was found. */
export class ThermalModelError extends Error {
  override readonly name = 'ThermalModelError';
  /** Dotted path of the offending input, e.g. `components.2.process.solidKey`, when known. */
  readonly field: string | undefined;

  constructor(message: string, options: { field?: string } = {}) {
    super(message);
    this.field = options.field;
  }
}
